/*
 * Root finding for the driver's load points (operating-point.ts): the power balance warm-started from a
 * nearby load's, and the sign of the output near the end of the output-vs-load curve.
 */

/**
 * Relative step at which the warm-started power balance stops, on the point it last evaluated: near the root
 * a secant step is that point's error (the next step's error is the product of the last two), so the point
 * is good to this (a tenth of the 1e-8 to which the figures agree with a cold solve's) and the caller keeps
 * its evaluation.
 */
const WARM_ROOT_STEP = 1e-9;

/**
 * A nearby load's power balance, to start the next: its flyback (V) and the slope there of the power surplus
 * V₋·surplus(V₋) (W per volt), nearly straight where the surplus per volt bends with 1/V₋.
 */
export interface WarmStart {
  flybackV: number;
  slope: number;
  /** The loaded supply voltage there (V), to start the supply solve of the first evaluation. */
  supplyV?: number;
}

/**
 * The power balance's root from a nearby load's (`warm`), by Newton's method on the power surplus
 * g(V₋) = V₋·surplus(V₋) (the same root): the first step with the nearby slope, then secant steps (the slope
 * from the last two points), ending on the last point evaluated. Taken only where the steps settle inside (0, limit) on a falling crossing, which
 * with at most two roots is the stable one the scan finds; null otherwise (the scan then runs).
 */
export function warmRoot(surplus: (flyV: number) => number, warm: WarmStart, maxFlyV: number): WarmStart | null {
  if (!(warm.flybackV > 0 && warm.flybackV < maxFlyV && warm.slope < 0)) return null;
  let x0 = warm.flybackV;
  let g0 = x0 * surplus(x0);
  if (g0 === 0) return warm;
  let x1 = x0 - g0 / warm.slope;
  if (!(x1 > 0 && x1 < maxFlyV)) x1 = x0 * (g0 > 0 ? 1 + 1e-3 : 1 - 1e-3);
  let g1 = x1 * surplus(x1);
  for (let step = 0; step < 12; step += 1) {
    const slope = (g1 - g0) / (x1 - x0);
    if (!(slope < 0)) return null;
    if (g1 === 0) return { flybackV: x1, slope };
    const x2 = x1 - g1 / slope;
    if (!(x2 > 0 && x2 < maxFlyV)) return null;
    if (Math.abs(x2 - x1) <= WARM_ROOT_STEP * x2) return { flybackV: x1, slope };
    x0 = x1;
    g0 = g1;
    x1 = x2;
    g1 = x1 * surplus(x1);
  }
  return null;
}

/**
 * Whether the output is above zero at a load current (A), for the bisection that ends the curve, answered
 * without a solve wherever a solved load settles it: the output falls as the load rises, so it is positive
 * below a load where it is positive and zero above one where it is zero. A few secant steps on the output
 * from `positive` (the highest load solved with output, or null; `earlier`, a lower one, gives the first
 * step its line) towards `zeroA` (a load without) first
 * close in on the crossing, so that the bisection solves only the one or two midpoints next to it; its
 * answers are those of solving at every midpoint.
 */
export function outputSignsNear(
  pointAt: (loadA: number) => { outputV: number },
  positive: { loadA: number; outputV: number } | null,
  zeroA: number,
  earlier: { loadA: number; outputV: number } | null = null,
): (loadA: number) => boolean {
  let below = positive ?? { loadA: 0, outputV: NaN };
  let previous: { loadA: number; outputV: number } | null = positive ? earlier : null;
  let above = zeroA;
  let isLastAbove = false;
  for (let step = 0; step < 6 && above - below.loadA > 2e-5 * above; step += 1) {
    // The line through the last two loads with output, else halfway; aimed 1e-5 past the crossing after a
    // load with output and short of it after one without, so that both sides close in to about the
    // bisection's last steps.
    const slope = previous ? (below.outputV - previous.outputV) / (below.loadA - previous.loadA) : NaN;
    let guessA = slope < 0 ? below.loadA - below.outputV / slope : 0.5 * (below.loadA + above);
    guessA *= isLastAbove ? 1 - 1e-5 : 1 + 1e-5;
    if (!(guessA > below.loadA && guessA < above)) guessA = 0.5 * (below.loadA + above);
    const outputV = pointAt(guessA).outputV;
    isLastAbove = !(outputV > 0);
    if (outputV > 0) {
      previous = below;
      below = { loadA: guessA, outputV };
    } else above = guessA;
  }
  return (loadA) => {
    if (loadA <= below.loadA && below.loadA > 0) return true;
    if (loadA >= above) return false;
    return pointAt(loadA).outputV > 0;
  };
}

/** A warm start for a load among the curve's: the flyback interpolated between the two loads around it, both power-limited. */
export function warmNear(
  curve: readonly { loadCurrentA: number }[],
  balances: readonly (WarmStart | null)[],
  loadA: number,
): WarmStart | null {
  for (let i = 1; i < curve.length; i++) {
    const hi = curve[i] as { loadCurrentA: number };
    if (hi.loadCurrentA < loadA) continue;
    const a = balances[i - 1];
    const b = balances[i];
    if (!a || !b) return null;
    const lo = curve[i - 1] as { loadCurrentA: number };
    const t = (loadA - lo.loadCurrentA) / (hi.loadCurrentA - lo.loadCurrentA);
    return {
      flybackV: a.flybackV + t * (b.flybackV - a.flybackV),
      slope: t < 0.5 ? a.slope : b.slope,
      ...(a.supplyV !== undefined && b.supplyV !== undefined
        ? { supplyV: a.supplyV + t * (b.supplyV - a.supplyV) }
        : {}),
    };
  }
  return null;
}

/**
 * A warm start for the first power-limited load past the onset (A), where the flyback leaves its limit (V):
 * the flyback on the line from the onset to the nearest load solved above it, with that load's slope.
 */
export function warmPastOnset(
  solved: readonly { loadA: number; balance: WarmStart }[],
  onsetA: number,
  maxFlyV: number,
  loadA: number,
): WarmStart | null {
  let nearest: { loadA: number; balance: WarmStart } | null = null;
  for (const s of solved) if (s.loadA > onsetA && (!nearest || s.loadA < nearest.loadA)) nearest = s;
  if (!nearest || !(loadA > onsetA)) return null;
  const t = (loadA - onsetA) / (nearest.loadA - onsetA);
  return { ...nearest.balance, flybackV: maxFlyV + t * (nearest.balance.flybackV - maxFlyV) };
}

/**
 * Down a falling sequence of points x(1), x(2), … x(count) from `hi` (where f is `fHi` < 0): the first where
 * f ≥ 0 (`lo`, found) and the last before it (`hi`), a bracket of the highest root among those points.
 */
export function scanDown(
  f: (x: number) => number,
  xAt: (k: number) => number,
  count: number,
  hi: number,
  fHi: number,
): { found: boolean; lo: number; fLo: number; hi: number; fHi: number } {
  const bracket = { found: false, lo: NaN, fLo: NaN, hi, fHi };
  for (let k = 1; k <= count; k++) {
    const x = xAt(k);
    const fx = f(x);
    if (fx >= 0) {
      bracket.found = true;
      bracket.lo = x;
      bracket.fLo = fx;
      return bracket;
    }
    bracket.hi = x;
    bracket.fHi = fx;
  }
  return bracket;
}
