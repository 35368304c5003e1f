import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';
import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnModuleDestroy } from '@nestjs/common';
import { Op } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import { APP_ENV, type AppEnv } from '../config/env';
import { CalibrationRunService } from './calibration-run.service';
import { SimulationBatchEndsService } from './simulation-batch-ends.service';
import { SimulationJobModel } from './simulation-job.model';
import { type PoolRun, SimulationPoolService } from './simulation-pool.service';
import { type SimulationQueuePayload, SimulationQueueService } from './simulation-queue.service';

/** Progress is written to the table in steps of this many percent (and at 100). */
const PROGRESS_STEP_PCT = 5;
/** How often a running job looks for a cancel made through another app instance. */
const CANCEL_POLL_MS = 500;
/** A cancelled run gets this long to stop at a time step before its worker thread is terminated. */
const CANCEL_GRACE_MS = 500;

interface ActiveRun {
  run: PoolRun;
  settled: Promise<void>;
}

/** Heartbeats a running job may miss before it counts as abandoned by a dead instance. */
const MISSED_HEARTBEATS = 3;

/**
 * The job-worker side of an app instance: takes jobs from the pg-boss queue, runs them in the piscina pool,
 * writes progress, result or error into `simulation_jobs`. Every write is guarded by `status = 'running'`,
 * so a cancel (status set to 'cancelled' by any instance) always wins over a late progress or result.
 * A running job writes a heartbeat every `SIMULATION_HEARTBEAT_MS` and is stopped after
 * `SIMULATION_MAX_RUN_S`. Every instance, at start-up and then every few heartbeats, ends as `interrupted`
 * the running jobs whose heartbeat stopped (their instance died): none stays "running" for ever.
 */
@Injectable()
export class SimulationRunnerService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('SimulationRunner');
  private readonly active = new Map<string, ActiveRun>();
  private isShuttingDown = false;
  private reconcileTimer: NodeJS.Timeout | null = null;
  /** This app instance, as written to `run_by` of the jobs it runs (host, process, and which app in the process). */
  private readonly instanceName = `${hostname()}:${process.pid}:${randomBytes(3).toString('hex')}`.slice(-200);

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    private readonly queue: SimulationQueueService,
    private readonly pool: SimulationPoolService,
    private readonly calibrations: CalibrationRunService,
    private readonly sequelize: Sequelize,
    private readonly batchEnds: SimulationBatchEndsService,
  ) {}

  onApplicationBootstrap(): void {
    const reconcile = () =>
      void this.reconcile().catch((error: unknown) => {
        this.logger.warn(`reconciling jobs failed: ${error instanceof Error ? error.message : String(error)}`);
      });
    reconcile();
    this.reconcileTimer = setInterval(reconcile, this.env.simulationHeartbeatMs * MISSED_HEARTBEATS);
    this.reconcileTimer.unref();
    if (this.env.simulationWorkers === 0) return;
    // Not awaited: the app serves requests (and reports degraded health) even while the database is down.
    this.queue
      .work(this.pool.threadCount, (payload) => this.execute(payload))
      .catch((error: unknown) => {
        this.logger.warn(`simulation workers not started: ${error instanceof Error ? error.message : String(error)}`);
      });
  }

  /** Stops a run of this instance at once (the cancel itself is already in the table). */
  cancelLocal(jobId: string): void {
    this.active.get(jobId)?.run.cancel(CANCEL_GRACE_MS);
  }

  /**
   * Ends as `interrupted` every running job whose heartbeat is older than three beats: its instance died
   * (a kill, a crash, a lost machine). Returns how many it ended.
   */
  async reconcile(): Promise<number> {
    const staleS = (this.env.simulationHeartbeatMs * MISSED_HEARTBEATS) / 1000;
    // A batch has no heartbeat of its own: it ends with its last member.
    const [rows] = await this.sequelize.query(
      `UPDATE simulation_jobs
       SET status = 'failed', error_code = 'interrupted', finished_at = now(), updated_at = now(),
           error_message = 'The server running this simulation stopped; start it again'
       WHERE status = 'running' AND kind <> 'batch'
         AND coalesce(heartbeat_at, started_at, updated_at) < now() - make_interval(secs => :staleS)
       RETURNING parent_job_id`,
      { replacements: { staleS } },
    );
    const ended = rows as { parent_job_id: string | null }[];
    if (ended.length > 0) this.logger.warn(`ended ${ended.length} simulation job(s) whose instance stopped`);
    // Batches whose members have all ended but that are still running (their last member's end was not counted).
    const [idle] = await this.sequelize.query(
      `SELECT batch.id AS parent_job_id FROM simulation_jobs batch
       WHERE batch.kind = 'batch' AND batch.status = 'running' AND NOT EXISTS (
         SELECT 1 FROM simulation_jobs member
         WHERE member.parent_job_id = batch.id AND member.status IN ('queued', 'running'))`,
    );
    const batchIds = [...ended, ...(idle as { parent_job_id: string }[])].map((row) => row.parent_job_id);
    for (const batchId of new Set(batchIds)) {
      if (batchId) await this.batchEnds.memberEnded(batchId);
    }
    return ended.length;
  }

  async onModuleDestroy(): Promise<void> {
    if (this.reconcileTimer) clearInterval(this.reconcileTimer);
    this.isShuttingDown = true;
    for (const { run } of this.active.values()) run.cancel(0);
    await Promise.all([...this.active.values()].map((entry) => entry.settled));
  }

  private async execute({ simulationJobId: id }: SimulationQueuePayload): Promise<void> {
    if (this.isShuttingDown) throw new Error('instance is stopping; the job is left to another instance');
    const [claimed, rows] = await SimulationJobModel.update(
      { status: 'running', progressPct: 0, startedAt: new Date(), heartbeatAt: new Date(), runBy: this.instanceName },
      { where: { id, status: { [Op.in]: ['queued', 'running'] }, kind: { [Op.ne]: 'batch' } }, returning: true },
    );
    const job = rows[0];
    // Cancelled before it started, or no longer exists; a batch row is never queued (the claim skips it).
    if (claimed === 0 || !job || job.kind === 'batch') return;
    let writtenPct = 0;
    let progressWrite = Promise.resolve();
    const onProgress = (progressPct: number): void => {
      if (progressPct < writtenPct + PROGRESS_STEP_PCT) return;
      writtenPct = progressPct;
      progressWrite = progressWrite.then(() => this.writeProgress(id, progressPct, run)).catch(() => undefined);
    };
    const kind = job.kind;
    const run: PoolRun =
      kind === 'calibration'
        ? this.calibrations.run(job.id, job.input.document, onProgress)
        : this.pool.run({ kind, document: job.input.document, options: job.input.options }, onProgress);
    const cancelWatch = setInterval(() => void this.checkCancelled(id, run), CANCEL_POLL_MS);
    const heartbeat = setInterval(() => void this.beat(id), this.env.simulationHeartbeatMs);
    const timeLimit = setTimeout(() => void this.stopOverTime(id, run), this.env.simulationMaxRunS * 1000);
    const batchId = job.parentJobId;
    const settled = this.finish(id, run).finally(async () => {
      clearInterval(cancelWatch);
      clearInterval(heartbeat);
      clearTimeout(timeLimit);
      await progressWrite;
      this.active.delete(id);
      if (batchId) await this.batchEnds.memberEnded(batchId).catch((error: unknown) => this.logBatchEndFailure(error));
    });
    this.active.set(id, { run, settled });
    await settled;
  }

  private logBatchEndFailure(error: unknown): void {
    // The batch still ends: the next reconcile (every three heartbeats) counts its members again.
    this.logger.warn(`ending a batch failed: ${error instanceof Error ? error.message : String(error)}`);
  }

  private async finish(id: string, run: PoolRun): Promise<void> {
    const running = { where: { id, status: 'running' as const } };
    try {
      const outcome = await run.outcome;
      if (outcome.ok) {
        const result = 'result' in outcome ? outcome.result : null;
        await SimulationJobModel.update(
          { status: 'succeeded', progressPct: 100, result, finishedAt: new Date() },
          running,
        );
      } else if (outcome.error.code !== 'cancelled') {
        await this.fail(id, outcome.error.code, outcome.error.message);
      }
    } catch (error) {
      const detail = error instanceof Error ? error.message : String(error);
      if (this.isShuttingDown) {
        await this.fail(id, 'interrupted', 'The server stopped during the run; start the simulation again');
      } else {
        // A thrown error or a dead worker thread: this job fails; piscina has already replaced the thread.
        this.logger.warn(`simulation ${id} failed in its worker: ${detail}`);
        await this.fail(id, 'worker_failed', `The simulation worker failed: ${detail}`);
      }
    }
  }

  private async fail(id: string, code: string, message: string): Promise<void> {
    await SimulationJobModel.update(
      { status: 'failed', errorCode: code, errorMessage: message, finishedAt: new Date() },
      { where: { id, status: 'running' } },
    );
  }

  private async writeProgress(id: string, progressPct: number, run: PoolRun): Promise<void> {
    const [count] = await SimulationJobModel.update({ progressPct }, { where: { id, status: 'running' } });
    if (count === 0) run.cancel(CANCEL_GRACE_MS);
  }

  private async beat(id: string): Promise<void> {
    await SimulationJobModel.update({ heartbeatAt: new Date() }, { where: { id, status: 'running' } }).catch(
      () => undefined,
    );
  }

  /** Fails the job first (so the cancelled outcome that follows writes nothing), then stops the run. */
  private async stopOverTime(id: string, run: PoolRun): Promise<void> {
    const limitS = this.env.simulationMaxRunS;
    await this.fail(
      id,
      'time_limit',
      `The simulation ran longer than ${limitS} s, the limit; give fewer cycles or steps per cycle`,
    ).catch(() => undefined);
    run.cancel(CANCEL_GRACE_MS);
  }

  private async checkCancelled(id: string, run: PoolRun): Promise<void> {
    try {
      const job = await SimulationJobModel.findByPk(id, { attributes: ['status'] });
      if (!job || job.status === 'cancelled') run.cancel(CANCEL_GRACE_MS);
    } catch {
      // The next poll tries again.
    }
  }
}
