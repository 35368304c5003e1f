import { EnergyMeter, type EnergyAccount } from '../sim/energy-meter';
import { readSettlingTimes } from '../sim/oscillation-measures';
import { SampleBuffer } from '../sim/sample-buffer';
import { pushTurnOn, type DriverRunFrame } from './driver-run-frame';

export interface SettlingOptions {
  /** Settled when the projected remaining change of the output's window mean is below this fraction. */
  settleFraction: number;
  /** Length of a settling window (K estimated oscillation periods), s. */
  windowS: number;
  /** Simulated-time budget, s (the fixed window's length when `isFixedWindow`). */
  maxTimeS: number;
  /** Run exactly `maxTimeS`, windows closing at their ends, no settling test. */
  isFixedWindow: boolean;
  /** Extrapolate the slow charging mode when its decay is clean (a warm start). */
  canExtrapolate: boolean;
  /** Called with the completed share of this phase, 0..1. */
  onShare: (share: number) => void;
}

/**
 * The settling phase of a driver run (see runDriverDesign): window means of the output over whole
 * oscillation periods, the settling test on them (Aitken's Δ² projection of a geometric decay) and the
 * envelope extrapolation of the ladder charges. Volts, seconds.
 */
export class DriverSettling {
  /** Every step's time and output (ladder top), s and V. */
  readonly time = new SampleBuffer();
  readonly topV = new SampleBuffer();
  /** The output's mean over each window, V. */
  readonly means: number[] = [];
  extrapolations = 0;
  isSettled = false;
  /** Oscillation frequency over the last window with two turn-ons or more, Hz. */
  lastWindowFrequencyHz: number | null = null;
  private meter: EnergyMeter;
  private isMeterStale = true;
  private capMeans: number[][] = [];
  private sinceJump = 0;
  private firstProjection: number | null = null;
  private prevT = 0;
  private prevV: number;
  private lastTurnOnS = NaN;
  private windowFirstTurnOnS = NaN;
  private windowTurnOns = 0;
  private windowStartS = 0;
  private area = 0;
  private capArea: number[];
  private readonly ratios: number[] = [];
  private slowestRatio = 0;

  constructor(
    private readonly frame: DriverRunFrame,
    private readonly options: SettlingOptions,
  ) {
    // The account opens after the first step: before it the unknowns are a zero guess, not the initial state.
    this.meter = new EnergyMeter(frame.circuit, frame.system);
    this.prevV = frame.system.x[frame.probes.top]!;
    this.capArea = frame.capsF.map(() => 0);
  }

  /** Runs window after window until the output settles or the time budget is spent. */
  run(): void {
    const { stepper } = this.frame;
    const { windowS, maxTimeS, isFixedWindow } = this.options;
    let windowIndex = 0;
    while (stepper.timeS < maxTimeS * (1 - 1e-12) && !this.isSettled) {
      windowIndex++;
      this.runWindow(Math.min(windowIndex * windowS, maxTimeS));
      if (this.windowTurnOns > 0)
        this.lastWindowFrequencyHz = this.windowTurnOns / (this.lastTurnOnS - this.windowFirstTurnOnS);
      this.sinceJump++;
      if (isFixedWindow || this.sinceJump < 3) this.options.onShare(stepper.timeS / maxTimeS);
      else this.judgeWindow();
    }
  }

  /**
   * When the output's window mean, at its window's close, first reached 90 % of the settled (last) mean,
   * interpolated between window closes (never the window length), s.
   */
  timeTo90PercentS(): number | null {
    const { windowS, maxTimeS } = this.options;
    const means = this.means;
    const closes = means.map((_, i) => Math.min((i + 1) * windowS, maxTimeS));
    return readSettlingTimes(closes, means, means[means.length - 1]!).to90S;
  }

  /** Energy drawn, dissipated and stored since the start or the last extrapolation, J. */
  energy(): EnergyAccount {
    return this.meter.account();
  }

  /**
   * Steps to the end of one window. A window closes at the first cycle mark of the turn-on trigger after
   * `end` (the end of a turn-on's conduction pulse, turn-on-events.ts), so each window mean is a mean over whole oscillation periods (the cycle
   * mean); a fixed window closes at `end`.
   */
  private runWindow(end: number): void {
    const { circuit, system, stepper, checkCancel } = this.frame;
    this.windowFirstTurnOnS = NaN;
    this.windowTurnOns = 0;
    let isClosed = false;
    while (!isClosed) {
      checkCancel();
      stepper.step(this.options.isFixedWindow || stepper.timeS < end * (1 - 1e-12) ? end : Infinity);
      if (this.isMeterStale) {
        // An extrapolation moved charge that no source supplied: the account restarts after it.
        this.meter = new EnergyMeter(circuit, system);
        this.isMeterStale = false;
      }
      this.meter.record(stepper.timeS);
      isClosed = this.integrateStep(end);
    }
  }

  /** Adds the step just taken to the window's integrals; true when it closed the window. */
  private integrateStep(end: number): boolean {
    const { system, stepper, probes, capIndex, capsF } = this.frame;
    const { isFixedWindow, maxTimeS } = this.options;
    const v = system.x[probes.top]!;
    const dt = stepper.timeS - this.prevT;
    const fired = pushTurnOn(this.frame);
    if (!Number.isNaN(fired)) {
      this.lastTurnOnS = fired;
      if (Number.isNaN(this.windowFirstTurnOnS)) this.windowFirstTurnOnS = fired;
      else this.windowTurnOns++;
    }
    const isCrossing = stepper.timeS >= end * (1 - 1e-12) && !Number.isNaN(fired) && !isFixedWindow;
    // Fraction of this step before the cycle mark (interpolated by the trigger).
    const before = isCrossing ? (fired - this.prevT) / dt : 1;
    const vAt = this.prevV + (v - this.prevV) * before;
    this.area += 0.5 * (vAt + this.prevV) * dt * before;
    capIndex.forEach((k, i) => {
      this.capArea[i]! += (stepper.q0[k]! / capsF[i]!) * dt * before;
    });
    this.time.push(stepper.timeS);
    this.topV.push(v);
    const isClosing =
      isCrossing || (isFixedWindow && stepper.timeS >= end * (1 - 1e-12)) || stepper.timeS >= maxTimeS * (1 - 1e-12);
    if (isClosing) {
      const closedAtS = this.prevT + dt * before;
      const span = closedAtS - this.windowStartS;
      this.means.push(this.area / span);
      this.capMeans.push(this.capArea.map((a) => a / span));
      this.windowStartS = closedAtS;
      this.area = 0.5 * (vAt + v) * dt * (1 - before);
      this.capArea = capIndex.map((k, i) => (stepper.q0[k]! / capsF[i]!) * dt * (1 - before));
    }
    this.prevT = stepper.timeS;
    this.prevV = v;
    return isClosing;
  }

  /**
   * The settling test after a window (three window means or more since the last extrapolation): with the
   * last three means the ratio r of successive changes is the slow mode's decay per window and the
   * projected remaining change (m3 − m2)·r/(1 − r); then the extrapolation when the decay is clean.
   */
  private judgeWindow(): void {
    const { stepper } = this.frame;
    const { settleFraction, maxTimeS } = this.options;
    const means = this.means;
    const n = means.length;
    const mean = means[n - 1]!;
    const d1 = means[n - 2]! - means[n - 3]!;
    const d2 = mean - means[n - 2]!;
    const ratio = d1 !== 0 ? d2 / d1 : 0;
    this.ratios.push(ratio);
    const previousRatio = this.sinceJump >= 4 ? this.ratios[this.ratios.length - 2]! : NaN;
    // A clean geometric decay: two successive ratios in (0, 0.995) within 0.01 of each other. It projects
    // its remaining change; any other change (noise, or a fast mode still decaying) counts ten times.
    const isClean = ratio > 0 && ratio < 0.995 && Math.abs(ratio - previousRatio) <= 0.01;
    // The slowest clean decay seen is the circuit's slow charging mode: every later change is projected
    // with it too, so a fast mode dying out after an extrapolation cannot pass for settling.
    if (isClean) this.slowestRatio = Math.max(this.slowestRatio, ratio);
    const gain = Math.max(isClean ? ratio / (1 - ratio) : 10, this.slowestRatio / (1 - this.slowestRatio));
    const projected = Math.abs(d2) * gain;
    const scale = Math.abs(mean) || 1;
    if (this.sinceJump >= 4 && Math.max(Math.abs(d1), Math.abs(d2)) * gain <= settleFraction * scale)
      this.isSettled = true;
    const firstProjection = (this.firstProjection ??= projected);
    const share =
      firstProjection > settleFraction * scale && projected > 0
        ? Math.log(firstProjection / projected) / Math.log(firstProjection / (settleFraction * scale))
        : 0;
    this.options.onShare(Math.max(stepper.timeS / maxTimeS, Math.min(0.99, share)));
    if (!this.isSettled && this.options.canExtrapolate && isClean && this.sinceJump >= 5) this.extrapolate(ratio);
  }

  /**
   * Moves each ladder capacitor's charge by its own projected remaining change (an envelope extrapolation
   * with decay `ratio` per window) and restarts the stepper there; the next windows check it.
   */
  private extrapolate(ratio: number): void {
    const { stepper, capIndex, capsF } = this.frame;
    const jumpGain = ratio / (1 - ratio);
    const last = this.capMeans[this.capMeans.length - 1]!;
    const previous = this.capMeans[this.capMeans.length - 2]!;
    capIndex.forEach((k, i) => {
      stepper.q0[k]! += (last[i]! - previous[i]!) * jumpGain * capsF[i]!;
    });
    stepper.restart();
    this.extrapolations++;
    this.isMeterStale = true;
    this.sinceJump = 0;
    this.capMeans = [];
  }
}
