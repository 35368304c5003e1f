import type { SignOffApproval } from '@ladderwright/shared/api';
import type { TransformerReport, TransformerSection } from '@ladderwright/shared/transformer';
import type { RevisionState } from '@ladderwright/shared/reviews';

/** Everything the transformer sheet prints, gathered from the stored revision, its report and its Sign-off. */
export interface TransformerSheetContent {
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
  /** The section as the revision stores it. */
  section: TransformerSection;
  /** The stored report's transformer figures at the driver's rated load. */
  report: TransformerReport;
  /** Operating frequency and the secondary's peak working voltage the figures were computed at. */
  frequencyHz: number;
  secondaryWorkingPeakV: number;
}
