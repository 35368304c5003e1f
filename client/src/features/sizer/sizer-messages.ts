import {
  sizeDriverSupply,
  sizeLadder,
  type DriverSizerRequest,
  type DriverSizerResult,
  type SizerRequest,
  type SizerResult,
} from '@ladderwright/shared/sizing';

/** What the page posts to the Sizer worker: one run, numbered so a late answer to a cancelled run is dropped. */
export interface SizerWorkerRequest {
  runId: number;
  request: SizerRequest;
}

/** What the Sizer worker posts back for one run. */
export type SizerWorkerAnswer =
  { runId: number; isOk: true; result: SizerResult } | { runId: number; isOk: false; message: string };

/** One worker answer from a search: its result, or an engine error as a message (never a thrown error). */
function answerOf<T>(
  runId: number,
  search: () => T,
): { runId: number; isOk: true; result: T } | { runId: number; isOk: false; message: string } {
  try {
    return { runId, isOk: true, result: search() };
  } catch (caught) {
    return { runId, isOk: false, message: caught instanceof Error ? caught.message : String(caught) };
  }
}

/** Runs the shared sizeLadder on one request; an engine error becomes an answer, never a thrown error. */
export function answerSizerRequest({ runId, request }: SizerWorkerRequest): SizerWorkerAnswer {
  return answerOf(runId, () => sizeLadder(request));
}

/** A run of the driver Sizer (whole driver-fed supplies), posted to the same worker. */
export interface DriverSizerWorkerRequest {
  runId: number;
  kind: 'driver';
  request: DriverSizerRequest;
}

export type DriverSizerWorkerAnswer =
  { runId: number; isOk: true; result: DriverSizerResult } | { runId: number; isOk: false; message: string };

/** Runs the shared sizeDriverSupply on one request; an engine error becomes an answer. */
export function answerDriverSizerRequest({ runId, request }: DriverSizerWorkerRequest): DriverSizerWorkerAnswer {
  return answerOf(runId, () => sizeDriverSupply(request));
}
