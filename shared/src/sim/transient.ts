import { DomainError } from '../errors';
import type {
  Circuit,
  IntegrationMethod,
  SimulationTolerances,
  TransientOptions,
  TransientResult,
} from './circuit.types';
import { MnaSystem } from './mna-system';

/** SPICE's default tolerances (reltol, vntol, abstol, chgtol, trtol), and its transient Newton limit raised. */
export const DEFAULT_TOLERANCES: SimulationTolerances = {
  relative: 1e-3,
  voltageAbsoluteV: 1e-6,
  currentAbsoluteA: 1e-12,
  chargeAbsoluteC: 1e-14,
  truncationErrorFactor: 7,
  maxNewtonIterations: 40,
};

/**
 * Default truncation-error factor of a circuit with a transistor: SPICE's 7 over 6, a bound six times
 * tighter than SPICE3's. A self-oscillating converter switches where its steps land: with SPICE3's bound
 * alone the blocking oscillator's mean output settles about 5 % from ngspice's on the same netlist
 * (ngspice limits those steps by more than the charge bound; not looked into), with this one within 1 %
 * (test/driver). Diode ladders keep SPICE's bound and SPICE's steps.
 */
const SWITCHING_TRUNCATION_ERROR_FACTOR = 7 / 6;

/**
 * Newton–Raphson at the present integration coefficients until the update is within tolerance and no
 * junction voltage was limited. x holds the initial guess and receives the solution. Returns the number
 * of iterations, or −1 when it did not converge. With `acceptOnDeviceTest`, a solve whose junctions all
 * pass the device test is accepted without the node-voltage test (see below); the shooting method,
 * which differentiates the period map, keeps the full test.
 */
export function solveNewton(
  system: MnaSystem,
  a0: number,
  tolerances: SimulationTolerances,
  maxIterations: number,
  acceptOnDeviceTest = false,
): number {
  const x = system.x;
  const n = system.size;
  let isVoltage: Uint8Array | null = null;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    const limited = system.load(a0);
    const next = system.solveLoaded();
    // Node voltages of a ladder are kilovolts, so reltol on them alone lets a junction move by a volt;
    // SPICE's device test on each junction's current closes that gap (L. W. Nagel, SPICE2, 1975).
    let converged = !limited && system.devicesConverged(next, tolerances.relative, tolerances.currentAbsoluteA);
    if (converged && acceptOnDeviceTest && !system.hasNonlinearCharges) {
      // Every nonlinearity is a junction current and each passed its test, so the linear system just
      // solved is the circuit's own to within the current tolerances: the increment of the linear
      // unknowns (capacitor nodes, branch currents) says nothing more. SPICE's node test would only make
      // an exact linear step, from a predictor that was off, wait one more solve.
      for (let i = 0; i < n; i++) {
        const xn = next[i]!;
        if (!Number.isFinite(xn)) return -1;
        x[i] = xn;
      }
      return iteration;
    }
    isVoltage ??= nodeMask(system);
    for (let i = 0; i < n; i++) {
      const xn = next[i]!;
      if (!Number.isFinite(xn)) return -1;
      if (converged) {
        const xo = x[i]!;
        const tol =
          tolerances.relative * Math.max(Math.abs(xn), Math.abs(xo)) +
          (isVoltage[i] ? tolerances.voltageAbsoluteV : tolerances.currentAbsoluteA * 1e3);
        if (Math.abs(xn - xo) > tol) converged = false;
      }
      x[i] = xn;
    }
    if (converged) return iteration;
  }
  return -1;
}

const masks = new WeakMap<MnaSystem, Uint8Array>();
function nodeMask(system: MnaSystem): Uint8Array {
  let m = masks.get(system);
  if (!m) {
    m = new Uint8Array(system.size).fill(1);
    for (const b of system.branchIndex.values()) m[b] = 0;
    masks.set(system, m);
  }
  return m;
}

/**
 * DC operating point: Newton at t = 0 with capacitors open and windings shorted through their resistance;
 * on failure, gmin stepping (a shunt from every node to ground, 1e-2 S down by decades to none).
 */
export function solveOperatingPoint(system: MnaSystem, timeS: number, tolerances: SimulationTolerances): void {
  system.hist.fill(0);
  system.prepareLinearMatrix(0, timeS);
  system.prepareStepRhs(timeS);
  system.shuntConductanceS = 0;
  if (solveNewton(system, 0, tolerances, 100) > 0) return;
  system.x.fill(0);
  for (let exponent = -2; exponent >= -13; exponent--) {
    system.shuntConductanceS = exponent === -13 ? 0 : 10 ** exponent;
    if (solveNewton(system, 0, tolerances, 100) < 0) {
      system.shuntConductanceS = 0;
      throw new DomainError('not_converged', 'no DC operating point (gmin stepping failed)', null, [
        { path: 'operatingPoint', message: `gmin ${10 ** exponent} S` },
      ]);
    }
  }
  system.shuntConductanceS = 0;
}

/**
 * Time stepper: trapezoidal or second-order Gear (BDF2, variable step) integration with the step chosen
 * from the local truncation error of every charge and flux (the third divided difference, as in SPICE:
 * error constant 1/12 for the trapezoidal rule and 2/9 for Gear-2), landing exactly on source corners and
 * switch events and restarting with one backward-Euler step after each (L. O. Chua and P.-M. Lin,
 * *Computer-Aided Analysis of Electronic Circuits*, 1975, ch. 13; from memory).
 */
export class TransientStepper {
  readonly system: MnaSystem;
  timeS = 0;
  acceptedSteps = 0;
  rejectedSteps = 0;
  newtonIterations = 0;
  maxStepS: number;
  readonly method: IntegrationMethod;
  readonly tolerances: SimulationTolerances;
  /** Charge at the last accepted point and its time derivative; previous points for Gear-2 and the error estimate. */
  q0: Float64Array;
  readonly qd0: Float64Array;
  private qm1: Float64Array;
  private qm2: Float64Array;
  private readonly tHistory = new Float64Array(3);
  private historyCount = 0;
  private x0: Float64Array;
  private xm1: Float64Array;
  private junction0: Float64Array;
  private junctionM1: Float64Array;
  private stepS: number;
  private previousStepS = 0;
  private useBackwardEulerNext = true;
  private nextBreakS: number;
  /** Period of the sources (NaN: none) and the accepted points of the last periods, for the predictor. */
  private readonly periodS: number;
  private readonly lastPeriod: PeriodHistory | null;
  private readonly predictedJunction: Float64Array;
  /** Points of the periodic predictor: t1 − m·T and t0 − m·T for m = 1, 2, … (see PeriodHistory.predict). */
  private readonly periodRefs = new Int32Array(2 * PeriodHistory.PERIODS);

  constructor(
    system: MnaSystem,
    options: {
      maxStepS: number;
      method?: IntegrationMethod;
      tolerances?: Partial<SimulationTolerances>;
      startTimeS?: number;
    },
  ) {
    if (!(options.maxStepS > 0)) throw new DomainError('invalid_argument', 'maxStepS must be positive', 'maxStepS');
    this.system = system;
    this.maxStepS = options.maxStepS;
    this.method = options.method ?? 'trapezoidal';
    this.tolerances = {
      ...DEFAULT_TOLERANCES,
      ...(system.hasTransistors ? { truncationErrorFactor: SWITCHING_TRUNCATION_ERROR_FACTOR } : {}),
      ...options.tolerances,
    };
    const r = system.reactiveCount;
    this.q0 = new Float64Array(r);
    this.qd0 = new Float64Array(r);
    this.qm1 = new Float64Array(r);
    this.qm2 = new Float64Array(r);
    this.x0 = new Float64Array(system.size + 1);
    this.xm1 = new Float64Array(system.size + 1);
    this.junction0 = new Float64Array(system.junctionStateLength);
    this.junctionM1 = new Float64Array(system.junctionStateLength);
    this.timeS = options.startTimeS ?? 0;
    this.stepS = this.maxStepS / 100;
    this.nextBreakS = system.nextBreakpoint(this.timeS);
    this.periodS = system.sourcePeriodS();
    this.lastPeriod = Number.isNaN(this.periodS)
      ? null
      : new PeriodHistory(system.size + 1, system.junctionStateLength, this.periodS);
    this.predictedJunction = new Float64Array(system.junctionStateLength);
  }

  /** Starts from given charges (capacitor charges, winding fluxes) and an unknown vector guess. */
  startFromCharges(charges: Float64Array): void {
    this.q0.set(charges);
    this.qd0.fill(0);
    this.system.x.fill(0);
    this.x0.set(this.system.x);
    this.xm1.set(this.system.x);
    this.system.saveJunctionState(this.junction0);
    this.junctionM1.set(this.junction0);
    this.restart();
  }

  /** Starts from the DC operating point at the present time. */
  startFromOperatingPoint(): void {
    solveOperatingPoint(this.system, this.timeS, this.tolerances);
    this.system.evaluateLinearCharges();
    this.q0.set(this.system.charge);
    this.qd0.fill(0);
    this.x0.set(this.system.x);
    this.xm1.set(this.system.x);
    this.system.saveJunctionState(this.junction0);
    this.junctionM1.set(this.junction0);
    this.restart();
  }

  /**
   * Forgets the integration history (after a discontinuity made by the caller, such as changed charges):
   * the next step is backward Euler and the predictor forgets the last period too.
   */
  restart(): void {
    this.lastPeriod?.clear();
    this.restartAtBreakpoint();
  }

  /** After a source corner: the integration restarts, the last period stays a valid predictor. */
  private restartAtBreakpoint(): void {
    this.historyCount = 0;
    this.useBackwardEulerNext = true;
    this.stepS = Math.min(this.stepS, this.maxStepS / 10);
    this.nextBreakS = this.system.nextBreakpoint(this.timeS);
  }

  /** Advances by one accepted step, not beyond untilS. Returns the new time. */
  step(untilS = Infinity): number {
    const sys = this.system;
    const tol = this.tolerances;
    for (;;) {
      let h = Math.min(this.stepS, this.maxStepS);
      // Step onto the time one period after a point of the last period when that is at most a little
      // shorter than the step wanted, so that the periodic predictor below has a point to start from.
      const past = this.lastPeriod;
      if (past) {
        past.startS = this.timeS;
        past.stepS = h;
      }
      const base = past ? past.findBack(1, false, 0) : -1;
      if (past && base >= 0 && base + 1 < past.count) {
        const lockedS = past.timeAt(base + 1) + this.periodS - this.timeS;
        // A step that already lands there to within rounding stays as it is, so that the matrix G + a0·C
        // of an unchanged step is not rebuilt for a last-bit difference in a0.
        if (lockedS > 0.5 * h && lockedS <= h * (1 + 1e-9) && Math.abs(lockedS - h) > 1e-9 * h) h = lockedS;
      }
      const limitS = Math.min(untilS, this.nextBreakS);
      let landsOnBreak = false;
      if (this.timeS + h >= limitS - 1e-12 * Math.max(h, Math.abs(limitS))) {
        h = limitS - this.timeS;
        landsOnBreak = limitS === this.nextBreakS;
      } else if (this.timeS + 2 * h > limitS) {
        h = (limitS - this.timeS) / 2;
      }
      if (!(h > 0))
        throw new DomainError('not_converged', 'time step collapsed', null, [
          { path: 'timeS', message: String(this.timeS) },
        ]);
      const t1 = this.timeS + h;
      const isEuler = this.useBackwardEulerNext || this.historyCount < 1;
      const a0 = this.setHistory(h, isEuler);
      sys.prepareLinearMatrix(a0, t1);
      sys.prepareStepRhs(t1);
      const x = sys.x;
      if (past) {
        past.endS = t1;
        past.stepS = h;
      }
      const next = past && base >= 0 ? past.findBack(1, true, 1) : -1;
      const pj = this.predictedJunction;
      if (next >= 0) {
        // Periodic predictor: the point one period back, moved by the drift since then,
        // x(t1 − T) + (x(t0) − x(t0 − T)), and with more periods kept the drift itself extrapolated from
        // one period to the next. A multiplier charging up or settling is a periodic waveform on a slow drift,
        // so this foresees each diode's conduction pulse, which an extrapolation of the last two points
        // cannot.
        let periods = 1;
        const refs = this.periodRefs;
        refs[0] = next;
        refs[1] = base;
        while (periods < PeriodHistory.PERIODS) {
          const n = past!.findBack(periods + 1, true, 2 * periods);
          const b = n >= 0 ? past!.findBack(periods + 1, false, 2 * periods + 1) : -1;
          if (b < 0) break;
          refs[2 * periods] = n;
          refs[2 * periods + 1] = b;
          periods++;
        }
        past!.predict(refs, periods, this.x0, x, sys.size, this.junction0, pj);
        sys.predictJunctions(this.junction0, pj);
      } else if (this.acceptedSteps > 1 && this.previousStepS > 0 && !isEuler) {
        // Linear extrapolation of the last two points.
        const ratio = h / this.previousStepS;
        for (let i = 0; i < sys.size; i++) x[i] = this.x0[i]! + ratio * (this.x0[i]! - this.xm1[i]!);
        for (let k = 0; k < pj.length; k++)
          pj[k] = this.junction0[k]! + ratio * (this.junction0[k]! - this.junctionM1[k]!);
        sys.predictJunctions(this.junction0, pj);
      } else x.set(this.x0);
      const iterations = solveNewton(sys, a0, tol, tol.maxNewtonIterations, true);
      if (iterations < 0) {
        this.rejectedSteps++;
        sys.restoreJunctionState(this.junction0);
        x.set(this.x0);
        this.stepS = h / 8;
        this.useBackwardEulerNext = true;
        if (this.stepS < this.maxStepS * 1e-9) {
          throw new DomainError('not_converged', `Newton iteration failed at t = ${this.timeS} s`, null, [
            { path: 'timeS', message: String(this.timeS) },
          ]);
        }
        continue;
      }
      this.newtonIterations += iterations;
      sys.evaluateLinearCharges();
      const q1 = sys.charge;
      // Local truncation error from the third divided difference of each charge.
      let hNew = Infinity;
      if (!isEuler && this.historyCount >= 3) {
        const t0 = this.timeS;
        const tm1 = this.tHistory[1]!;
        const tm2 = this.tHistory[2]!;
        const factor = this.method === 'trapezoidal' ? 1 / 12 : 2 / 9;
        const hist = sys.hist;
        // Divided differences with the step reciprocals formed once; the bound on h² is minimized over the
        // charges and its root taken once.
        const r10 = 1 / (t1 - t0);
        const r01 = 1 / (t0 - tm1);
        const r12 = 1 / (tm1 - tm2);
        const s1 = 1 / (t1 - tm1);
        const s2 = 1 / (t0 - tm2);
        // SPICE3's bound (cktterr): the error constant times the third divided difference itself, not
        // times the third derivative it estimates (6·DD3), so that SPICE's tolerances give SPICE's steps.
        const s3 = factor / (t1 - tm2);
        const chargeScale = tol.relative / h;
        let boundH2 = Infinity;
        const q0 = this.q0;
        const qm1 = this.qm1;
        const qm2 = this.qm2;
        const qd0 = this.qd0;
        for (let k = 0; k < sys.reactiveCount; k++) {
          const qa = q1[k]!;
          const qb = q0[k]!;
          const qc = qm1[k]!;
          const qe = qm2[k]!;
          const d1a = (qa - qb) * r10;
          const d1b = (qb - qc) * r01;
          const d1c = (qc - qe) * r12;
          const err = Math.abs((d1a - d1b) * s1 - (d1b - d1c) * s2) * s3;
          if (!(err > 0)) continue;
          const i1 = a0 * qa + hist[k]!;
          const currentTol = tol.currentAbsoluteA + tol.relative * Math.max(Math.abs(i1), Math.abs(qd0[k]!));
          const chargeTol = chargeScale * Math.max(Math.abs(qa), Math.abs(qb), tol.chargeAbsoluteC);
          const allowed = tol.truncationErrorFactor * Math.max(currentTol, chargeTol);
          if (allowed < boundH2 * err) boundH2 = allowed / err;
        }
        hNew = Math.sqrt(boundH2);
        if (hNew < 0.9 * h) {
          this.rejectedSteps++;
          sys.restoreJunctionState(this.junction0);
          x.set(this.x0);
          this.stepS = Math.max(hNew, h / 4);
          continue;
        }
      }
      // Accept.
      this.acceptStep(t1, h, a0);
      this.stepS = Math.min(this.maxStepS, 2 * h, hNew);
      if (landsOnBreak) {
        // A switch event changes the circuit, so the last period no longer predicts the next one.
        if (this.system.hasSwitchEventIn(t1 - h, t1)) this.lastPeriod?.clear();
        this.restartAtBreakpoint();
      } else {
        this.useBackwardEulerNext = false;
      }
      return this.timeS;
    }
  }

  /** Sets sys.hist for a step of length h and returns a0 (i = a0·q + hist). */
  private setHistory(h: number, isEuler: boolean): number {
    const hist = this.system.hist;
    const r = this.system.reactiveCount;
    const q0 = this.q0;
    if (isEuler) {
      const a0 = 1 / h;
      for (let k = 0; k < r; k++) hist[k] = -a0 * q0[k]!;
      return a0;
    }
    if (this.method === 'trapezoidal') {
      const a0 = 2 / h;
      const qd0 = this.qd0;
      for (let k = 0; k < r; k++) hist[k] = -a0 * q0[k]! - qd0[k]!;
      return a0;
    }
    const rho = h / this.previousStepS;
    const a0 = (1 + 2 * rho) / ((1 + rho) * h);
    const a1 = -(1 + rho) / h;
    const a2 = (rho * rho) / ((1 + rho) * h);
    const qm1 = this.qm1;
    for (let k = 0; k < r; k++) hist[k] = a1 * q0[k]! + a2 * qm1[k]!;
    return a0;
  }

  private acceptStep(t1: number, h: number, a0: number): void {
    const sys = this.system;
    const q1 = sys.charge;
    const hist = sys.hist;
    // The older points move by exchanging buffers; only the new one is copied.
    const oldest = this.qm2;
    this.qm2 = this.qm1;
    this.qm1 = this.q0;
    this.q0 = oldest;
    const q0 = this.q0;
    const qd0 = this.qd0;
    for (let k = 0; k < sys.reactiveCount; k++) {
      const q = q1[k]!;
      q0[k] = q;
      qd0[k] = a0 * q + hist[k]!;
    }
    this.tHistory[2] = this.tHistory[1]!;
    this.tHistory[1] = this.timeS;
    this.tHistory[0] = t1;
    this.historyCount = Math.min(3, this.historyCount + 1);
    const xOld = this.xm1;
    this.xm1 = this.x0;
    this.x0 = xOld;
    this.x0.set(sys.x);
    const jOld = this.junctionM1;
    this.junctionM1 = this.junction0;
    this.junction0 = jOld;
    sys.saveJunctionState(this.junction0);
    this.lastPeriod?.push(t1, sys.x, this.junction0, t1 - PeriodHistory.PERIODS * this.periodS);
    this.previousStepS = h;
    this.timeS = t1;
    this.acceptedSteps++;
    if (t1 >= this.nextBreakS - 1e-12 * Math.max(h, Math.abs(t1))) this.nextBreakS = sys.nextBreakpoint(t1);
  }

  /** Value of unknown `index` (node voltage or branch current) at the present time. */
  value(index: number): number {
    return this.system.x[index]!;
  }
}

/**
 * Accepted points (time, unknowns, junction state) of at least the last PERIODS periods, oldest first,
 * for the periodic predictor. A ring that grows while they do not fit, up to MAX_POINTS.
 */
class PeriodHistory {
  /** Periods kept: the drift from one period to the next is extrapolated by a polynomial through them. */
  static readonly PERIODS = 3;
  private static readonly MAX_POINTS = 1 << 15;
  private capacity = 256;
  private start = 0;
  count = 0;
  /** Points pushed since the last clear; a point's sequence number is its place in that count. */
  private pushed = 0;
  /** Sequence numbers of the last points found, by the caller's slot (see find). */
  private readonly hints = new Float64Array(2 * PeriodHistory.PERIODS).fill(-1);
  private times = new Float64Array(this.capacity);
  private xs: Float64Array;
  private js: Float64Array;

  /** The step being taken, from startS to endS, of length stepS (set by the stepper before findBack). */
  startS = 0;
  endS = 0;
  stepS = 0;

  constructor(
    private readonly xLength: number,
    private readonly jLength: number,
    private readonly periodS: number,
  ) {
    this.xs = new Float64Array(this.capacity * xLength);
    this.js = new Float64Array(this.capacity * jLength);
  }

  clear(): void {
    this.start = 0;
    this.count = 0;
    this.pushed = 0;
    this.hints.fill(-1);
  }

  private slot(i: number): number {
    const p = this.start + i;
    return p >= this.capacity ? p - this.capacity : p;
  }

  timeAt(i: number): number {
    return this.times[this.slot(i)]!;
  }

  /** Appends a point; drops the oldest once the rest still reach back to keepFromS. */
  push(timeS: number, x: Float64Array, junction: Float64Array, keepFromS: number): void {
    if (this.count === this.capacity) {
      if (this.timeAt(1) <= keepFromS) {
        this.start = this.slot(1);
        this.count--;
      } else if (this.capacity < PeriodHistory.MAX_POINTS) this.grow();
      else {
        // More points per period than kept: give the predictor up until a period fits again.
        this.clear();
      }
    }
    const s = this.slot(this.count);
    this.times[s] = timeS;
    // x and junction are exactly xLength and jLength long (the stepper's own vectors).
    this.xs.set(x, s * this.xLength);
    this.js.set(junction, s * this.jLength);
    this.count++;
    this.pushed++;
  }

  private grow(): void {
    const capacity = 2 * this.capacity;
    const times = new Float64Array(capacity);
    const xs = new Float64Array(capacity * this.xLength);
    const js = new Float64Array(capacity * this.jLength);
    for (let i = 0; i < this.count; i++) {
      const s = this.slot(i);
      times[i] = this.times[s]!;
      xs.set(this.xs.subarray(s * this.xLength, (s + 1) * this.xLength), i * this.xLength);
      js.set(this.js.subarray(s * this.jLength, (s + 1) * this.jLength), i * this.jLength);
    }
    this.capacity = capacity;
    this.times = times;
    this.xs = xs;
    this.js = js;
    this.start = 0;
  }

  /**
   * Index of the stored point `periods` periods before the step's end (atEnd) or start, to within 1e-6 of
   * the step, or −1. The times come from the fields, not arguments, so that no double is boxed on the way.
   * Each kind of point has its own `slot` (0 … 2·PERIODS − 1): the point after the last one found there is
   * tried first, and the search only runs when that misses.
   */
  findBack(periods: number, atEnd: boolean, slot: number): number {
    if (this.count === 0) return -1;
    const timeS = (atEnd ? this.endS : this.startS) - periods * this.periodS;
    const tolerance = 1e-6 * this.stepS;
    const first = this.pushed - this.count;
    const hinted = this.hints[slot]! - first;
    for (let i = hinted + 1; i >= hinted && i >= 0; i--) {
      if (i < this.count && Math.abs(this.timeAt(i) - timeS) <= tolerance) {
        this.hints[slot] = first + i;
        return i;
      }
    }
    const found = this.search(timeS, tolerance);
    if (found >= 0) this.hints[slot] = first + found;
    return found;
  }

  private search(timeS: number, tolerance: number): number {
    let lo = 0;
    let hi = this.count - 1;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (this.timeAt(mid) < timeS) lo = mid + 1;
      else hi = mid;
    }
    if (Math.abs(this.timeAt(lo) - timeS) <= tolerance) return lo;
    if (lo > 0 && Math.abs(this.timeAt(lo - 1) - timeS) <= tolerance) return lo - 1;
    return -1;
  }

  /**
   * The periodic prediction of the first n unknowns and of the junction state, from the stored points
   * refs[2m − 2] at t1 − m·T and refs[2m − 1] at t0 − m·T, m = 1 … periods: the drift over one period,
   * d(m) = x(t1 − m·T) − x(t0 − m·T), extrapolated to the present period by the polynomial through the
   * last `periods` of them (weights 1; 2, −1; 3, −3, 1), plus x0.
   */
  predict(
    refs: Int32Array,
    periods: number,
    x0: Float64Array,
    x: Float64Array,
    n: number,
    junction0: Float64Array,
    junction: Float64Array,
  ): void {
    this.extrapolate(this.xs, this.xLength, refs, periods, x0, x, n);
    this.extrapolate(this.js, this.jLength, refs, periods, junction0, junction, this.jLength);
  }

  private extrapolate(
    stored: Float64Array,
    stride: number,
    refs: Int32Array,
    periods: number,
    now: Float64Array,
    into: Float64Array,
    n: number,
  ): void {
    const n1 = this.slot(refs[0]!) * stride;
    const b1 = this.slot(refs[1]!) * stride;
    if (periods === 1) {
      for (let i = 0; i < n; i++) into[i] = now[i]! + stored[n1 + i]! - stored[b1 + i]!;
      return;
    }
    const n2 = this.slot(refs[2]!) * stride;
    const b2 = this.slot(refs[3]!) * stride;
    if (periods === 2) {
      for (let i = 0; i < n; i++)
        into[i] = now[i]! + 2 * (stored[n1 + i]! - stored[b1 + i]!) - (stored[n2 + i]! - stored[b2 + i]!);
      return;
    }
    const n3 = this.slot(refs[4]!) * stride;
    const b3 = this.slot(refs[5]!) * stride;
    for (let i = 0; i < n; i++)
      into[i] =
        now[i]! +
        3 * (stored[n1 + i]! - stored[b1 + i]! - stored[n2 + i]! + stored[b2 + i]!) +
        (stored[n3 + i]! - stored[b3 + i]!);
  }
}

/** Growable Float64Array for recorded waveforms. */
export class SampleBuffer {
  private data = new Float64Array(1024);
  length = 0;
  push(v: number): void {
    if (this.length === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.length++] = v;
  }
  toArray(): Float64Array {
    return this.data.slice(0, this.length);
  }
}

/**
 * Transient analysis of a circuit from 0 to stopTimeS; records each accepted point of the probes.
 * Units: seconds, volts, amperes. Methods: see TransientStepper.
 */
export function simulateTransient(circuit: Circuit, options: TransientOptions): TransientResult {
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, options);
  if ((options.startFrom ?? 'element-initial-conditions') === 'operating-point') stepper.startFromOperatingPoint();
  else stepper.startFromCharges(system.initialCharge);
  const probes = options.probes ?? [...system.nodeIndex.keys()];
  const indices = probes.map((p) => system.probeIndex(p));
  const recordFromS = options.recordFromS ?? 0;
  const time = new SampleBuffer();
  const buffers = probes.map(() => new SampleBuffer());
  const record = (): void => {
    if (stepper.timeS < recordFromS) return;
    time.push(stepper.timeS);
    indices.forEach((index, i) => buffers[i]!.push(system.x[index]!));
  };
  if ((options.startFrom ?? 'element-initial-conditions') === 'operating-point') record();
  while (stepper.timeS < options.stopTimeS * (1 - 1e-12)) {
    stepper.step(options.stopTimeS);
    record();
  }
  const signals: Record<string, Float64Array> = {};
  probes.forEach((p, i) => {
    signals[p] = buffers[i]!.toArray();
  });
  return {
    timeS: time.toArray(),
    signals,
    acceptedSteps: stepper.acceptedSteps,
    rejectedSteps: stepper.rejectedSteps,
    newtonIterations: stepper.newtonIterations,
  };
}
