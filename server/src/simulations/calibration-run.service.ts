import { Injectable } from '@nestjs/common';
import {
  calibrateDesign,
  modelKindOf,
  type CalibrationDataset,
  type CalibrationResult,
  type DesignBatchPredictor,
} from '@ladderwright/shared/calibration';
import type { Design } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { CalibrationModel } from '../calibrations/calibration.model';
import { CalibrationEvaluationsService, ModelRunLostError } from './calibration-evaluations.service';
import { type PoolRun, SimulationPoolService } from './simulation-pool.service';
import { CALIBRATION_PREDICT, type SimulationTaskOutcome } from './simulation-task.types';

/**
 * Runs a calibration job on this instance: the Levenberg–Marquardt loop stays on the main thread (it only
 * solves a few-by-few system per step), and every model evaluation (the engine's estimate or a simulation of
 * the design with one set of parameter values) runs in a worker pool, so the Jacobian's columns of one step
 * run in parallel. A fit that runs the simulator queues its model runs on the PostgreSQL queue, so that every
 * app instance's pool takes part (`CalibrationEvaluationsService`); a fit of the engine's estimate alone
 * (milliseconds a run) uses this instance's pool directly. Cancel stops the loop before its next batch and
 * asks the runs in flight to stop at their next time step.
 */
@Injectable()
export class CalibrationRunService {
  constructor(
    private readonly pool: SimulationPoolService,
    private readonly evaluations: CalibrationEvaluationsService,
  ) {}

  run(jobId: string, document: Design, onProgress: (progressPct: number) => void): PoolRun {
    let isCancelled = false;
    const inFlight = new Set<PoolRun>();
    const outcome = this.fit(jobId, document, onProgress, inFlight, () => isCancelled);
    return {
      outcome,
      cancel: (graceMs) => {
        isCancelled = true;
        for (const task of inFlight) task.cancel(graceMs);
      },
    };
  }

  private async fit(
    jobId: string,
    document: Design,
    onProgress: (progressPct: number) => void,
    inFlight: Set<PoolRun>,
    isCancelled: () => boolean,
  ): Promise<SimulationTaskOutcome> {
    const calibration = await CalibrationModel.findOne({ where: { simulationJobId: jobId } });
    if (!calibration) {
      return { ok: false, error: { code: 'not_found', message: 'The calibration of this job is gone', field: null } };
    }
    const { parameters, datasets, confidence } = calibration.input;
    try {
      const usesSimulator = datasets.some((dataset) => modelKindOf(dataset.use) === 'simulator');
      const result: CalibrationResult = await calibrateDesign(
        { design: document, parameters, datasets, confidence },
        usesSimulator
          ? () => this.evaluations.predictor(calibration.id, isCancelled)
          : (prepared) => this.localPredictor(prepared, inFlight),
        {
          onProgress: (fraction) => onProgress(Math.floor(fraction * 99)),
          shouldCancel: isCancelled,
          // A simulator fit sends each step with the Jacobian's columns, and after a refused step a ladder of
          // p + 1 damping values (calibrateDesign's defaults for it): the path does not depend on how many
          // workers the instances have.
        },
      );
      await calibration.update({ result });
      return { ok: true, calibrated: true };
    } catch (error) {
      if (isDomainError(error))
        return { ok: false, error: { code: error.code, message: error.message, field: error.field } };
      if (error instanceof ModelRunLostError)
        return { ok: false, error: { code: error.code, message: error.message, field: null } };
      if (isCancelled()) return { ok: false, error: { code: 'cancelled', message: 'Cancelled', field: null } };
      throw error;
    }
  }

  /** Each design of a batch as a task of this instance's pool. */
  private localPredictor(prepared: readonly CalibrationDataset[], inFlight: Set<PoolRun>): DesignBatchPredictor {
    return (designs) =>
      Promise.all(
        designs.map(async (design) => {
          const task = this.pool.run(
            { kind: CALIBRATION_PREDICT, document: design, options: {}, datasets: [...prepared] },
            () => undefined,
          );
          inFlight.add(task);
          try {
            const answer = await task.outcome;
            if (!answer.ok) {
              if (answer.error.code === 'cancelled') throw Object.assign(new Error(answer.error.message), answer.error);
              return null;
            }
            return 'predictions' in answer ? answer.predictions : null;
          } finally {
            inFlight.delete(task);
          }
        }),
      );
  }
}
