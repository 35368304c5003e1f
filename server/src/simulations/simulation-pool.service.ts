import { availableParallelism } from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Inject, Injectable, type OnModuleDestroy } from '@nestjs/common';
import { Piscina } from 'piscina';
import { workerEntry } from '../common/workers/worker-entry';
import { APP_ENV, type AppEnv } from '../config/env';
import {
  SIMULATION_TASK_NAME,
  type SimulationProgressMessage,
  type SimulationTask,
  type SimulationTaskOutcome,
} from './simulation-task.types';

export interface PoolRun {
  outcome: Promise<SimulationTaskOutcome>;
  /** Asks the task to stop at its next time step; after `graceMs` the worker thread is terminated. */
  cancel: (graceMs: number) => void;
}

/**
 * The piscina pool of simulation worker threads (`AppEnv.simulationWorkers` of them), created on first use.
 * A task that throws or whose thread dies rejects its own `outcome` only; piscina replaces the thread.
 */
@Injectable()
export class SimulationPoolService implements OnModuleDestroy {
  private pool: Piscina | null = null;

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  /**
   * The pool's threads: `AppEnv.simulationWorkers`, at most one per core (a simulation keeps its core busy; threads
   * past the cores would only time-slice and hold more memory). The queue takes as many jobs at once.
   */
  get threadCount(): number {
    return Math.min(this.env.simulationWorkers, availableParallelism());
  }

  run(task: Omit<SimulationTask, 'progressPort' | 'cancelFlag'>, onProgress: (progressPct: number) => void): PoolRun {
    const pool = this.ensurePool();
    const channel = new MessageChannel();
    channel.port1.on('message', (message: SimulationProgressMessage) => onProgress(message.progressPct));
    const cancelFlag = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
    const abort = new AbortController();
    const outcome = pool
      .run({ ...task, progressPort: channel.port2, cancelFlag } satisfies SimulationTask, {
        name: SIMULATION_TASK_NAME,
        signal: abort.signal,
        transferList: [channel.port2],
      })
      .then((value: unknown) => value as SimulationTaskOutcome)
      .finally(() => channel.port1.close());
    let abortTimer: NodeJS.Timeout | null = null;
    void outcome.catch(() => undefined).finally(() => abortTimer && clearTimeout(abortTimer));
    return {
      outcome,
      cancel: (graceMs) => {
        Atomics.store(cancelFlag, 0, 1);
        abortTimer ??= setTimeout(() => abort.abort(), graceMs);
      },
    };
  }

  async onModuleDestroy(): Promise<void> {
    const pool = this.pool;
    this.pool = null;
    await pool?.destroy();
  }

  private ensurePool(): Piscina {
    if (this.pool) return this.pool;
    const threads = Math.max(1, this.threadCount);
    this.pool = new Piscina({
      ...workerEntry(__dirname, 'simulation.worker'),
      name: SIMULATION_TASK_NAME,
      minThreads: 0,
      maxThreads: threads,
      idleTimeout: 60_000,
      maxQueue: 'auto',
    });
    return this.pool;
  }
}
