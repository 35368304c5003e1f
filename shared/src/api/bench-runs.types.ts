import type { BenchComparison, BenchKind, MeasuredPoint } from '../bench';

/** One uploaded file of a bench run, as stored (content is addressed by its SHA-256). */
export interface BenchFile {
  role: 'data' | 'photo';
  originalName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
}

/** One bench run of a revision without its points. Deleted runs are not listed. */
export interface BenchRunSummary {
  id: string;
  designId: string;
  revisionNumber: number;
  kind: BenchKind;
  title: string;
  /** Fractional tolerance the verdict was taken against, e.g. 0.05 for ±5 %. */
  tolerance: number;
  pointCount: number;
  verdict: BenchComparison['verdict'];
  marginPct: number;
  worstDeviation: number;
  files: BenchFile[];
  uploadedById: string;
  uploadedByName: string;
  createdAt: string;
}

/** GET .../bench-runs/:benchRunId: parsed points, the comparison with the revision's prediction, the photos. */
export interface BenchRunDetail extends BenchRunSummary {
  points: MeasuredPoint[];
  comparison: BenchComparison;
  /** Metadata lines found above the header of the data file. */
  metadata: string[];
}

/** Multipart fields of POST .../bench-runs (files: `data`, optional `photos`). */
export interface UploadBenchRunFields {
  kind: BenchKind;
  title?: string;
  /** Fraction (0.05) or percent text ("5%"); default 0.05. */
  tolerance?: string;
}
