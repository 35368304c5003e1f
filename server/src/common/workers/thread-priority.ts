import { readlinkSync } from 'node:fs';
import { setPriority } from 'node:os';

/**
 * Niceness of the engine and simulation threads: the request thread (niceness 0) gets the core first whenever both
 * want it, so requests keep their latency while long engine work runs; the work itself still has every idle cycle.
 */
export const WORKER_THREAD_NICENESS = 10;

/**
 * Lowers the calling thread's scheduling priority to `niceness`. On Linux each thread has its own nice value,
 * set through its thread id (`/proc/thread-self`); elsewhere, or where it is not permitted, the thread keeps the
 * process's priority.
 */
export function lowerThreadPriority(niceness: number = WORKER_THREAD_NICENESS): void {
  try {
    const threadId = Number(readlinkSync('/proc/thread-self').split('/').pop());
    if (Number.isInteger(threadId) && threadId > 0) setPriority(threadId, niceness);
  } catch {
    // Not Linux, or not permitted: the thread runs at the process's priority.
  }
}
