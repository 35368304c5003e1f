import { Module } from '@nestjs/common';
import { AnalysisController } from './analysis.controller';
import { AnalysisService } from './analysis.service';
import { EnginePoolService } from './engine-pool.service';
import { ProjectAnalysisController } from './project-analysis.controller';
import { PartsModule } from '../parts/parts.module';

@Module({
  imports: [PartsModule],
  controllers: [AnalysisController, ProjectAnalysisController],
  providers: [AnalysisService, EnginePoolService],
  exports: [AnalysisService],
})
export class AnalysisModule {}
