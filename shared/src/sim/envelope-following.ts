import type { Circuit } from './circuit.types';
import { MnaSystem } from './mna-system';
import { PeriodMap } from './period-map';
import { findPeriodicSteadyState } from './periodic-steady-state';
import { SampleBuffer } from './sample-buffer';
import { DenseLu } from './solver/dense-lu';
import type { EnvelopeOptions, EnvelopeResult } from './envelope.types';

export type { EnvelopeOptions, EnvelopeResult } from './envelope.types';

/**
 * The start-up map's periodic steady state is only the start of the final map's, and gives the start-up
 * curve's scale: this close (relative to the largest charge) is close enough for both.
 */
const START_UP_FIXED_POINT_TOLERANCE = 1e-4;
/** A stalled corrector is accepted when its update is within this multiple of its tolerance (see `correct`). */
const STALL_FRACTION = 2.5;
/**
 * Inner Newton tolerance of the start-up map (the final map keeps PeriodMap's 1e-8): its noise stays far
 * below the corrector's 0.1·stepTolerance and the fixed-point tolerance above, and a sixth of the inner
 * iterations go. At 1e-5 the 40-stage cascade's start-up no longer converged.
 */
const START_UP_NEWTON_RELATIVE_TOLERANCE = 1e-6;

const maxAbs = (v: Float64Array): number => {
  let m = 0;
  for (let i = 0; i < v.length; i++) m = Math.max(m, Math.abs(v[i]!));
  return m;
};

/**
 * Start-up of a periodically driven circuit by envelope following over its cycle-to-cycle map
 * q_{k+1} = Φ(q_k) (PeriodMap): instead of simulating every cycle, the slowly moving sequence of cycle-start
 * states is treated as the samples of a smooth envelope z with z(k + 1) − z(k) = Φ(z(k)) − z(k), and that
 * difference equation is integrated with long implicit steps of M cycles,
 *   z(k + M) − z(k) = M · (Φ(z(k + M)) − z(k + M)),
 * (backward Euler on the envelope: L. R. Petzold, "An efficient numerical method for highly oscillatory
 * ordinary differential equations", SIAM J. Numer. Anal. 18(3), 455–479, 1981; applied to switching
 * circuits by J. White and S. B. Leeb, "An envelope-following approach to switching power converter
 * simulation", IEEE Trans. Power Electronics 6(2), 1991; both from memory). Each step is solved by a chord
 * Newton iteration on the sensitivity ∂Φ/∂q, refreshed when the iteration slows; one period per iteration.
 * M is chosen from the local error (predictor–corrector difference), so the cycle means follow the
 * cycle-by-cycle transient; the first cycles, where the state jumps, are run one by one. Once a step as long
 * as the whole start-up so far moves the state less than the step tolerance, M grows without bound and the
 * iteration becomes the shooting Newton on Φ(q) − q (the limit M → ∞; pseudo-transient continuation,
 * C. T. Kelley and D. E. Keyes, SIAM J. Numer. Anal. 35(2), 1998, from memory), which ends at the periodic
 * steady state. The start-up runs on a map with Gear's second-order integration (smooth enough for few
 * corrector iterations per step); its periodic steady state is then polished on the trapezoidal map, and
 * the curve scaled to that map's level. Because every step follows the circuit's own trajectory, it
 * reaches ladders whose linear start estimate is useless (deep droop). Converged only when the residual
 * and the Newton update (which bounds the distance along the slow modes) are both within
 * relativeTolerance.
 */
export function followEnvelope(circuit: Circuit | MnaSystem, options: EnvelopeOptions): EnvelopeResult {
  const sys = 'elements' in circuit ? new MnaSystem(circuit) : circuit;
  const meanProbeIndex = sys.probeIndex(options.probe);
  // Two maps on the same grid. The start-up runs on second-order backward differences (Gear), which damp
  // the stiff modes where the trapezoidal rule lets them ring from step to step: its map is smooth enough
  // for few corrector iterations per envelope step. The periodic steady state is then polished on the
  // trapezoidal rule, the transient's and SPICE's own integration, so the final answer is theirs.
  const startUpMap = new PeriodMap(sys, {
    ...options,
    meanProbeIndex,
    integration: 'gear2',
    tolerances: { relative: START_UP_NEWTON_RELATIVE_TOLERANCE, ...options.tolerances },
  });
  const finalMap = new PeriodMap(sys, { ...options, meanProbeIndex });
  let map = startUpMap;
  const periodsRun = (): number => startUpMap.periods + finalMap.periods;
  const r = map.size;
  const stepTol = options.stepTolerance ?? 2e-3;
  const relTol = options.relativeTolerance ?? 1e-6;
  const maxCycles = options.maxCycles ?? 1e6;
  const maxPeriods = options.maxPeriods ?? 4000;
  const cycles: number[] = [];
  const means: number[] = [];
  let z = Float64Array.from(options.initialCharges ?? sys.initialCharge);
  let k = 0;
  let scale = maxAbs(z);

  // Sensitivity S = ∂Φ/∂q at a recent point, and the factors of the step's Jacobian (1 + 1/M)·I − S.
  const sens = new Float64Array(r * r);
  let hasSens = false;
  const lu = new DenseLu(r);
  let factoredFor = NaN;
  const jac = new Float64Array(r * r);
  // The last period run (start and end) for the secant update of S.
  const lastStart = new Float64Array(r);
  const lastEnd = new Float64Array(r);
  let hasLast = false;
  const refreshSensitivity = (at: Float64Array): void => {
    map.run(at, true);
    sens.set(map.sensitivity);
    hasSens = true;
    factoredFor = NaN;
    lastStart.set(at);
    lastEnd.set(map.end);
    hasLast = true;
  };
  const ds = new Float64Array(r);
  const dPhi = new Float64Array(r);
  /**
   * Φ(start) into map.end, and Broyden's rank-one update of S from the previous run (C. G. Broyden, Math.
   * Comp. 19, 1965): between full sensitivity periods S follows the state at the price of a refactoring.
   */
  const runMap = (start: Float64Array): void => {
    map.run(start, false);
    if (hasLast && hasSens) {
      let ss = 0;
      for (let i = 0; i < r; i++) {
        ds[i] = start[i]! - lastStart[i]!;
        ss += ds[i]! * ds[i]!;
      }
      if (ss > 0) {
        for (let row = 0; row < r; row++) {
          let predicted = 0;
          for (let col = 0; col < r; col++) predicted += sens[col * r + row]! * ds[col]!;
          dPhi[row] = (map.end[row]! - lastEnd[row]! - predicted) / ss;
        }
        for (let col = 0; col < r; col++) {
          const c = ds[col]!;
          if (c !== 0) for (let row = 0; row < r; row++) sens[col * r + row]! += dPhi[row]! * c;
        }
        factoredFor = NaN;
      }
    }
    lastStart.set(start);
    lastEnd.set(map.end);
    hasLast = true;
  };
  const factorFor = (m: number): boolean => {
    if (factoredFor === m) return true;
    const diagonal = 1 + 1 / m;
    for (let row = 0; row < r; row++)
      for (let col = 0; col < r; col++) jac[row * r + col] = (row === col ? diagonal : 0) - sens[col * r + row]!;
    factoredFor = m;
    return lu.factor(jac);
  };

  // History of accepted points, newest last: three cycle indices and states (a quadratic predictor and
  // the variable-step BDF2 formula need them).
  const hk = [0, 0, 0];
  const hz = [new Float64Array(r), new Float64Array(r), new Float64Array(r)];
  const accept = (cycle: number, state: Float64Array, mean: number): void => {
    const oldest = hz.shift()!;
    oldest.set(state);
    hz.push(oldest);
    hk.shift();
    hk.push(cycle);
    cycles.push(cycle);
    means.push(mean);
    scale = Math.max(scale, maxAbs(state));
    options.onPoint?.(cycle, periodsRun());
  };

  // Phase 1: single cycles while the state jumps from cycle to cycle.
  let nextM = 1;
  const recent: Float64Array[] = [];
  while (periodsRun() < maxPeriods && k < maxCycles) {
    map.run(z, false);
    accept(k, z, map.probeMean);
    z = Float64Array.from(map.end);
    k++;
    recent.push(Float64Array.from(z));
    if (recent.length > 7) recent.shift();
    if (recent.length < 7) continue;
    // Third difference of the states at a spacing of two cycles, / 8, ≈ z‴ (BDF2's local error is ≈ (2/9)·M³·|z‴|).
    // The spacing of two cancels a component that alternates from cycle to cycle (a mode of Φ′ near −1), which the
    // implicit steps damp and which says nothing of the envelope's smoothness.
    const [a, , b, , c, , d] = recent as [
      Float64Array,
      unknown,
      Float64Array,
      unknown,
      Float64Array,
      unknown,
      Float64Array,
    ];
    let third = 0;
    for (let i = 0; i < r; i++) third = Math.max(third, Math.abs(d[i]! - 3 * c[i]! + 3 * b[i]! - a[i]!) / 8);
    nextM = third > 0 ? Math.cbrt((4.5 * stepTol * scale) / third) : Infinity;
    if (nextM >= 4) break;
  }
  // z at cycle k is known but its own period has not been run: make it a point of the history too.
  map.run(z, false);
  accept(k, z, map.probeMean);
  if (recent.length === 7) {
    // History at a spacing of two cycles, where an alternating component is the same at every point: the
    // predictor's parabola does not amplify it.
    hk.splice(0, 3, k - 4, k - 2, k);
    hz[0]!.set(recent[2]!);
    hz[1]!.set(recent[4]!);
  }

  // Phase 2: implicit envelope steps by variable-step BDF2, then the M → ∞ limit.
  const y = new Float64Array(r);
  const pred = new Float64Array(r);
  const c = new Float64Array(r);
  const f = new Float64Array(r);
  let residual = Infinity;
  let distance = Infinity;
  let finalMean = map.probeMean;
  let isConverged = false;
  let m = Math.min(nextM, 64);
  let isShooting = false;
  let failures = 0;
  // Cycle mean at the start-up map's periodic steady state, and the curve's points computed on that map.
  let startUpMean = NaN;
  let startUpPoints = 0;
  /**
   * Chord iteration on (1 + 1/big)·y − Φ(y) − c/big = 0 from y, one period per iteration: solved when the
   * update is within `fraction` of the state and, for the fixed point (big = ∞), the residual too.
   * Refreshes the sensitivity when the iteration contracts slowly.
   */
  const correct = (big: number, fraction: number): boolean => {
    let lastUpdate = Infinity;
    let refreshed = false;
    const isFixedPoint = big === Infinity;
    for (let iteration = 0; iteration < 12 && periodsRun() < maxPeriods; iteration++) {
      if (!factorFor(big)) return false;
      try {
        runMap(y);
      } catch {
        return false; // an iterate the stepper cannot follow: a shorter step
      }
      const inv = 1 / big;
      for (let i = 0; i < r; i++) f[i] = (1 + inv) * y[i]! - map.end[i]! - c[i]! * inv;
      residual = 0;
      for (let i = 0; i < r; i++) residual = Math.max(residual, Math.abs(map.end[i]! - y[i]!));
      finalMean = map.probeMean;
      lu.solve(f);
      const update = maxAbs(f);
      for (let i = 0; i < r; i++) y[i]! -= f[i]!;
      const size = Math.max(scale, maxAbs(y));
      if (update <= fraction * size && (!isFixedPoint || residual <= fraction * size)) {
        distance = update / size;
        residual /= size;
        return true;
      }
      // A chord iteration that contracts slowly: the sensitivity is stale; take it at the present iterate.
      if (update > 0.9 * lastUpdate || !Number.isFinite(update)) {
        // An envelope step whose iteration stalls this close has met the map's own roughness (conduction
        // starting within a grid step): the iterate is within a quarter of the step tolerance, which the
        // local error test allows for; a fresh sensitivity would not take it further.
        if (!isFixedPoint && update <= STALL_FRACTION * fraction * size) {
          distance = update / size;
          residual /= size;
          return true;
        }
        if ((refreshed && update > lastUpdate) || !Number.isFinite(update)) return false;
        try {
          refreshSensitivity(y);
        } catch {
          return false;
        }
        refreshed = true;
      }
      lastUpdate = update;
    }
    return false;
  };
  while (periodsRun() < maxPeriods && k < maxCycles) {
    if (!hasSens) refreshSensitivity(z);
    const [k0, k1, k2] = hk as [number, number, number];
    const [z0, z1, z2] = hz as [Float64Array, Float64Array, Float64Array];
    // y − β·M·(Φ(y) − y) = c with ω = M / M_prev (BDF2 on a variable grid; E. Hairer, S. P. Nørsett and
    // G. Wanner, Solving ODEs I, §III.5, from memory); written as (1 + 1/(βM))·y − Φ(y) − c/(βM) = 0 so
    // that M = ∞ is Newton on Φ(y) − y.
    const omega = m / (k2 - k1);
    const beta = (1 + omega) / (1 + 2 * omega);
    const big = isShooting ? Infinity : beta * m;
    const ca = ((1 + omega) * (1 + omega)) / (1 + 2 * omega);
    const cb = (omega * omega) / (1 + 2 * omega);
    // Predictor: the parabola through the last three points, at k + M.
    const t = k2 + m;
    const l0 = ((t - k1) * (t - k2)) / ((k0 - k1) * (k0 - k2));
    const l1 = ((t - k0) * (t - k2)) / ((k1 - k0) * (k1 - k2));
    const l2 = ((t - k0) * (t - k1)) / ((k2 - k0) * (k2 - k1));
    for (let i = 0; i < r; i++) {
      c[i] = ca * z2[i]! - cb * z1[i]!;
      pred[i] = isShooting ? z2[i]! : l0 * z0[i]! + l1 * z1[i]! + l2 * z2[i]!;
    }
    y.set(pred);
    const isFinal = map === finalMap;
    const fixedPointTol = isFinal ? relTol : Math.max(relTol, START_UP_FIXED_POINT_TOLERANCE);
    if (!correct(big, isShooting ? fixedPointTol : 0.1 * stepTol)) {
      if (isShooting && isFinal) break; // shooting Newton with a line search takes over below
      // No solution at this step: shorten it (from the M → ∞ limit back to a long finite step).
      if (++failures > 12) break;
      if (isShooting) {
        isShooting = false;
        m = Math.max(4, k / 4);
      } else m = Math.max(1, m / 4);
      refreshSensitivity(z);
      continue;
    }
    if (isShooting) {
      z = Float64Array.from(y);
      if (isFinal) {
        isConverged = true;
        break;
      }
      // The start-up map's periodic steady state: from here the final map's, by the same M → ∞ limit.
      startUpMean = finalMean;
      startUpPoints = means.length;
      map = finalMap;
      hasLast = false;
      continue;
    }
    // Local error from the predictor–corrector difference (Milne's device; BDF2's error constant 2/9
    // against the parabola's 1: about 2/11 of the difference).
    let error = 0;
    for (let i = 0; i < r; i++) error = Math.max(error, Math.abs(y[i]! - pred[i]!));
    error *= 2 / 11;
    if (error > stepTol * scale && m > 1) {
      m = Math.max(1, m * Math.max(0.2, 0.9 * Math.cbrt((stepTol * scale) / error)));
      continue;
    }
    failures = 0;
    z = Float64Array.from(y);
    k += m;
    accept(k, z, finalMean);
    const grow = error > 0 ? 0.9 * Math.cbrt((stepTol * scale) / error) : 4;
    m = m * Math.min(4, Math.max(0.5, grow));
    // A step as long as the start-up so far that still moves the state less than the tolerance: the rest is
    // the fixed point itself.
    if (m >= k && error <= 0.1 * stepTol * scale) isShooting = true;
  }
  let fallbackPeriods = 0;
  let fallbackSensitivityPeriods = 0;
  if (!isConverged && map === finalMap) {
    // The chord iteration did not reach the final map's steady state from the start-up map's (at 40 stages
    // they lie half a per cent apart): shooting Newton with its exact Jacobian and a line search does.
    try {
      const pss = findPeriodicSteadyState(sys, {
        periodS: options.periodS,
        stepsPerPeriod: options.stepsPerPeriod,
        initialCharges: z,
        relativeTolerance: relTol,
        ...(options.tolerances ? { tolerances: options.tolerances } : {}),
      });
      fallbackPeriods = pss.periods;
      fallbackSensitivityPeriods = pss.sensitivityPeriods;
      if (pss.isConverged) {
        z = Float64Array.from(pss.charges);
        isConverged = true;
      }
    } catch {
      isConverged = false;
    }
  }
  const probes = options.probes ?? [];
  const record = {
    time: new SampleBuffer(),
    values: probes.map(() => new SampleBuffer()),
    probeIndex: probes.map((p) => sys.probeIndex(p)),
  };
  map.run(z, false, record);
  finalMean = map.probeMean;
  // The two maps' steady states differ by the integration's error (tenths of a per cent of the output): the
  // start-up map's part of the curve is scaled by the ratio of their cycle means, its shape the start-up
  // map's, its level the final's.
  if (isConverged) {
    const level = finalMean / startUpMean;
    for (let i = 0; i < startUpPoints; i++) means[i]! *= level;
  }
  const signals: Record<string, Float64Array> = {};
  probes.forEach((p, i) => {
    signals[p] = record.values[i]!.toArray();
  });
  return {
    cycles,
    means,
    timeS: record.time.toArray(),
    signals,
    isConverged,
    relativeResidual: residual,
    relativeDistance: distance,
    charges: z,
    finalMean,
    periods: periodsRun() + fallbackPeriods,
    sensitivityPeriods: startUpMap.sensitivityPeriods + finalMap.sensitivityPeriods + fallbackSensitivityPeriods,
    newtonIterations: startUpMap.newtonIterations + finalMap.newtonIterations,
  };
}
