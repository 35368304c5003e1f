import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { BenchRunsModule } from '../bench-runs/bench-runs.module';
import { ProjectModel } from '../projects/project.model';
import { ReviewsModule } from '../reviews/reviews.module';
import { SpecSheetsController } from './spec-sheets.controller';
import { SpecSheetsService } from './spec-sheets.service';

@Module({
  imports: [SequelizeModule.forFeature([ProjectModel]), ReviewsModule, BenchRunsModule],
  controllers: [SpecSheetsController],
  providers: [SpecSheetsService],
})
export class SpecSheetsModule {}
