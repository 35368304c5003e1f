import { studentTCritical } from './student-t';

/** |correlation| above which two fitted parameters count as not separately identifiable. Common practice, no source. */
export const CORRELATION_WARNING = 0.95;
/** Variance inflation (diagonal of the inverse correlation form of JᵀJ) above which JᵀJ counts as near-singular. */
const NEAR_SINGULAR_INFLATION = 1e6;
/** A Jacobian column this small against the largest leaves its parameter unseen by the data. */
const INSENSITIVE_COLUMN = 1e-8;

/** Inverse of a small symmetric matrix by Gauss–Jordan elimination with partial pivoting; null when singular. */
export function invertMatrix(matrix: readonly (readonly number[])[]): number[][] | null {
  const n = matrix.length;
  const a = matrix.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let col = 0; col < n; col += 1) {
    let pivot = col;
    for (let row = col + 1; row < n; row += 1) {
      if (Math.abs((a[row] as number[])[col] as number) > Math.abs((a[pivot] as number[])[col] as number)) pivot = row;
    }
    const pivotValue = (a[pivot] as number[])[col] as number;
    if (!(Math.abs(pivotValue) > 1e-300)) return null;
    [a[col], a[pivot]] = [a[pivot] as number[], a[col] as number[]];
    const pivotRow = a[col] as number[];
    for (let k = 0; k < 2 * n; k += 1) pivotRow[k] = (pivotRow[k] as number) / pivotValue;
    for (let row = 0; row < n; row += 1) {
      if (row === col) continue;
      const r = a[row] as number[];
      const factor = r[col] as number;
      if (factor === 0) continue;
      for (let k = 0; k < 2 * n; k += 1) r[k] = (r[k] as number) - factor * (pivotRow[k] as number);
    }
  }
  return a.map((row) => row.slice(n));
}

/** A point with leverage this close to 1 is fitted exactly; its HC3 weight is capped there. */
const LEVERAGE_CAP = 1 - 1e-6;

/**
 * HC3 variances (fit coordinates) of the kept parameters: A·Jᵀ·diag(rᵢ²/(1 − hᵢᵢ)²)·J·A with A = (JᵀJ)⁻¹ over
 * the kept columns, given as the inverse of JᵀJ's correlation form (`inverse`) and the column norms.
 */
function robustVariances(
  jacobian: readonly (readonly number[])[],
  residuals: readonly number[],
  kept: readonly number[],
  inverse: readonly (readonly number[])[],
  norms: readonly number[],
): number[] {
  const q = kept.length;
  const a = kept.map((i, r) =>
    kept.map((j, c) => ((inverse[r] as number[])[c] as number) / ((norms[i] as number) * (norms[j] as number))),
  );
  const meat = Array.from({ length: q }, () => Array<number>(q).fill(0));
  jacobian.forEach((row, point) => {
    const g = kept.map((i) => row[i] as number);
    let leverage = 0;
    for (let r = 0; r < q; r += 1)
      for (let c = 0; c < q; c += 1)
        leverage += (g[r] as number) * ((a[r] as number[])[c] as number) * (g[c] as number);
    const weight = ((residuals[point] as number) / (1 - Math.min(leverage, LEVERAGE_CAP))) ** 2;
    meat.forEach((meatRow, r) => {
      for (let c = 0; c < q; c += 1) meatRow[c] = (meatRow[c] as number) + weight * (g[r] as number) * (g[c] as number);
    });
  });
  return a.map((row, r) => {
    let variance = 0;
    for (let c = 0; c < q; c += 1)
      for (let d = 0; d < q; d += 1)
        variance += (row[c] as number) * ((meat[c] as number[])[d] as number) * ((a[d] as number[])[r] as number);
    return variance;
  });
}

export interface FitStatistics {
  /** Residual variance s² = SSR/(m − p) in the fit's normalized units. */
  residualVariance: number;
  degreesOfFreedom: number;
  /** Two-sided Student t critical value at the confidence. */
  tCritical: number;
  /**
   * Standard error of each parameter in the fit's coordinates, the wider of `classicalStandardErrors` and
   * `robustStandardErrors`; null where not identifiable.
   */
  standardErrors: (number | null)[];
  /** From s²·(JᵀJ)⁻¹: right when every point has the same noise. */
  classicalStandardErrors: (number | null)[];
  /** Heteroscedasticity-consistent (HC3): right whatever each point's noise, from the residuals themselves. */
  robustStandardErrors: (number | null)[];
  /** Correlation matrix (NaN for an insensitive parameter's row and column). */
  correlation: number[][];
  /** Indices of parameters the data do not see. */
  insensitive: number[];
  /** Pairs (i < j) with |correlation| above CORRELATION_WARNING. */
  correlatedPairs: { i: number; j: number; correlation: number }[];
  /** JᵀJ near-singular over the sensitive parameters (a combination of them is not determined). */
  isNearSingular: boolean;
}

/**
 * Linearized statistics of a least-squares fit at its optimum (the standard Gauss–Newton covariance, e.g.
 * Bates & Watts, *Nonlinear Regression Analysis and Its Applications*, §2.3, from memory):
 * Cov = s²·(JᵀJ)⁻¹ with s² = SSR/(m − p), intervals ±t(1 − α/2, m − p)·√Cov_jj, correlation
 * Cov_ij/√(Cov_ii·Cov_jj). `jacobian` is m × p (rows are points), in the fit's coordinates. Insensitive
 * columns are left out of the inverse; JᵀJ is inverted in its correlation form (unit diagonal) so that the
 * singularity test does not depend on the parameters' scales.
 *
 * That covariance assumes every point has the same noise. A bench instrument's error is mostly a share of
 * the reading, so a curve's large values are the noisy ones, and they are also where a parameter moves
 * the curve most: s² pooled over all points then understates the noise that decides the fit, and the
 * interval comes out too narrow. So each standard error is the wider of the classical one and the
 * heteroscedasticity-consistent HC3 one, (JᵀJ)⁻¹·Jᵀ·diag(rᵢ²/(1 − hᵢᵢ)²)·J·(JᵀJ)⁻¹ with the leverages
 * hᵢᵢ = Jᵢ(JᵀJ)⁻¹Jᵢᵀ (MacKinnon & White 1985; Long & Ervin 2000 recommend HC3 for small samples; taking
 * the wider of the two as in Angrist & Pischke, *Mostly Harmless Econometrics*, §8.1; all from memory).
 */
export function fitStatistics(
  jacobian: readonly (readonly number[])[],
  residuals: readonly number[],
  parameterCount: number,
  confidence: number,
): FitStatistics {
  const m = residuals.length;
  const p = parameterCount;
  const degreesOfFreedom = Math.max(1, m - p);
  const ssr = residuals.reduce((sum, r) => sum + r * r, 0);
  const residualVariance = ssr / degreesOfFreedom;
  const jtj = Array.from({ length: p }, (_, i) =>
    Array.from({ length: p }, (_, j) =>
      jacobian.reduce((sum, row) => sum + (row[i] as number) * (row[j] as number), 0),
    ),
  );
  const norms = jtj.map((row, i) => Math.sqrt(row[i] as number));
  const largest = Math.max(...norms, 0);
  const insensitive = norms.flatMap((norm, i) => (!(norm > INSENSITIVE_COLUMN * largest) || norm === 0 ? [i] : []));
  const kept = norms.flatMap((_, i) => (insensitive.includes(i) ? [] : [i]));
  const scaled = kept.map((i) =>
    kept.map((j) => ((jtj[i] as number[])[j] as number) / ((norms[i] as number) * (norms[j] as number))),
  );
  const inverse = kept.length > 0 ? invertMatrix(scaled) : [];
  const inflation = inverse ? Math.max(0, ...inverse.map((row, k) => row[k] as number)) : Infinity;
  const isNearSingular = !inverse || !(inflation < NEAR_SINGULAR_INFLATION);
  const classicalStandardErrors: (number | null)[] = Array.from({ length: p }, () => null);
  const robustStandardErrors: (number | null)[] = Array.from({ length: p }, () => null);
  const correlation = Array.from({ length: p }, (_, i) => Array.from({ length: p }, (_, j) => (i === j ? 1 : NaN)));
  const correlatedPairs: FitStatistics['correlatedPairs'] = [];
  if (inverse) {
    kept.forEach((i, a) => {
      const variance = (residualVariance * ((inverse[a] as number[])[a] as number)) / (norms[i] as number) ** 2;
      classicalStandardErrors[i] = isNearSingular ? null : Math.sqrt(Math.max(variance, 0));
      kept.forEach((j, b) => {
        const cab = (inverse[a] as number[])[b] as number;
        const r = cab / Math.sqrt(((inverse[a] as number[])[a] as number) * ((inverse[b] as number[])[b] as number));
        (correlation[i] as number[])[j] = i === j ? 1 : Math.max(-1, Math.min(1, r));
        if (i < j && Math.abs(r) > CORRELATION_WARNING) correlatedPairs.push({ i, j, correlation: r });
      });
    });
    if (!isNearSingular) {
      robustVariances(jacobian, residuals, kept, inverse, norms).forEach((variance, a) => {
        robustStandardErrors[kept[a] as number] = Math.sqrt(Math.max(variance, 0));
      });
    }
  }
  const standardErrors = classicalStandardErrors.map((classical, i) => {
    const robust = robustStandardErrors[i];
    return classical === null || robust === null || robust === undefined ? classical : Math.max(classical, robust);
  });
  return {
    residualVariance,
    degreesOfFreedom,
    tCritical: studentTCritical(confidence, degreesOfFreedom),
    standardErrors,
    classicalStandardErrors,
    robustStandardErrors,
    correlation,
    insensitive,
    correlatedPairs,
    isNearSingular,
  };
}
