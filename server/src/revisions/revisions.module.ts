import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnalysisModule } from '../analysis/analysis.module';
import { DesignModel } from '../designs/design.model';
import { PartsModule } from '../parts/parts.module';
import { RevisionLookupService } from './revision-lookup.service';
import { RevisionModel } from './revision.model';
import { RevisionsController } from './revisions.controller';
import { RevisionsService } from './revisions.service';

@Module({
  imports: [SequelizeModule.forFeature([DesignModel, RevisionModel]), AnalysisModule, PartsModule],
  controllers: [RevisionsController],
  providers: [RevisionsService, RevisionLookupService],
  exports: [RevisionsService, RevisionLookupService],
})
export class RevisionsModule {}
