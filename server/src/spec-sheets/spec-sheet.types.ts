import type { Calibration } from '@ladderwright/shared/api';
import type { BenchRunSummary, SignOffApproval, SignOffOverride } from '@ladderwright/shared/api';
import type { MeasuredPoint } from '@ladderwright/shared/bench';
import type { Design } from '@ladderwright/shared/designs';
import type { DesignReport, HeadlineSource } from '@ladderwright/shared/analysis';
import type { AcceptanceLimits } from '@ladderwright/shared/reviews';
import type { RevisionState } from '@ladderwright/shared/reviews';

/** The transformer data the supplier winds and tests to. */
export type WindingSpec =
  | {
      kind: 'driver';
      primaryTurns: number;
      feedbackTurns: number;
      secondaryTurns: number;
      primaryInductanceH: number;
      couplingCoefficient: number;
      saturationCurrentA: number;
      insulationRatedV: number | null;
      secondaryPeakV: number;
      frequencyHz: number;
      hipotTestV: number;
      hipotMethod: string;
    }
  | { kind: 'secondary'; secondaryPeakV: number; frequencyHz: number; waveform: string };

/** Everything the spec sheet prints, gathered by the service from the stored revision and its Sign-off. */
export interface SpecSheetContent {
  projectName: string;
  designName: string;
  revisionNumber: number;
  state: RevisionState;
  isReleased: boolean;
  authorName: string;
  approvals: SignOffApproval[];
  releasedBy: { name: string; at: string } | null;
  generatedAt: Date;
  engineVersion: string;
  document: Design;
  /** The stored report: the estimate. */
  report: DesignReport;
  /** The figures the sheet prints: a current full simulation's where one exists, with the differences to the estimate. */
  headline: HeadlineSource;
  winding: WindingSpec;
  acceptance: AcceptanceLimits;
  /** Decisions to go past closed Sign-off gates on this revision, oldest first. */
  overrides: SignOffOverride[];
  /** The revision's live bench runs, newest first; load-sweep points go on the output-vs-load plot. */
  benchRuns: (BenchRunSummary & { points: MeasuredPoint[] })[];
  /** The revision's finished calibrations against its bench runs, newest first. */
  calibrations?: Calibration[];
}
