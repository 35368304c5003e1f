import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import { lowerThisThreadPriority } from './thread-priority';

/** The nice value of the process's main thread: field 19 of its /proc stat line (proc(5)). */
const niceOfMainThread = (): number => Number(readFileSync('/proc/self/stat', 'utf8').split(') ')[1]?.split(' ')[16]);

const onLinux = existsSync('/proc/thread-self');

describe('lowerThisThreadPriority', () => {
  it('leaves the request thread as it is', () => {
    const before = onLinux ? niceOfMainThread() : 0;
    expect(lowerThisThreadPriority(5)).toBe(false);
    if (onLinux) expect(niceOfMainThread()).toBe(before);
  });

  (onLinux ? it : it.skip)('lowers a worker thread by the steps asked, and only that thread', async () => {
    const mainBefore = niceOfMainThread();
    // The fixture is TypeScript: the worker registers tsx's require hook, then loads it.
    const fixture = join(__dirname, '../../../test/fixtures/workers/lower-priority.worker.ts');
    const worker = new Worker(
      `require(${JSON.stringify(require.resolve('tsx/cjs'))}); require(${JSON.stringify(fixture)});`,
      { eval: true },
    );
    const answer = await new Promise<{ before: number; lowered: boolean; after: number }>((resolve, reject) => {
      worker.once('message', resolve);
      worker.once('error', reject);
    });
    await worker.terminate();
    expect(answer.lowered).toBe(true);
    expect(answer.after).toBe(Math.min(19, answer.before + 5));
    expect(niceOfMainThread()).toBe(mainBefore);
  });
});
