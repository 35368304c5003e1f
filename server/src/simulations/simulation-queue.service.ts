import { Inject, Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import PgBoss from 'pg-boss';
import { APP_ENV, type AppEnv } from '../config/env';

export const SIMULATION_QUEUE = 'simulation-jobs';

/** The queue of a calibration's model runs (rows of `calibration_evaluations`), taken by every instance. */
export const CALIBRATION_EVALUATION_QUEUE = 'calibration-evaluations';

/** The payload of a model run: only the id; the run itself is our `calibration_evaluations` row. */
export interface CalibrationEvaluationPayload {
  evaluationId: string;
}

/** The pg-boss payload: only the id; the job itself is our `simulation_jobs` row. */
export interface SimulationQueuePayload {
  simulationJobId: string;
}

/** pg-boss expires a job this long after its run-time limit (ours ends it first). */
const EXPIRY_MARGIN_S = 60;
const POLLING_INTERVAL_SECONDS = 1;
/**
 * Another instance's model-run workers look for runs this often (pg-boss's shortest): a batch of a fit waits
 * for its slowest run, so a remote worker that comes late adds to every step.
 */
const EVALUATION_POLLING_INTERVAL_SECONDS = 0.5;
/** Workers try to start this many times, waiting 0.5 s, 1 s, 1.5 s … between tries (about 20 s in all). */
const WORKER_START_ATTEMPTS = 9;
const WORKER_START_RETRY_MS = 500;

/**
 * pg-boss in PostgreSQL owns the queue, so that several app instances share the work: each instance's
 * workers fetch with SKIP LOCKED, and a job is taken by exactly one of them. pg-boss creates and migrates
 * its own `pgboss` schema on start. Started on first use; when the database is down the start fails, is
 * logged, and is tried again on the next use.
 */
@Injectable()
export class SimulationQueueService implements OnModuleDestroy {
  private readonly logger = new Logger('SimulationQueue');
  private starting: Promise<PgBoss> | null = null;
  private readonly workerIds: string[] = [];
  private readonly evaluationWorkerIds: string[] = [];
  private isStopped = false;

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  /** Queues a job; returns the pg-boss job id. Higher `priority` is taken first. Wakes this instance's workers. */
  async send(payload: SimulationQueuePayload, priority = 0): Promise<string> {
    const boss = await this.boss();
    const id = await boss.send(SIMULATION_QUEUE, payload, {
      retryLimit: 1,
      expireInSeconds: this.expireInSeconds(),
      priority,
    });
    if (!id) throw new Error('pg-boss refused the simulation job');
    for (const workerId of this.workerIds) boss.notifyWorker(workerId);
    return id;
  }

  /** Queues model runs of a calibration; wakes this instance's model-run workers (others poll). */
  async sendEvaluations(payloads: readonly CalibrationEvaluationPayload[]): Promise<void> {
    const boss = await this.boss();
    for (const payload of payloads) {
      const id = await boss.send(CALIBRATION_EVALUATION_QUEUE, payload, {
        retryLimit: 0,
        expireInSeconds: this.expireInSeconds(),
      });
      if (!id) throw new Error('pg-boss refused the model run');
    }
    for (const workerId of this.evaluationWorkerIds) boss.notifyWorker(workerId);
  }

  /** Subscribes `concurrency` model-run workers, each taking one run at a time. */
  async workEvaluations(
    concurrency: number,
    handler: (payload: CalibrationEvaluationPayload) => Promise<void>,
  ): Promise<void> {
    await this.subscribe(
      CALIBRATION_EVALUATION_QUEUE,
      concurrency,
      EVALUATION_POLLING_INTERVAL_SECONDS,
      handler,
      this.evaluationWorkerIds,
    );
  }

  /** Withdraws a job that no worker has taken yet (a taken one is stopped through our table instead). */
  async cancel(queueJobId: string): Promise<void> {
    const boss = await this.boss();
    await boss.cancel(SIMULATION_QUEUE, queueJobId);
  }

  /** Subscribes `concurrency` workers, each taking one job at a time. */
  async work(concurrency: number, handler: (payload: SimulationQueuePayload) => Promise<void>): Promise<void> {
    await this.subscribe(SIMULATION_QUEUE, concurrency, POLLING_INTERVAL_SECONDS, handler, this.workerIds);
  }

  private async subscribe<T extends object>(
    queue: string,
    concurrency: number,
    pollingIntervalSeconds: number,
    handler: (payload: T) => Promise<void>,
    ids: string[],
  ): Promise<void> {
    const boss = await this.bossForWorkers();
    for (let i = 0; i < concurrency; i++) {
      const id = await boss.work<T>(queue, { batchSize: 1, pollingIntervalSeconds }, async (jobs) => {
        for (const job of jobs) await handler(job.data);
      });
      ids.push(id);
    }
  }

  /** Stops fetching, waits for the handlers in progress (they end quickly once their runs are aborted). */
  async onModuleDestroy(): Promise<void> {
    this.isStopped = true;
    const starting = this.starting;
    if (!starting) return;
    const boss = await starting.catch(() => null);
    await boss?.stop({ graceful: true, wait: true, timeout: 10_000 });
  }

  private expireInSeconds(): number {
    return this.env.simulationMaxRunS + EXPIRY_MARGIN_S;
  }

  /**
   * The started queue for subscribing workers, retried: instances started together on a new database race to
   * create pg-boss's schema and the loser's start fails once; without a retry that instance would never work.
   */
  private async bossForWorkers(): Promise<PgBoss> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.boss();
      } catch (error) {
        if (this.isStopped || attempt >= WORKER_START_ATTEMPTS) throw error;
        await new Promise((done) => setTimeout(done, WORKER_START_RETRY_MS * attempt));
      }
    }
  }

  private boss(): Promise<PgBoss> {
    if (this.isStopped) return Promise.reject(new Error('the simulation queue is stopped'));
    this.starting ??= this.startRetryingRace().catch((error: unknown) => {
      this.starting = null;
      throw error;
    });
    return this.starting;
  }

  /**
   * Starts the queue, trying twice more 0.2 s and 0.4 s later: the instance that loses the race to create
   * pg-boss's schema on a new database fails its first start (a request that queues a job would answer 500).
   */
  private async startRetryingRace(): Promise<PgBoss> {
    for (let attempt = 1; ; attempt++) {
      try {
        return await this.start();
      } catch (error) {
        if (this.isStopped || attempt >= 3) throw error;
        await new Promise((done) => setTimeout(done, 200 * attempt));
      }
    }
  }

  private async start(): Promise<PgBoss> {
    const boss = new PgBoss({
      connectionString: this.env.databaseUrl,
      max: 4,
      application_name: 'ladderwright-simulations',
    });
    boss.on('error', (error) => this.logger.error(`pg-boss: ${error.message}`));
    try {
      await boss.start();
      await boss.createQueue(SIMULATION_QUEUE, {
        name: SIMULATION_QUEUE,
        retryLimit: 1,
        expireInSeconds: this.expireInSeconds(),
      });
      await boss.createQueue(CALIBRATION_EVALUATION_QUEUE, {
        name: CALIBRATION_EVALUATION_QUEUE,
        retryLimit: 0,
        expireInSeconds: this.expireInSeconds(),
      });
    } catch (error) {
      await boss.stop({ graceful: false, wait: true }).catch(() => undefined);
      throw error;
    }
    return boss;
  }
}
