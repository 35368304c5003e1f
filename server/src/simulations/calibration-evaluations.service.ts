import { randomUUID } from 'node:crypto';
import { Inject, Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CalibrationDataset, DesignBatchPredictor } from '@ladderwright/shared/calibration';
import type { Design } from '@ladderwright/shared/designs';
import { DomainError } from '@ladderwright/shared/errors';
import { CalibrationModel } from '../calibrations/calibration.model';
import { APP_ENV, type AppEnv } from '../config/env';
import { type PoolRun, SimulationPoolService } from './simulation-pool.service';
import { type CalibrationEvaluationPayload, SimulationQueueService } from './simulation-queue.service';
import { CALIBRATION_PREDICT } from './simulation-task.types';

/** How often the instance running a fit looks for its model runs' answers. */
const ANSWER_POLL_MS = 100;
/** How often a model run writes its heartbeat and looks for the cancel of its calibration (made on any instance). */
const CANCEL_POLL_MS = 500;
/**
 * Heartbeats of SIMULATION_HEARTBEAT_MS a model run may miss before the fit gives it back to the queue (its
 * instance died), as a simulation job's.
 */
const MISSED_HEARTBEATS = 3;
/** Times one model run is given back before the calibration ends (instances dying one after another). */
const MAX_RUN_ATTEMPTS = 3;
/** A cancelled model run gets this long to stop at a time step before its worker thread is terminated. */
const CANCEL_GRACE_MS = 500;
/** Calibrations whose runs an instance keeps in memory for its model runs. */
const DATASET_CACHE_SIZE = 8;

/**
 * A model run whose instance stopped beating MAX_RUN_ATTEMPTS times: the calibration ends (as a simulation
 * whose instance died, `interrupted`) rather than wait for its time limit.
 */
export class ModelRunLostError extends Error {
  readonly code = 'interrupted';
}

interface EvaluationRow {
  id: string;
  status: 'queued' | 'running' | 'done' | 'failed' | 'cancelled';
  predictions: number[][] | null;
  error_message: string | null;
}

/**
 * A calibration's model runs spread over every app instance: the fit's batch (the Jacobian's columns, the
 * central differences at the end) becomes rows of `calibration_evaluations`, each queued on the
 * PostgreSQL queue (pg-boss, `calibration-evaluations`); every instance with simulation workers takes them
 * into its own worker pool, as many at once as it has workers, and writes the answers back. The instance
 * running the fit waits for the batch's answers and then deletes its rows.
 */
@Injectable()
export class CalibrationEvaluationsService implements OnApplicationBootstrap {
  private readonly logger = new Logger('CalibrationEvaluations');
  /** Names this instance in the rows it runs. */
  readonly instanceId = randomUUID();
  private readonly datasets = new Map<string, CalibrationDataset[]>();

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    private readonly queue: SimulationQueueService,
    private readonly pool: SimulationPoolService,
    private readonly sequelize: Sequelize,
  ) {}

  onApplicationBootstrap(): void {
    if (this.env.simulationWorkers === 0) return;
    this.queue
      .workEvaluations(this.env.simulationWorkers, (payload) => this.execute(payload))
      .catch((error: unknown) => {
        this.logger.warn(`model-run workers not started: ${error instanceof Error ? error.message : String(error)}`);
      });
  }

  /**
   * A predictor whose batches run as queued model runs of `calibrationId`. `isCancelled` is polled while it
   * waits; a cancel marks the batch's open runs cancelled (their instances stop them) and throws.
   */
  predictor(calibrationId: string, isCancelled: () => boolean): DesignBatchPredictor {
    return async (designs: Design[]) => {
      const ids = await this.insert(calibrationId, designs);
      try {
        await this.queue.sendEvaluations(ids.map((evaluationId) => ({ evaluationId })));
        const rows = await this.waitForAnswers(ids, isCancelled);
        return ids.map((id) => {
          const row = rows.get(id);
          if (row?.status === 'failed') {
            // Failed as the runner fails a job whose worker died ('worker_failed').
            throw new Error(`a model run failed: ${row.error_message ?? 'no reason given'}`);
          }
          return row?.predictions ?? null;
        });
      } finally {
        await this.sequelize
          .query('DELETE FROM calibration_evaluations WHERE id IN (:ids)', { replacements: { ids } })
          .catch(() => undefined);
      }
    };
  }

  private async insert(calibrationId: string, designs: Design[]): Promise<string[]> {
    const rows = await this.sequelize.query<{ id: string }>(
      `INSERT INTO calibration_evaluations (calibration_id, document)
       SELECT :calibrationId, d FROM jsonb_array_elements(CAST(:documents AS jsonb)) WITH ORDINALITY AS t(d, n)
       ORDER BY n RETURNING id`,
      {
        replacements: { calibrationId, documents: JSON.stringify(designs) },
        type: QueryTypes.SELECT,
      },
    );
    return rows.map((row) => row.id);
  }

  private async waitForAnswers(ids: string[], isCancelled: () => boolean): Promise<Map<string, EvaluationRow>> {
    let nextLookForLost = Date.now() + this.env.simulationHeartbeatMs;
    for (;;) {
      if (isCancelled()) {
        await this.sequelize.query(
          `UPDATE calibration_evaluations SET status = 'cancelled', updated_at = now()
           WHERE id IN (:ids) AND status IN ('queued', 'running')`,
          { replacements: { ids } },
        );
        throw new DomainError('cancelled', 'The calibration was cancelled');
      }
      const rows = await this.sequelize.query<EvaluationRow>(
        `SELECT id, status, predictions, error_message FROM calibration_evaluations WHERE id IN (:ids)`,
        { replacements: { ids }, type: QueryTypes.SELECT },
      );
      if (rows.length < ids.length) throw new DomainError('cancelled', 'The model runs of the calibration are gone');
      if (rows.every((row) => row.status !== 'queued' && row.status !== 'running')) {
        return new Map(rows.map((row) => [row.id, row]));
      }
      if (Date.now() >= nextLookForLost) {
        nextLookForLost = Date.now() + this.env.simulationHeartbeatMs;
        await this.giveBackLost(ids);
      }
      await new Promise((done) => setTimeout(done, ANSWER_POLL_MS));
    }
  }

  /**
   * Gives back to the queue the model runs of `ids` whose instance stopped beating (it died mid-run), and
   * queues again the ones still waiting after as long (their queue job may have been taken by an instance that
   * died before it claimed the run; a second job for a run is harmless, only one claim succeeds). A run lost
   * MAX_RUN_ATTEMPTS times ends the calibration.
   */
  private async giveBackLost(ids: string[]): Promise<void> {
    const staleS = (this.env.simulationHeartbeatMs * MISSED_HEARTBEATS) / 1000;
    const lost = await this.sequelize.query<{ id: string; attempts: number }>(
      `SELECT id, attempts FROM calibration_evaluations
       WHERE id IN (:ids) AND status = 'running'
         AND coalesce(heartbeat_at, updated_at) < now() - make_interval(secs => :staleS)`,
      { replacements: { ids, staleS }, type: QueryTypes.SELECT },
    );
    if (lost.some((row) => row.attempts + 1 >= MAX_RUN_ATTEMPTS)) {
      throw new ModelRunLostError(
        `A model run of the calibration was lost ${MAX_RUN_ATTEMPTS} times with the app instance that ran it (no heartbeat for ${staleS} s); start the calibration again`,
      );
    }
    const given = lost.length
      ? await this.sequelize.query<{ id: string }>(
          `UPDATE calibration_evaluations
       SET status = 'queued', instance_id = NULL, heartbeat_at = NULL, attempts = attempts + 1, updated_at = now()
       WHERE status = 'running' AND id IN (:lost)
         AND coalesce(heartbeat_at, updated_at) < now() - make_interval(secs => :staleS)
       RETURNING id`,
          { replacements: { lost: lost.map((row) => row.id), staleS }, type: QueryTypes.SELECT },
        )
      : [];
    const waiting = await this.sequelize.query<{ id: string }>(
      `UPDATE calibration_evaluations SET updated_at = now()
       WHERE id IN (:ids) AND status = 'queued' AND updated_at < now() - make_interval(secs => :staleS)
       RETURNING id`,
      { replacements: { ids, staleS }, type: QueryTypes.SELECT },
    );
    const again = [...given, ...waiting].map((row) => ({ evaluationId: row.id }));
    if (given.length > 0) this.logger.warn(`gave back ${given.length} model run(s) whose instance stopped beating`);
    if (again.length > 0) await this.queue.sendEvaluations(again);
  }

  /** Takes one queued model run: claims it, runs it in this instance's pool, writes the answer. */
  private async execute({ evaluationId: id }: CalibrationEvaluationPayload): Promise<void> {
    const claimed = await this.sequelize.query<{ calibration_id: string; document: Design }>(
      `UPDATE calibration_evaluations
       SET status = 'running', instance_id = :instance, heartbeat_at = now(), updated_at = now()
       WHERE id = :id AND status = 'queued' RETURNING calibration_id, document`,
      { replacements: { id, instance: this.instanceId }, type: QueryTypes.SELECT },
    );
    const row = claimed[0];
    if (!row) return; // cancelled, or its batch is over
    const datasets = await this.datasetsOf(row.calibration_id);
    if (!datasets) {
      await this.finish(id, 'failed', null, 'The calibration of this model run is gone');
      return;
    }
    const run = this.pool.run(
      { kind: CALIBRATION_PREDICT, document: row.document, options: {}, datasets },
      () => undefined,
    );
    const cancelWatch = setInterval(
      () => void this.beat(id, run),
      Math.min(CANCEL_POLL_MS, this.env.simulationHeartbeatMs),
    );
    try {
      const answer = await run.outcome;
      if (answer.ok) await this.finish(id, 'done', 'predictions' in answer ? answer.predictions : null, null);
      else if (answer.error.code !== 'cancelled') await this.finish(id, 'done', null, answer.error.message);
    } catch (error) {
      // A thrown error or a dead worker thread: the fit cannot go on without this answer.
      await this.finish(id, 'failed', null, error instanceof Error ? error.message : String(error));
    } finally {
      clearInterval(cancelWatch);
    }
  }

  private async finish(
    id: string,
    status: 'done' | 'failed',
    predictions: number[][] | null,
    errorMessage: string | null,
  ): Promise<void> {
    await this.sequelize.query(
      `UPDATE calibration_evaluations
       SET status = :status, predictions = CAST(:predictions AS jsonb), error_message = :errorMessage, updated_at = now()
       WHERE id = :id AND status = 'running' AND instance_id = :instance`,
      {
        replacements: {
          id,
          status,
          predictions: predictions ? JSON.stringify(predictions) : null,
          errorMessage,
          instance: this.instanceId,
        },
      },
    );
  }

  /**
   * The run's heartbeat; a run no longer ours and running (cancelled, or given back after a missed beat) is
   * stopped.
   */
  private async beat(id: string, run: PoolRun): Promise<void> {
    try {
      const rows = await this.sequelize.query<{ id: string }>(
        `UPDATE calibration_evaluations SET heartbeat_at = now()
         WHERE id = :id AND status = 'running' AND instance_id = :instance RETURNING id`,
        { replacements: { id, instance: this.instanceId }, type: QueryTypes.SELECT },
      );
      if (rows.length === 0) run.cancel(CANCEL_GRACE_MS);
    } catch {
      // The next poll tries again.
    }
  }

  /** The runs a calibration fits (as stored with it), kept for the last few calibrations. */
  private async datasetsOf(calibrationId: string): Promise<CalibrationDataset[] | null> {
    const cached = this.datasets.get(calibrationId);
    if (cached) return cached;
    const calibration = await CalibrationModel.findByPk(calibrationId, { attributes: ['id', 'input'] });
    if (!calibration) return null;
    const datasets = calibration.input.datasets;
    if (this.datasets.size >= DATASET_CACHE_SIZE) this.datasets.delete(this.datasets.keys().next().value as string);
    this.datasets.set(calibrationId, datasets);
    return datasets;
  }
}
