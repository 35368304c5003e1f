import { DomainError } from '../errors';
import type { IntegrationMethod, SimulationTolerances } from './circuit.types';
import type { MnaSystem } from './mna-system';
import { solveNewton } from './newton';
import { solveOperatingPoint } from './operating-point';
import { PeriodHistory } from './period-history';
import { DEFAULT_TOLERANCES } from './tolerances';

/**
 * Default truncation-error factor of a circuit with a transistor: SPICE's 7 over 6, a bound six times
 * tighter than SPICE3's. A self-oscillating converter switches where its steps land: with SPICE3's bound
 * alone the blocking oscillator's mean output settles about 5 % from ngspice's on the same netlist
 * (ngspice limits those steps by more than the charge bound; not looked into), with this one within 1 %
 * (test/driver). Diode ladders keep SPICE's bound and SPICE's steps.
 */
const SWITCHING_TRUNCATION_ERROR_FACTOR = 7 / 6;

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
      : new PeriodHistory(
          system.size + 1,
          system.junctionStateLength,
          this.periodS,
          Math.ceil(this.periodS / this.maxStepS),
        );
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
      } else if (past && base < 0) {
        // Off the last period's points (a step there was cut short): land on the next of them, so that the
        // steps after it have the periodic predictor again instead of running off it to the period's end.
        const ahead = past.nextAfterStart(1, 1e-6 * h);
        const lockedS = ahead >= 0 ? past.timeAt(ahead) + this.periodS - this.timeS : NaN;
        if (lockedS > 0.5 * h && lockedS <= h) h = lockedS;
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
      this.predict(past, base, h, isEuler);
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
      const hNew = !isEuler && this.historyCount >= 3 ? this.truncationStepBoundS(t1, h, a0) : Infinity;
      if (hNew < 0.9 * h) {
        this.rejectedSteps++;
        sys.restoreJunctionState(this.junction0);
        x.set(this.x0);
        this.stepS = Math.max(hNew, h / 4);
        continue;
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

  /**
   * Puts the predicted solution of a step of length h into the system's unknowns and junction state:
   * the periodic predictor when the last period has a point to start from, else a linear extrapolation of
   * the last two points, else the last point.
   */
  private predict(past: PeriodHistory | null, base: number, h: number, isEuler: boolean): void {
    const sys = this.system;
    const x = sys.x;
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
  }

  /**
   * Step the charges' local truncation error allows (SPICE3's cktterr bound), from the third divided
   * difference of each charge over the new point and the last three.
   */
  private truncationStepBoundS(t1: number, h: number, a0: number): number {
    const sys = this.system;
    const tol = this.tolerances;
    const q1 = sys.charge;
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
    return Math.sqrt(boundH2);
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
