import { Module } from '@nestjs/common';
import { SequelizeModule } from '@nestjs/sequelize';
import { AnalysisModule } from '../analysis/analysis.module';
import { RevisionsModule } from '../revisions/revisions.module';
import { CalibrationEvaluationsService } from './calibration-evaluations.service';
import { CalibrationRunService } from './calibration-run.service';
import { CurrentSimulationController } from './current-simulation.controller';
import { CurrentSimulationService } from './current-simulation.service';
import { SimulationBatchEndsService } from './simulation-batch-ends.service';
import { SimulationBatchesController } from './simulation-batches.controller';
import { SimulationBatchesService } from './simulation-batches.service';
import { SimulationJobModel } from './simulation-job.model';
import { SimulationPoolService } from './simulation-pool.service';
import { SimulationQueueService } from './simulation-queue.service';
import { SimulationRunnerService } from './simulation-runner.service';
import { SimulationsController } from './simulations.controller';
import { SimulationsService } from './simulations.service';

/**
 * Simulation jobs and batches of them (sweeps, Monte Carlo): queued in PostgreSQL (pg-boss), run on the worker
 * threads (piscina) of every app instance, read by polling.
 */
@Module({
  imports: [SequelizeModule.forFeature([SimulationJobModel]), AnalysisModule, RevisionsModule],
  controllers: [SimulationsController, SimulationBatchesController, CurrentSimulationController],
  providers: [
    SimulationsService,
    SimulationQueueService,
    SimulationPoolService,
    SimulationRunnerService,
    CalibrationRunService,
    CalibrationEvaluationsService,
    CurrentSimulationService,
    SimulationBatchesService,
    SimulationBatchEndsService,
  ],
  exports: [SimulationsService, CurrentSimulationService],
})
export class SimulationsModule {}
