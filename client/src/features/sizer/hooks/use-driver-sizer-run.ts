import type { DriverSizerRequest, DriverSizerResult } from '@ladderwright/shared/sizing';
import { useSizerWorkerRun, type WorkerRun } from './use-sizer-run';

/** Runs sizeDriverSupply in a Web Worker: the page stays responsive, and a run can be cancelled. */
export function useDriverSizerRun(): WorkerRun<DriverSizerRequest, DriverSizerResult> {
  return useSizerWorkerRun<DriverSizerRequest, DriverSizerResult>('driver');
}
