import { sizeLadder, type SizerRequest, type SizerResult } from '@ladderwright/shared/sizing';

/** What the page posts to the Sizer worker: one run, numbered so a late answer to a cancelled run is dropped. */
export interface SizerWorkerRequest {
  runId: number;
  request: SizerRequest;
}

/** What the Sizer worker posts back for one run. */
export type SizerWorkerAnswer =
  { runId: number; isOk: true; result: SizerResult } | { runId: number; isOk: false; message: string };

/** Runs the shared sizeLadder on one request; an engine error becomes an answer, never a thrown error. */
export function answerSizerRequest({ runId, request }: SizerWorkerRequest): SizerWorkerAnswer {
  try {
    return { runId, isOk: true, result: sizeLadder(request) };
  } catch (caught) {
    return { runId, isOk: false, message: caught instanceof Error ? caught.message : String(caught) };
  }
}
