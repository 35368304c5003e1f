import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { BenchRunsModule } from '../bench-runs/bench-runs.module';
import { CalibrationsModule } from '../calibrations/calibrations.module';
import { ProjectModel } from '../projects/project.model';
import { ProjectsModule } from '../projects/projects.module';
import { ReviewsModule } from '../reviews/reviews.module';
import { RevisionsModule } from '../revisions/revisions.module';
import { SimulationsModule } from '../simulations/simulations.module';
import { SpecSheetsController } from './spec-sheets.controller';
import { SpecSheetsService } from './spec-sheets.service';
import { TransformerSheetsController } from './transformer-sheets.controller';
import { TransformerSheetsService } from './transformer-sheets.service';

@Module({
  imports: [
    SequelizeModule.forFeature([ProjectModel]),
    ReviewsModule,
    BenchRunsModule,
    CalibrationsModule,
    ProjectsModule,
    RevisionsModule,
    SimulationsModule,
  ],
  controllers: [SpecSheetsController, TransformerSheetsController],
  providers: [SpecSheetsService, TransformerSheetsService],
})
export class SpecSheetsModule {}
