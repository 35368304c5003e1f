/**
 * The transistor's turn-on events of a self-oscillating converter, taken as on the bench: a turn-on is the
 * primary current rising through a fraction of its peak while the collector sits below the supply (the
 * transistor conducting; a current probe triggered on the ramp, qualified by the collector). Leakage ringing
 * moves the collector through the supply many times a cycle, but the primary current rises through half its
 * peak once; a clamp's or snubber's current in the flyback flows while the collector is above the supply and
 * does not count.
 *
 * One rule, whether the samples arrive one at a time during a run (TurnOnTrigger) or as a record (turnOnTimes):
 * - a rise starts a conduction pulse, which ends when the current falls below `REARM_FRACTION` of the peak;
 * - the next rise counts only once the pulse has ended and the collector has been above the supply since the
 *   rise (the switch off), so a collector ringing through the supply within one conduction does not re-arm;
 * - a pulse shorter than `RING_FRACTION` of the longest conduction is a ring, not a turn-on. An oscillator
 *   that squegs (bursts of fast rings between long conductions) is so measured from its long conductions.
 * The longest conduction is the record's on a record, and the longest of the last `RING_MEMORY` turn-ons
 * during a run; the peak is the record's, or the last whole cycle's during a run.
 */

/** A rise whose pulse lasts under this fraction of the longest conduction is a ring, not a turn-on. */
export const RING_FRACTION = 0.25;
/** Cycles are irregular when (longest − shortest period) exceeds this fraction of the mean period. */
export const IRREGULAR_SPREAD = 0.2;
/** Fraction of the peak primary current whose rising crossing marks a turn-on. */
export const TURN_ON_FRACTION = 0.5;
/** A conduction pulse ends, and the trigger may re-arm, once the primary current is below this fraction of the peak. */
export const REARM_FRACTION = 0.1;
/** During a run, the ring test compares a pulse with the longest of this many last turn-ons' pulses. */
export const RING_MEMORY = 4;

/** One conduction pulse: the rise through half the peak and the fall below a tenth of it (interpolated), s. */
export interface ConductionPulse {
  riseS: number;
  /** NaN while the pulse has not ended. */
  endS: number;
}

/**
 * The rise-and-fall rule on a stream of samples (see the note at the top), the peak given with each sample.
 * Not armed at the start until the current is below a tenth of the peak (a record that opens inside a
 * conduction does not count that conduction's rise).
 */
class ConductionPulses {
  private isArmed = false;
  private isInPulse = false;
  private hasFallen = false;
  private wentOff = true;
  private riseS = NaN;
  private endS = NaN;
  private prevT = NaN;
  private prevI = NaN;

  /** The pulse of the last rise (its end NaN while it lasts), or null before any rise. */
  get current(): ConductionPulse | null {
    return Number.isNaN(this.riseS) ? null : { riseS: this.riseS, endS: this.endS };
  }

  /**
   * Feeds a sample (time, primary current, collector minus supply voltage, the reference peak); returns
   * 'rise' when a pulse started within this step, 'end' when the pulse ended within it, else null.
   */
  push(timeS: number, primaryA: number, collectorOverSupplyV: number, peakA: number): 'rise' | 'end' | null {
    const isOn = collectorOverSupplyV < 0;
    const low = REARM_FRACTION * peakA;
    const level = TURN_ON_FRACTION * peakA;
    let event: 'rise' | 'end' | null = null;
    if (!this.isArmed) {
      if (primaryA <= low) {
        if (this.isInPulse) {
          this.isInPulse = false;
          this.endS = this.interpolated(timeS, primaryA, low);
          event = 'end';
        }
        this.hasFallen = true;
      }
      if (!isOn) this.wentOff = true;
      this.isArmed = this.hasFallen && this.wentOff;
    } else if (isOn && this.prevI < level && primaryA >= level) {
      this.riseS = this.interpolated(timeS, primaryA, level);
      this.endS = NaN;
      this.isArmed = false;
      this.isInPulse = true;
      this.hasFallen = false;
      this.wentOff = false;
      event = 'rise';
    }
    this.prevT = timeS;
    this.prevI = primaryA;
    return event;
  }

  /** When the current crossed `levelA` between the last sample and this one, s. */
  private interpolated(timeS: number, primaryA: number, levelA: number): number {
    if (Number.isNaN(this.prevT) || primaryA === this.prevI) return timeS;
    return this.prevT + ((timeS - this.prevT) * (levelA - this.prevI)) / (primaryA - this.prevI);
  }
}

/**
 * Turn-on trigger fed one sample at a time during a run. A turn-on is known once its conduction pulse has
 * ended and proved longer than a ring, so `push` answers at the pulse's end: every cycle is marked at that
 * same phase, and whole cycles run from one mark to the next. `lastTurnOnS` is the turn-on itself. Its
 * reference peak is the largest primary current of the last completed cycle; before the first turn-on,
 * `initialPeakA` (e.g. the core's saturation current). Whenever `patienceS` passes without a turn-on, the
 * reference is lowered to the largest current seen in that time (if smaller) and the ring test compares with
 * the longest pulse of that time, so a run leaves a start-up regime of other peaks and pulse lengths.
 */
export class TurnOnTrigger {
  /** The last turn-on (the rise through half the peak), s; NaN before the first. */
  lastTurnOnS = NaN;
  private readonly pulses = new ConductionPulses();
  private peakRefA: number;
  private cyclePeakA = 0;
  private maxSeenA = 0;
  private lastMarkS = NaN;
  private startS = NaN;
  private readonly turnOnPulsesS: number[] = [];
  private longestSinceMarkS = 0;

  constructor(
    initialPeakA: number,
    private readonly patienceS: number,
  ) {
    this.peakRefA = initialPeakA;
  }

  /**
   * Feeds a sample (time, primary current, collector minus supply voltage); when this step ended the
   * conduction pulse of a turn-on, returns the interpolated time of that end (a cycle mark within the step),
   * else NaN.
   */
  push(timeS: number, primaryA: number, collectorOverSupplyV: number): number {
    if (Number.isNaN(this.startS)) this.startS = timeS;
    if (collectorOverSupplyV < 0) {
      this.maxSeenA = Math.max(this.maxSeenA, primaryA);
      this.cyclePeakA = Math.max(this.cyclePeakA, primaryA);
    }
    const sinceS = timeS - (Number.isNaN(this.lastMarkS) ? this.startS : this.lastMarkS);
    if (sinceS > this.patienceS) {
      // No turn-on for a while: the peak and the pulses of an earlier regime (a start-up) no longer apply.
      if (this.maxSeenA > 0 && this.maxSeenA < this.peakRefA) this.peakRefA = this.maxSeenA;
      this.maxSeenA = 0;
      this.turnOnPulsesS.length = 0;
      if (this.longestSinceMarkS > 0) this.turnOnPulsesS.push(this.longestSinceMarkS);
      this.longestSinceMarkS = 0;
      this.startS = timeS;
      this.lastMarkS = NaN;
    }
    if (this.pulses.push(timeS, primaryA, collectorOverSupplyV, this.peakRefA) !== 'end') return NaN;
    const { riseS, endS } = this.pulses.current!;
    const pulseS = endS - riseS;
    this.longestSinceMarkS = Math.max(this.longestSinceMarkS, pulseS);
    if (pulseS < RING_FRACTION * Math.max(0, ...this.turnOnPulsesS)) return NaN;
    this.turnOnPulsesS.push(pulseS);
    if (this.turnOnPulsesS.length > RING_MEMORY) this.turnOnPulsesS.shift();
    if (!Number.isNaN(this.lastTurnOnS)) this.peakRefA = this.cyclePeakA;
    this.cyclePeakA = 0;
    this.maxSeenA = 0;
    this.longestSinceMarkS = 0;
    this.lastTurnOnS = riseS;
    this.lastMarkS = endS;
    return endS;
  }
}

/**
 * Turn-on times of a recorded primary current and collector-minus-supply voltage (the rule at the top), the
 * reference peak being the record's largest primary current while the transistor conducts.
 */
export function turnOnTimes(
  timeS: ArrayLike<number>,
  primaryA: ArrayLike<number>,
  collectorOverSupplyV: ArrayLike<number>,
): number[] {
  let peak = 0;
  for (let i = 0; i < primaryA.length; i++) if (collectorOverSupplyV[i]! < 0) peak = Math.max(peak, primaryA[i]!);
  if (!(peak > 0)) return [];
  const detector = new ConductionPulses();
  const pulses: ConductionPulse[] = [];
  for (let i = 0; i < timeS.length; i++) {
    const event = detector.push(timeS[i]!, primaryA[i]!, collectorOverSupplyV[i]!, peak);
    if (event === 'rise') pulses.push(detector.current!);
    else if (event === 'end') pulses[pulses.length - 1] = detector.current!;
  }
  // A pulse that the record ends before its fall is kept.
  const lengthsS = pulses.map((p) => p.endS - p.riseS);
  const longestS = Math.max(0, ...lengthsS.filter((s) => !Number.isNaN(s)));
  return pulses.filter((_, k) => !(lengthsS[k]! < RING_FRACTION * longestS)).map((p) => p.riseS);
}

/** Whether the periods between successive turn-ons spread by more than `IRREGULAR_SPREAD` of their mean. */
export function isIrregularCycles(turnOnS: ReadonlyArray<number>): boolean {
  if (turnOnS.length < 3) return false;
  const periods = turnOnS.slice(1).map((t, k) => t - turnOnS[k]!);
  const meanS = (turnOnS[turnOnS.length - 1]! - turnOnS[0]!) / periods.length;
  return Math.max(...periods) - Math.min(...periods) > IRREGULAR_SPREAD * meanS;
}
