import { ServiceUnavailableException } from '@nestjs/common';
import { isDomainError } from '@ladderwright/shared/errors';
import type { AppEnv } from '../config/env';
import { busyOr, ENGINE_OLD_GENERATION_MB, EnginePoolService, engineThreadCount } from './engine-pool.service';

/** A pool whose queue is full: piscina 5 refuses every task with this error. */
function fullPool() {
  const calls: unknown[] = [];
  return {
    calls,
    run: (task: unknown) => {
      calls.push(task);
      return Promise.reject(new Error('Task queue is at limit'));
    },
  };
}

describe('EnginePoolService when its queue is full', () => {
  const env = { engineWorkers: 1, engineBudgetMs: 5_000 } as AppEnv;
  const task = { kind: 'analyze' as const, document: {} as never };

  it('answers 503 busy, not 500, and tries the thread warm-up again on the next request', async () => {
    const service = new EnginePoolService(env);
    const pool = fullPool();
    (service as unknown as { ensurePool: () => unknown }).ensurePool = () => pool;

    await expect(service.run(task)).rejects.toBeInstanceOf(ServiceUnavailableException);
    await expect(service.run(task)).rejects.toBeInstanceOf(ServiceUnavailableException);
    expect(pool.calls).toEqual([{ kind: 'warm-up' }, { kind: 'warm-up' }]);
  });

  it('maps both wordings of piscina and leaves other errors as they are', () => {
    expect(busyOr(new Error('Task queue is at limit'))).toBeInstanceOf(ServiceUnavailableException);
    expect(busyOr(new Error('No task queue available and all Workers are busy'))).toBeInstanceOf(
      ServiceUnavailableException,
    );
    const other = new Error('worker crashed');
    expect(busyOr(other)).toBe(other);
  });
});

describe('EnginePoolService when a thread reaches its heap cap', () => {
  const env = { engineWorkers: 1, engineBudgetMs: 5_000 } as AppEnv;

  it('refuses the document with 422 budget_exceeded naming the memory, not 500', async () => {
    const service = new EnginePoolService(env);
    // What piscina 5 rejects with when node stops a thread at its resourceLimits (checked by hand with a 16 MB cap).
    const outOfMemory = Object.assign(
      new Error('Worker terminated due to reaching memory limit: JS heap out of memory'),
      {
        code: 'ERR_WORKER_OUT_OF_MEMORY',
      },
    );
    const pool = {
      run: (task: { kind: string }) => (task.kind === 'warm-up' ? Promise.resolve(null) : Promise.reject(outOfMemory)),
    };
    (service as unknown as { ensurePool: () => unknown }).ensurePool = () => pool;

    const error: unknown = await service
      .run({ kind: 'analyze', document: {} as never })
      .catch((caught: unknown) => caught);
    expect(isDomainError(error)).toBe(true);
    expect(error).toMatchObject({ code: 'budget_exceeded', field: 'document' });
    expect((error as Error).message).toContain(`${ENGINE_OLD_GENERATION_MB} MB`);
  });
});

describe('engineThreadCount', () => {
  it('leaves the request thread a core and runs at least one engine thread', () => {
    expect(engineThreadCount(8, 2)).toBe(1);
    expect(engineThreadCount(8, 4)).toBe(3);
    expect(engineThreadCount(2, 16)).toBe(2);
    expect(engineThreadCount(4, 1)).toBe(1);
  });
});
