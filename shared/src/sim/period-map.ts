import { DomainError } from '../errors';
import type { SimulationTolerances } from './circuit.types';
import type { MnaSystem } from './mna-system';
import { solveNewton } from './newton';
import type { SampleBuffer } from './sample-buffer';
import { DEFAULT_TOLERANCES } from './tolerances';

export interface PeriodMapOptions {
  periodS: number;
  /** Fixed steps per period (the map must be the same function at every call). */
  stepsPerPeriod: number;
  tolerances?: Partial<SimulationTolerances>;
  /** Unknown (MnaSystem.probeIndex) whose mean over each period is kept in `probeMean`. */
  meanProbeIndex?: number;
  /**
   * Integration after the first backward-Euler step: 'trapezoidal' (the default, as the transient and
   * SPICE) or 'gear2', the second-order backward difference q′ = (3q₁ − 4q₀ + q₋₁)/(2h), which damps the
   * stiff modes where the trapezoidal rule lets them ring (C. W. Gear, Numerical Initial Value Problems in
   * Ordinary Differential Equations, 1971, from memory).
   */
  integration?: 'trapezoidal' | 'gear2';
}

/** Probes recorded along one period: time and one buffer per probe index. */
export interface PeriodRecord {
  time: SampleBuffer;
  values: SampleBuffer[];
  probeIndex: ReadonlyArray<number>;
}

/**
 * The one-period state transition map Φ of a circuit with a periodic source, on its reactive charges and
 * fluxes (MnaSystem reactive order): q(T) = Φ(q(0)), and optionally its sensitivity ∂Φ/∂q(0) propagated
 * along the period through the converged step Jacobians (one extra banded solve per state variable and
 * step; T. J. Aprille and T. N. Trick, Proc. IEEE 60(1), 1972). Each period starts with one backward-Euler
 * step (so the state is the charges alone) and continues with the trapezoidal rule on a fixed grid.
 * The map is evaluated far more tightly than a shooting residual needs (relative 1e-8 inside each step),
 * or a Newton iteration on it chases the inner iteration's noise. A step is accepted on the solve after an
 * update within tolerance, whose own error is of the order of the update squared (Newton with the exact
 * Jacobian), so the noise left in the map is far below the tolerance itself. The absolute current
 * tolerance (1e-5 A) bounds SPICE's device test g·Δu of a conducting diode, where g ≈ 1/Rs makes it a
 * test of Δu to about 1e-5 V; at 1e-9 A it asked a nanovolt of the terminals, one solve more per
 * conducting step for nothing the charges can show.
 */
export class PeriodMap {
  readonly size: number;
  /** q(T) of the last call. */
  readonly end: Float64Array;
  /** ∂q(T)/∂q(0) of the last call with sensitivity: entry (k, j) at [j·size + k]. */
  readonly sensitivity: Float64Array;
  /** Mean of the `meanProbeIndex` unknown over the last period (the step ends, which for a periodic wave is the trapezoidal mean). */
  probeMean = NaN;
  /** Periods run so far, and of them with sensitivity. */
  periods = 0;
  sensitivityPeriods = 0;
  /** Inner Newton iterations so far. */
  newtonIterations = 0;
  private readonly tol: SimulationTolerances;
  private readonly stepS: number;
  private readonly steps: number;
  private readonly qd: Float64Array;
  private readonly sqd: Float64Array;
  private readonly w: Float64Array;
  private readonly xStart: Float64Array;
  private readonly guess: Float64Array;
  /** The last run's solution at every step, and the present run's deviation from it at the last step. */
  private readonly trajectory: Float64Array;
  private readonly deviation: Float64Array;
  private hasTrajectory = false;
  private readonly looseTol: SimulationTolerances;
  private readonly meanProbe: number;
  private readonly isGear: boolean;
  /** Gear 2: the charges one step back, and their sensitivity. */
  private readonly qPrev: Float64Array;
  private readonly sqPrev: Float64Array;

  constructor(
    readonly system: MnaSystem,
    options: PeriodMapOptions,
  ) {
    const n = options.stepsPerPeriod;
    if (!(n >= 4) || !(options.periodS > 0))
      throw new DomainError('invalid_argument', 'need a positive period and at least 4 steps', 'stepsPerPeriod');
    this.tol = {
      ...DEFAULT_TOLERANCES,
      relative: 1e-8,
      voltageAbsoluteV: 1e-9,
      currentAbsoluteA: 1e-5,
      ...options.tolerances,
    };
    this.looseTol = loosened(this.tol);
    const r = system.reactiveCount;
    this.size = r;
    this.guess = new Float64Array(system.size + 1);
    this.trajectory = new Float64Array(n * (system.size + 1));
    this.deviation = new Float64Array(system.size + 1);
    this.steps = n;
    this.stepS = options.periodS / n;
    this.end = new Float64Array(r);
    this.sensitivity = new Float64Array(r * r);
    this.qd = new Float64Array(r);
    this.sqd = new Float64Array(r * r);
    this.w = new Float64Array((system.size + 1) * r);
    this.xStart = new Float64Array(system.size + 1);
    this.meanProbe = options.meanProbeIndex ?? -1;
    this.isGear = options.integration === 'gear2';
    this.qPrev = new Float64Array(r);
    this.sqPrev = new Float64Array(this.isGear ? r * r : 0);
  }

  /** One period from q(0) = start: q(T) into `end`, and with `withSensitivity` ∂q(T)/∂q(0) into `sensitivity`. */
  run(start: Float64Array, withSensitivity: boolean, record: PeriodRecord | null = null): void {
    const sys = this.system;
    const r = this.size;
    const h = this.stepS;
    const q0 = this.end;
    const qd0 = this.qd;
    const sq = this.sensitivity;
    const sqd = this.sqd;
    const x = sys.x;
    const hist = sys.hist;
    const charge = sys.charge;
    q0.set(start);
    qd0.fill(0);
    sys.x.set(this.xStart);
    const width = sys.size + 1;
    const trajectory = this.trajectory;
    const deviation = this.deviation;
    const isPredicted = this.hasTrajectory;
    deviation.fill(0);
    if (withSensitivity) {
      sq.fill(0);
      for (let k = 0; k < r; k++) sq[k * r + k] = 1;
      sqd.fill(0);
    }
    let probeSum = 0;
    this.periods++;
    if (withSensitivity) this.sensitivityPeriods++;
    if (record) {
      record.time.push(0);
      record.probeIndex.forEach((p, i) => record.values[i]!.push(sys.x[p]!));
    }
    const isGear = this.isGear;
    const qPrev = this.qPrev;
    for (let step = 0; step < this.steps; step++) {
      const isEuler = step === 0;
      const a0 = isEuler ? 1 / h : isGear ? 1.5 / h : 2 / h;
      if (isEuler) for (let k = 0; k < r; k++) hist[k] = -a0 * q0[k]!;
      else if (isGear) for (let k = 0; k < r; k++) hist[k] = (-2 * q0[k]! + 0.5 * qPrev[k]!) / h;
      else for (let k = 0; k < r; k++) hist[k] = -a0 * q0[k]! - qd0[k]!;
      const t1 = (step + 1) * h;
      sys.prepareLinearMatrix(a0, t1);
      sys.prepareStepRhs(t1);
      // Guess: the last run at this step moved by the present run's deviation from it at the step before
      // (runs from nearby states follow nearly the same trajectory).
      if (isPredicted) for (let i = 0, o = step * width; i < width; i++) x[i] = trajectory[o + i]! + deviation[i]!;
      this.guess.set(sys.x);
      let it = solveNewton(sys, a0, this.tol, 100);
      if (it < 0) {
        // At kilovolt nodes the banded solve's rounding can keep a barely conducting diode's current test
        // from ever passing at 1e-9: retry the step at tolerances a thousand times looser.
        sys.x.set(this.guess);
        it = solveNewton(sys, a0, this.looseTol, 100);
      }
      if (it < 0)
        throw new DomainError('not_converged', `Newton failed inside the shooting period at t = ${t1} s`, null, [
          { path: 'timeS', message: String(t1) },
        ]);
      this.newtonIterations += it;
      for (let i = 0, o = step * width; i < width; i++) {
        deviation[i] = x[i]! - trajectory[o + i]!;
        trajectory[o + i] = x[i]!;
      }
      sys.evaluateLinearCharges();
      if (withSensitivity) this.propagateSensitivity(a0, isEuler);
      if (isGear) qPrev.set(q0);
      for (let k = 0; k < r; k++) {
        const q1 = charge[k]!;
        qd0[k] = a0 * q1 + hist[k]!;
        q0[k] = q1;
      }
      if (this.meanProbe >= 0) probeSum += x[this.meanProbe]!;
      // x at the period's end is a fine guess for the next period's first step.
      if (step === this.steps - 1) this.xStart.set(sys.x);
      if (record) {
        record.time.push(t1);
        record.probeIndex.forEach((p, i) => record.values[i]!.push(sys.x[p]!));
      }
    }
    this.probeMean = probeSum / this.steps;
    this.hasTrajectory = true;
  }

  /**
   * One step of the sensitivity: the Jacobian at the converged point, then ∂x1/∂q0 column by column (one
   * banded solve each) and from it the charges' sensitivity, in place of the last step's.
   */
  private propagateSensitivity(a0: number, isEuler: boolean): void {
    const sys = this.system;
    const r = this.size;
    const sq = this.sensitivity;
    const sqd = this.sqd;
    const w = this.w;
    const size = sys.size;
    const rowA = sys.reactiveRowA;
    const rowB = sys.reactiveRowB;
    const start = sys.gradientStart;
    const index = sys.gradientIndex;
    const value = sys.gradientValue;
    const isGear = this.isGear;
    const sqPrev = this.sqPrev;
    const h = this.stepS;
    sys.load(a0);
    sys.lu.factor();
    // The history's sensitivity, dHist = ∂hist/∂q0, into sqd (kept there until the new charge sensitivity
    // is known), column by column.
    const n = r * r;
    if (isEuler) {
      for (let e = 0; e < n; e++) sqd[e] = -a0 * sq[e]!;
      if (isGear) sqPrev.set(sq);
    } else if (isGear)
      for (let e = 0; e < n; e++) {
        const s0 = sq[e]!;
        sqd[e] = (-2 * s0 + 0.5 * sqPrev[e]!) / h;
        sqPrev[e] = s0;
      }
    else for (let e = 0; e < n; e++) sqd[e] = -a0 * sq[e]! - sqd[e]!;
    // Right-hand sides by rows (entry (unknown, j) at unknown·r + j), all r solved in one pass.
    w.fill(0);
    for (let k = 0; k < r; k++) {
      const a = rowA[k]! * r;
      const b = rowB[k]! * r;
      for (let j = 0, e = k; j < r; j++, e += r) {
        const dHist = sqd[e]!;
        w[a + j]! -= dHist;
        w[b + j]! += dHist;
      }
    }
    sys.lu.solveColumns(w, r);
    // The ground row took the stamps into the ground: it is 0.
    w.fill(0, size * r, (size + 1) * r);
    for (let k = 0; k < r; k++) {
      const from = start[k]!;
      const to = start[k + 1]!;
      if (to - from === 2) {
        // A capacitor: C·Va − C·Vb.
        const va = value[from]!;
        const vb = value[from + 1]!;
        const ia = index[from]! * r;
        const ib = index[from + 1]! * r;
        for (let j = 0, e = k; j < r; j++, e += r) {
          const dq = va * w[ia + j]! + vb * w[ib + j]!;
          sq[e] = dq;
          sqd[e] = a0 * dq + sqd[e]!;
        }
        continue;
      }
      for (let j = 0, e = k; j < r; j++, e += r) {
        let dq = 0;
        for (let p = from; p < to; p++) dq += value[p]! * w[index[p]! * r + j]!;
        sq[e] = dq;
        sqd[e] = a0 * dq + sqd[e]!;
      }
    }
  }
}

/** The same tolerances a thousand times looser (the retry of a step whose tight test rounding keeps failing). */
function loosened(tol: SimulationTolerances): SimulationTolerances {
  return {
    ...tol,
    relative: tol.relative * 1e3,
    voltageAbsoluteV: tol.voltageAbsoluteV * 1e3,
    currentAbsoluteA: tol.currentAbsoluteA * 1e3,
  };
}
