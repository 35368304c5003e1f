import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { ProjectModel } from '../projects/project.model';
import { ReviewsModule } from '../reviews/reviews.module';
import { SpecSheetsController } from './spec-sheets.controller';
import { SpecSheetsService } from './spec-sheets.service';

@Module({
  imports: [SequelizeModule.forFeature([ProjectModel]), ReviewsModule],
  controllers: [SpecSheetsController],
  providers: [SpecSheetsService],
})
export class SpecSheetsModule {}
