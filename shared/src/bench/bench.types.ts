/** A point of a predicted curve (same shape as the engine's CurvePoint). */
export interface CurvePoint {
  x: number;
  y: number;
}

/** A load sweep is output voltage vs load current; a scope capture is output voltage vs time. */
export type BenchKind = 'load-sweep' | 'scope-capture';

/** One measured point, SI units: load sweep x = current (A), scope capture x = time (s); y = voltage (V). */
export interface MeasuredPoint {
  x: number;
  y: number;
}

/** A column the reader recognised: its header text and the factor to SI base units. */
export interface MeasurementColumn {
  header: string;
  index: number;
  unit: string;
  scaleToSi: number;
}

export interface MeasurementTable {
  kind: BenchKind;
  points: MeasuredPoint[];
  /** Non-empty lines above the header (instrument, date, probe …), as text. */
  metadata: string[];
  /** 1-based line of the header in the file. */
  headerLine: number;
  x: MeasurementColumn;
  y: MeasurementColumn;
}

/** What the revision predicts, taken from its stored report. Magnitudes (unsigned), SI units. */
export interface BenchPrediction {
  /**
   * Mean output vs external load current, 0 to short circuit: a driver design's joint driver–ladder operating
   * curve, else the ladder's regulation curve (predictedLoadCurve).
   */
  regulation: CurvePoint[];
  outputMeanV: number;
  ripplePeakToPeakV: number;
  loadCurrentA: number;
}

export type BenchVerdict = 'pass' | 'marginal' | 'fail';

/** One load-sweep point beside the prediction; `deviation` = (measured − predicted)/predicted. */
export interface ComparedPoint {
  x: number;
  measuredV: number;
  /** null when x lies outside the predicted curve (no extrapolation). */
  predictedV: number | null;
  deviation: number | null;
}

/** A figure derived from a capture (mean output, ripple) beside the prediction. */
export interface ComparedFigure {
  key: 'outputMeanV' | 'ripplePeakToPeakV';
  measured: number;
  predicted: number;
  deviation: number;
}

export interface BenchComparison {
  kind: BenchKind;
  tolerance: number;
  points: ComparedPoint[];
  figures: ComparedFigure[];
  /** The predicted curve to overlay (load sweep: the regulation curve; capture: empty). */
  predictedCurve: CurvePoint[];
  /** Largest |deviation| over the compared points or figures. */
  worstDeviation: number;
  verdict: BenchVerdict;
  /** (tolerance − worst)/tolerance · 100. */
  marginPct: number;
  comparedCount: number;
  skippedCount: number;
}
