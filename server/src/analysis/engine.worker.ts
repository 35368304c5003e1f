import { analyzeDesign } from '@ladderwright/shared/analysis';
import { validateDesign } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { ENGINE_VERSION } from '@ladderwright/shared/multiplier';
import { analyzeWithShelf } from '@ladderwright/shared/parts';
import { packCheckRules } from '@ladderwright/shared/api';
import { move, transferableSymbol, valueSymbol } from 'piscina';
import type { EngineTask, EngineTaskOutcome, EngineWarmUp } from './engine-task.types';
import { lowerThreadPriority } from '../common/workers/thread-priority';

// Requests first: this thread yields the core to the request thread whenever both want it.
lowerThreadPriority();

/*
 * Worker-thread entry (piscina) of the engine: the steady-state analysis of one design runs here, off the
 * request thread. The document is validated again, so the limits of the domain hold for every document
 * that reaches the engine, including ones stored before a limit existed. The report is returned as is (the
 * structured clone of the thread boundary is the only copy) or, when the caller only sends it on, as the UTF-8
 * bytes of its JSON text in the API's form (each check rule's text once, `packCheckRules`; `engineTaskEntry`
 * hands their memory over to the request thread).
 */
export function runEngineTask(task: EngineTask | EngineWarmUp): EngineTaskOutcome {
  if (task.kind === 'warm-up') return { ok: true, report: null };
  try {
    const design = validateDesign(task.document);
    const report = task.shelf ? analyzeWithShelf(design, task.shelf) : analyzeDesign(design);
    if (task.reportAs !== 'answer-bytes') return { ok: true, report };
    // The whole answer, so that it crosses the thread boundary as one copy of bytes and goes out as it is.
    const answer = `{"engineVersion":${JSON.stringify(ENGINE_VERSION)},"report":${JSON.stringify(packCheckRules(report))}}`;
    // TextEncoder gives the bytes a memory of their own (a small Buffer would share node's pool), so it can be moved.
    return { ok: true, report: new TextEncoder().encode(answer) };
  } catch (error) {
    if (!isDomainError(error)) throw error;
    return { ok: false, error: { code: error.code, message: error.message, field: error.field, issues: error.issues } };
  }
}

/**
 * The pool's entry: `runEngineTask`, with the memory of an answer's bytes moved to the request thread instead of
 * copied (the request thread then frees it with the answer sent; a copy would make one more buffer of some 70 kB
 * per driver evaluate there).
 */
export function engineTaskEntry(task: EngineTask | EngineWarmUp): EngineTaskOutcome {
  const outcome = runEngineTask(task);
  if (!outcome.ok || !(outcome.report instanceof Uint8Array)) return outcome;
  const moved = move({ [transferableSymbol]: outcome.report.buffer, [valueSymbol]: outcome });
  return moved as unknown as EngineTaskOutcome;
}
