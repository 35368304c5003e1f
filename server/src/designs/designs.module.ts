import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnalysisModule } from '../analysis/analysis.module';
import { ProjectsModule } from '../projects/projects.module';
import { RevisionsModule } from '../revisions/revisions.module';
import { DesignModel } from './design.model';
import { DesignsController } from './designs.controller';
import { DesignsService } from './designs.service';

@Module({
  imports: [SequelizeModule.forFeature([DesignModel]), RevisionsModule, AnalysisModule, ProjectsModule],
  controllers: [DesignsController],
  providers: [DesignsService],
})
export class DesignsModule {}
