import type { applicableParameters } from '../calibration/uncertain-parameters';
import type {
  CalibrationDataUse,
  CalibrationParameterId,
  CalibrationResult,
  PriorRange,
} from '../calibration/calibration.types';
import type { SimulationJobError, SimulationJobStatus } from './simulations.types';

/** One parameter the engine can fit for a revision: its declared prior range and the revision's value. */
export type CalibrationParameterOption = ReturnType<typeof applicableParameters>[number];

/** POST …/revisions/:revisionNumber/calibrations body. */
export interface StartCalibrationRequest {
  parameters: { id: CalibrationParameterId; prior?: PriorRange }[];
  runs: { benchRunId: string; use: CalibrationDataUse }[];
  /** Confidence of the intervals, 0.5–0.999; default 0.95. */
  confidence?: number;
}

/** The inputs a calibration was run with, stored with it. */
export interface CalibrationInputSummary {
  parameters: { id: CalibrationParameterId; prior: PriorRange }[];
  runs: { benchRunId: string; use: CalibrationDataUse; label: string; pointCount: number }[];
  confidence: number;
}

/** A calibration as the API gives it: its job's state, its inputs and, once done, its result. */
export interface Calibration {
  id: string;
  jobId: string;
  designId: string;
  revisionNumber: number;
  status: SimulationJobStatus;
  progressPct: number;
  input: CalibrationInputSummary;
  requestedBy: string | null;
  requestedByName: string;
  createdAt: string;
  finishedAt: string | null;
  error?: SimulationJobError;
  result?: CalibrationResult;
  /** The draft revision started from this calibration, if any. */
  draftRevisionNumber: number | null;
}

/** POST …/calibrations/:calibrationId/revision answer: the new draft. */
export interface CalibratedRevisionResponse {
  designId: string;
  revisionNumber: number;
  changeNote: string;
}
