import { readlinkSync } from 'node:fs';
import { getPriority, setPriority } from 'node:os';
import { isMainThread } from 'node:worker_threads';

/**
 * Lowers the calling worker thread's scheduling priority by `niceness` steps (at most to 19). On Linux a thread
 * is a task with its own nice value, named by `/proc/thread-self`; the request thread and the rest of the process
 * keep theirs, so when cores are short the kernel runs the request thread first and a long engine task waits.
 * Elsewhere, or when refused, the thread keeps the process's priority. Returns whether it was lowered.
 */
export function lowerThisThreadPriority(niceness: number): boolean {
  if (isMainThread || niceness <= 0) return false;
  try {
    const threadId = Number(readlinkSync('/proc/thread-self').split('/').pop());
    if (!Number.isSafeInteger(threadId) || threadId <= 0) return false;
    setPriority(threadId, Math.min(19, getPriority(threadId) + niceness));
    return true;
  } catch {
    return false;
  }
}
