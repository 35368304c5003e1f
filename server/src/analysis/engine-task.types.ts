import type { Design } from '@ladderwright/shared/designs';
import type { DomainErrorCode, FieldIssue } from '@ladderwright/shared/errors';
import type { ShelfPart } from '@ladderwright/shared/parts';

/** What the main thread hands an engine worker thread: one design to analyse, with its project's shelf. */
export interface EngineTask {
  kind: 'analyze';
  document: Design;
  shelf?: readonly ShelfPart[];
  /**
   * 'answer-bytes': the whole evaluate answer (engine version and report) comes back as the UTF-8 bytes of its JSON
   * text, which cross the thread boundary as one copy of bytes and go out as they are, with no large string on the
   * request thread.
   */
  reportAs?: 'object' | 'answer-bytes';
}

/** A no-op task that starts a thread, so its start-up is not charged to a request's budget. */
export interface EngineWarmUp {
  kind: 'warm-up';
}

/** A DomainError as it crosses the thread boundary (class instances do not). */
export interface EngineTaskFailure {
  code: DomainErrorCode;
  message: string;
  field: string | null;
  issues: FieldIssue[];
}

export type EngineTaskOutcome = { ok: true; report: unknown } | { ok: false; error: EngineTaskFailure };

/** Name of the task function the worker entry exports for the pool (`engineTaskEntry`). */
export const ENGINE_TASK_NAME = 'engineTaskEntry';
