import type { Circuit, SimulationTolerances } from './circuit.types';
import { MnaSystem } from './mna-system';
import { PeriodMap, type PeriodRecord } from './period-map';
import { solveDense } from './solver/dense-lu';
import { SampleBuffer } from './sample-buffer';

export interface PeriodicSteadyStateOptions {
  periodS: number;
  /** Fixed steps per period (the shooting map must be the same function each iteration). */
  stepsPerPeriod: number;
  /** Charges and fluxes at t = 0 to start from (MnaSystem reactive order); default the element initial conditions. */
  initialCharges?: Float64Array;
  maxIterations?: number;
  /** Plain periods run from the initial charges before shooting; default 2. */
  warmUpPeriods?: number;
  /** Convergence: every |q(T) − q(0)| and every Newton update within this fraction of the largest |q|. */
  relativeTolerance?: number;
  probes?: ReadonlyArray<string>;
  tolerances?: Partial<SimulationTolerances>;
}

export interface PeriodicSteadyStateResult {
  isConverged: boolean;
  iterations: number;
  /** max |q(T) − q(0)| / max |q|, after the last iteration. */
  relativeResidual: number;
  /** Residual after each iteration (before its update). */
  residualHistory: number[];
  /** State at t = 0 of the periodic solution. */
  charges: Float64Array;
  reactiveNames: string[];
  /** One period of the probes, from t = 0 to the period. */
  timeS: Float64Array;
  signals: Record<string, Float64Array>;
  newtonIterations: number;
  /** Periods run, with and without sensitivity. */
  periods: number;
  sensitivityPeriods: number;
}

/**
 * Periodic steady state by shooting Newton (T. J. Aprille and T. N. Trick, "Steady-state analysis of
 * nonlinear circuits with periodic inputs", Proc. IEEE 60(1), 1972): find the charges q0 with
 * Φ(q0) = q0, Φ the one-period state transition map, by Newton on Φ(q) − q with the sensitivity matrix
 * ∂Φ/∂q0 propagated along the period through the converged step Jacobians (one extra banded solve per
 * state variable and step). Each period starts with one backward-Euler step (so the state is the charges
 * alone) and continues with the trapezoidal rule on a fixed grid of stepsPerPeriod steps.
 * Newton needs every diode to conduct at its proper phase from the start: give a loaded ladder its
 * charge-balance estimate (steady-state-estimate.ts) as initialCharges, not the ideal no-load state, where
 * the barely conducting diodes leave Φ' − I nearly singular. Converged when the residual and the Newton
 * update are both within relativeTolerance of the state's largest charge.
 */
export function findPeriodicSteadyState(
  circuit: Circuit | MnaSystem,
  options: PeriodicSteadyStateOptions,
): PeriodicSteadyStateResult {
  const sys = 'elements' in circuit ? new MnaSystem(circuit) : circuit;
  const map = new PeriodMap(sys, options);
  const r = map.size;
  const maxIterations = options.maxIterations ?? 30;
  const relTol = options.relativeTolerance ?? 1e-6;
  const state = Float64Array.from(options.initialCharges ?? sys.initialCharge);
  const q0 = map.end;
  const sq = map.sensitivity;
  const probes = options.probes ?? [];
  const probeIndex = probes.map((p) => sys.probeIndex(p));
  const period = (start: Float64Array, withSensitivity: boolean, record: PeriodRecord | null): void =>
    map.run(start, withSensitivity, record);

  const residualOf = (start: Float64Array, end: Float64Array): number => {
    let scale = 0;
    let worst = 0;
    for (let k = 0; k < r; k++) scale = Math.max(scale, Math.abs(start[k]!));
    for (let k = 0; k < r; k++) worst = Math.max(worst, Math.abs(end[k]! - start[k]!));
    return scale > 0 ? worst / scale : worst;
  };

  const history: number[] = [];
  const jac = new Float64Array(r * r);
  const delta = new Float64Array(r);
  const base = new Float64Array(r);
  const baseEnd = new Float64Array(r);
  const baseSq = new Float64Array(r * r);
  const normOf = (start: Float64Array, end: Float64Array): number => {
    let sum = 0;
    for (let k = 0; k < r; k++) sum += (end[k]! - start[k]!) ** 2;
    return sum;
  };
  const scaleOf = (v: Float64Array): number => {
    let m = 0;
    for (let k = 0; k < r; k++) m = Math.max(m, Math.abs(v[k]!));
    return m;
  };
  let residual: number;
  let iterations = 0;
  let isConverged = false;
  let fallbacks = 0;
  // Warm-up periods: leave the kinks of a guessed state (diodes just at conduction) and make the
  // unknowns' guess at t = 0 consistent.
  for (let k = 0; k < (options.warmUpPeriods ?? 2); k++) {
    period(state, false, null);
    state.set(q0);
  }
  period(state, true, null);
  // Newton on G(q) = Φ(q) − q with the exact Jacobian J = ∂Φ/∂q − I, solved directly (not through the
  // normal equations, whose squared condition number stalls on the slow modes of a long ladder), and a
  // backtracking line search on |G|² (J. E. Dennis and R. B. Schnabel, *Numerical Methods for
  // Unconstrained Optimization and Nonlinear Equations*, 1983, §6.3; from memory).
  while (iterations < maxIterations) {
    iterations++;
    const scale = scaleOf(state);
    residual = residualOf(state, q0);
    history.push(residual);
    for (let k = 0; k < r; k++) {
      for (let j = 0; j < r; j++) jac[k * r + j] = sq[j * r + k]! - (j === k ? 1 : 0);
      delta[k] = state[k]! - q0[k]!;
    }
    solveDense(jac, delta, r);
    let stepNorm = 0;
    for (let k = 0; k < r; k++) stepNorm = Math.max(stepNorm, Math.abs(delta[k]!));
    // Converged when both the residual and the Newton update are small against the state: the update
    // bounds the distance to the solution even along slow modes where a small residual does not.
    if (residual <= relTol && stepNorm <= relTol * (scale > 0 ? scale : 1)) {
      isConverged = true;
      break;
    }
    // Stalled: eight iterations that did not cut the residual by a tenth. More of the same costs a full
    // sensitivity period each and does not converge; say so now and leave the answer to the caller.
    if (history.length > 8 && residual > 0.9 * history[history.length - 9]!) break;
    const before = normOf(state, q0);
    base.set(state);
    baseEnd.set(q0);
    baseSq.set(sq);
    // A step no larger than a fraction of the state: far from the solution the Jacobian's slow modes
    // (diodes that barely conduct) make the raw Newton step absurdly long.
    let alpha = Math.min(1, (0.25 * scale) / stepNorm);
    let accepted = false;
    for (let attempt = 0; attempt < 12; attempt++) {
      for (let k = 0; k < r; k++) state[k] = base[k]! + alpha * delta[k]!;
      try {
        period(state, true, null);
        if (normOf(state, q0) <= (1 - 1e-4 * alpha) * before) {
          accepted = true;
          break;
        }
      } catch {
        /* a trial state the stepper cannot follow: shorten the step */
      }
      alpha /= 2;
    }
    if (!accepted) {
      state.set(base);
      q0.set(baseEnd);
      sq.set(baseSq);
      // No descent along the Newton direction (a state far from the solution, where diodes barely
      // conduct): follow the circuit itself for some periods, then try Newton again from there.
      if (++fallbacks > 3) break;
      for (let k = 0; k < 20; k++) {
        period(state, false, null);
        state.set(q0);
      }
      period(state, true, null);
    }
  }
  const time = new SampleBuffer();
  const values = probes.map(() => new SampleBuffer());
  period(state, false, { time, values, probeIndex });
  const finalResidual = residualOf(state, q0);
  const signals: Record<string, Float64Array> = {};
  probes.forEach((p, i) => {
    signals[p] = values[i]!.toArray();
  });
  return {
    isConverged: isConverged || finalResidual <= relTol,
    iterations,
    relativeResidual: finalResidual,
    residualHistory: history,
    charges: state,
    reactiveNames: [...sys.reactiveNames],
    timeS: time.toArray(),
    signals,
    newtonIterations: map.newtonIterations,
    periods: map.periods,
    sensitivityPeriods: map.sensitivityPeriods,
  };
}
