import type { MessagePort } from 'node:worker_threads';
import type { SimulationKind, SimulationOptions, SimulationResult } from '@ladderwright/shared/api';
import type { CalibrationDataset } from '@ladderwright/shared/calibration';
import type { Design } from '@ladderwright/shared/designs';

/** Kinds that exist only to prove the failure paths; accepted when `AppEnv.simulationFaultKinds` is on. */
export const FAULT_KINDS = ['fault-throw', 'fault-exit'] as const;
export type FaultKind = (typeof FAULT_KINDS)[number];

/** One model evaluation of a calibration: the predictions of `datasets` for `document`. */
export const CALIBRATION_PREDICT = 'calibration-predict';

/** What the main thread hands a worker thread. */
export interface SimulationTask {
  kind: SimulationKind | FaultKind | typeof CALIBRATION_PREDICT;
  /** The bench runs to predict, for a calibration-predict task. */
  datasets?: CalibrationDataset[];
  document: Design;
  options: SimulationOptions;
  /** Receives `SimulationProgressMessage`s. */
  progressPort: MessagePort;
  /** Int32Array over a SharedArrayBuffer: element 0 becomes 1 when the job is cancelled. */
  cancelFlag: Int32Array;
}

export interface SimulationProgressMessage {
  progressPct: number;
}

/** A failure the simulator reports (bad design for the simulator, no convergence) or a cooperative cancel. */
export interface SimulationTaskFailure {
  code: string;
  message: string;
  field: string | null;
}

export type SimulationTaskOutcome =
  | { ok: true; result: SimulationResult }
  | { ok: true; predictions: number[][] | null }
  /** A calibration finished; its result is written to its `calibrations` row. */
  | { ok: true; calibrated: true }
  | { ok: false; error: SimulationTaskFailure };

/** Name of the task function the worker entry exports. */
export const SIMULATION_TASK_NAME = 'runSimulationTask';
