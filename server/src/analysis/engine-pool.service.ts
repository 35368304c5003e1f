import { availableParallelism } from 'node:os';
import { Inject, Injectable, type OnModuleDestroy, ServiceUnavailableException } from '@nestjs/common';
import { Piscina } from 'piscina';
import { DomainError } from '@ladderwright/shared/errors';
import { workerEntry } from '../common/workers/worker-entry';
import { APP_ENV, type AppEnv } from '../config/env';
import { ENGINE_TASK_NAME, type EngineTask, type EngineTaskOutcome } from './engine-task.types';

/** piscina's refusals when its queue is full (the wording of versions 4 and 5). */
const QUEUE_FULL = /queue is full|queue is at limit|no task queue available/i;

/** A refusal by a full queue as 503 busy (the request may be sent again); any other error as it is. */
export function busyOr(error: unknown): unknown {
  if (error instanceof Error && QUEUE_FULL.test(error.message)) {
    return new ServiceUnavailableException('The engine is busy; try again shortly');
  }
  return error;
}

/**
 * The young generation of an engine thread's heap. An analysis leaves almost nothing alive, so a small one collects
 * as well as V8's default (up to 48 MB per thread, all of it resident once grown): measured over 1,600 analyses of
 * the demo templates, 6 MB keeps a thread about 20 MB smaller for about 5 % more of its CPU time.
 */
const ENGINE_YOUNG_GENERATION_MB = 6;

/**
 * The old generation of an engine thread's heap. Beside its ceiling, the cap sets how far V8 lets the heap grow between
 * full collections: under 256 MB it grows to about 1.3 times what was alive after the last one, where an uncapped
 * thread (V8 sizes it from the machine's memory) lets garbage pile up to four times that. A 400-cell ladder, the
 * largest the domain allows, keeps an engine thread's whole heap near 23 MB.
 */
export const ENGINE_OLD_GENERATION_MB = 128;

/** A thread stopped at its heap cap (`ENGINE_OLD_GENERATION_MB`), as node's worker reports it. */
function isOutOfMemory(error: unknown): boolean {
  return (error as { code?: unknown } | null)?.code === 'ERR_WORKER_OUT_OF_MEMORY';
}

/**
 * Engine threads for `requested` (`AppEnv.engineWorkers`) on a machine with `cores`: never more than the cores less
 * one, so that the request thread always keeps a core and answers every other request while the engine is busy.
 */
export function engineThreadCount(requested: number, cores: number = availableParallelism()): number {
  return Math.max(1, Math.min(requested, cores - 1));
}

/**
 * The piscina pool of engine worker threads (`AppEnv.engineWorkers`), apart from the simulation pool so
 * that a long simulation job never holds up a request. Each request's engine work gets
 * `AppEnv.engineBudgetMs` once a thread is ready; past it the thread is stopped (piscina starts another)
 * and the request is refused with `budget_exceeded`, naming the budget.
 */
@Injectable()
export class EnginePoolService implements OnModuleDestroy {
  private pool: Piscina | null = null;
  private ready: Promise<unknown> | null = null;

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  /** The worker's outcome for `task`, within the budget. */
  async run(task: EngineTask): Promise<EngineTaskOutcome> {
    const pool = this.ensurePool();
    // A thread's start-up (module loading) is not the request's engine work: wait for it first.
    try {
      await this.threadReady(pool);
    } catch (error) {
      throw busyOr(error);
    }
    const budgetMs = this.env.engineBudgetMs;
    const abort = new AbortController();
    const timer = setTimeout(() => abort.abort(), budgetMs);
    try {
      return (await pool.run(task, { name: ENGINE_TASK_NAME, signal: abort.signal })) as EngineTaskOutcome;
    } catch (error) {
      if (abort.signal.aborted) {
        this.ready = null;
        throw new DomainError(
          'budget_exceeded',
          `the engine needed more than this request's budget of ${budgetMs} ms; reduce the ladder or run a simulation job`,
          'document',
        );
      }
      if (isOutOfMemory(error)) {
        this.ready = null;
        throw new DomainError(
          'budget_exceeded',
          `the engine needed more than its ${ENGINE_OLD_GENERATION_MB} MB of memory for this document; reduce the ladder or run a simulation job`,
          'document',
        );
      }
      throw busyOr(error);
    } finally {
      clearTimeout(timer);
    }
  }

  /** The warm-up of the pool's thread; one that failed (say, refused by a full queue) is tried again next time. */
  private threadReady(pool: Piscina): Promise<unknown> {
    this.ready ??= pool.run({ kind: 'warm-up' }, { name: ENGINE_TASK_NAME }).catch((error: unknown) => {
      this.ready = null;
      throw error;
    });
    return this.ready;
  }

  async onModuleDestroy(): Promise<void> {
    const pool = this.pool;
    this.pool = null;
    this.ready = null;
    await pool?.destroy();
  }

  private ensurePool(): Piscina {
    if (this.pool) return this.pool;
    this.pool = new Piscina({
      ...workerEntry(__dirname, 'engine.worker'),
      name: ENGINE_TASK_NAME,
      minThreads: 1,
      maxThreads: engineThreadCount(this.env.engineWorkers),
      idleTimeout: 60_000,
      maxQueue: 'auto',
      resourceLimits: {
        maxYoungGenerationSizeMb: ENGINE_YOUNG_GENERATION_MB,
        maxOldGenerationSizeMb: ENGINE_OLD_GENERATION_MB,
      },
    });
    return this.pool;
  }
}
