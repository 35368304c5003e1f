import { describe, expect, it } from 'vitest';
import { oscillationFigures, readSettlingTimes } from './oscillation-measures';
import { isIrregularCycles, turnOnTimes, TurnOnTrigger } from './turn-on-events';

// Synthetic blocking-oscillator waveforms with known timing (the check values are the construction's own):
// period 40 µs, on for 25 µs (the primary current ramps from 0 to 1 A), then a flyback of 10 µs during
// which a clamp carries a decaying current of 0.8 A with the collector 20 V above the supply, then 5 µs of
// dead time where the collector rings through the supply at 2 MHz (leakage ringing).
const periodS = 40e-6;
const onS = 25e-6;
const flybackS = 10e-6;

function waveforms(cycles: number, stepS = 20e-9): { t: number[]; i: number[]; col: number[]; out: number[] } {
  const t: number[] = [];
  const i: number[] = [];
  const col: number[] = [];
  const out: number[] = [];
  for (let k = 0; k * stepS <= cycles * periodS; k++) {
    const time = k * stepS;
    const phase = time % periodS;
    t.push(time);
    if (phase < onS) {
      i.push(phase / onS);
      col.push(-3);
    } else if (phase < onS + flybackS) {
      i.push(0.8 * (1 - (phase - onS) / flybackS));
      col.push(20);
    } else {
      i.push(0.02 * Math.sin(2 * Math.PI * 2e6 * phase));
      col.push(5 * Math.sin(2 * Math.PI * 2e6 * phase));
    }
    // Output: 1000 V with a 4 V sawtooth ripple, one tooth per cycle.
    out.push(1000 + 4 * (phase / periodS - 0.5));
  }
  return { t, i, col, out };
}

describe('turn-on events of a blocking oscillator', () => {
  it('finds one turn-on per cycle at half the peak on the ramp, ignoring clamp current and ringing', () => {
    const w = waveforms(6);
    const on = turnOnTimes(w.t, w.i, w.col);
    // Six ramps in six cycles (the first armed by its zero current at t = 0).
    expect(on.length).toBe(6);
    on.forEach((tOn, k) => expect(tOn).toBeCloseTo(k * periodS + 0.5 * onS, 9));
  });

  it('the online trigger marks each cycle at its conduction’s end and finds the same turn-ons', () => {
    const w = waveforms(6);
    const trigger = new TurnOnTrigger(2, 3 * periodS);
    const marks: number[] = [];
    const turnOns: number[] = [];
    w.t.forEach((t, k) => {
      const mark = trigger.push(t, w.i[k]!, w.col[k]!);
      if (Number.isNaN(mark)) return;
      marks.push(mark);
      turnOns.push(trigger.lastTurnOnS);
    });
    // Its first reference is 2 A (a saturation current above the real 1 A peak): it lowers the reference
    // after three periods without a turn-on, so it finds the later cycles.
    expect(marks.length).toBeGreaterThanOrEqual(2);
    for (const t of turnOns) expect(((t - 0.5 * onS) / periodS) % 1).toBeCloseTo(0, 6);
    // The pulse ends where the clamp current, 0.8 A falling linearly to 0 over the flyback, passes 0.1 A.
    for (const t of marks) expect(((t - onS - 0.875 * flybackS) / periodS) % 1).toBeCloseTo(0, 6);
  });
});

describe('oscillation figures over whole cycles', () => {
  it('reads frequency, duty, primary peak, ripple and mean of the constructed waveforms', () => {
    const w = waveforms(6);
    const f = oscillationFigures(w.t, w.i, w.col, w.out)!;
    expect(f.cycles).toBe(5);
    // Exact up to the 20 ns sampling: 25 kHz, duty 25/40, peak 1 A, ripple 4 V, mean 1000 V.
    expect(f.frequencyHz).toBeCloseTo(25e3, 3);
    expect(f.dutyOnFraction).toBeCloseTo(onS / periodS, 3);
    expect(f.primaryCurrentPeakA).toBeCloseTo(1, 3);
    expect(f.ripplePeakToPeak).toBeCloseTo(4, 2);
    expect(f.mean).toBeCloseTo(1000, 3);
  });
});

// The same 40 µs cycle with strong rings: after the flyback the primary current rings at 2 MHz with 0.8 A
// amplitude (past half the 1 A peak) while the collector swings 15 V through the supply (a squegging burst),
// and 3 µs into each ramp the collector rings above the supply for 0.2 µs while the current dips by 0.3 A
// (a ring-back within one conduction). The true frequency is 25 kHz by construction.
function ringingWaveforms(cycles: number, stepS = 10e-9): { t: number[]; i: number[]; col: number[] } {
  const t: number[] = [];
  const i: number[] = [];
  const col: number[] = [];
  for (let k = 0; k * stepS <= cycles * periodS; k++) {
    const time = k * stepS;
    const phase = time % periodS;
    t.push(time);
    if (phase < onS) {
      const isRingBack = phase > 3e-6 && phase < 3.2e-6;
      i.push(phase / onS + 0.5 - (isRingBack ? 0.3 : 0));
      col.push(isRingBack ? 2 : -3);
    } else if (phase < onS + flybackS) {
      i.push(0.8 * (1 - (phase - onS) / flybackS));
      col.push(20);
    } else {
      const ring = Math.sin(2 * Math.PI * 2e6 * (phase - onS - flybackS));
      i.push(0.8 * ring);
      col.push(-15 * ring);
    }
  }
  return { t, i, col };
}

describe('turn-on events robust to rings', () => {
  it('counts one turn-on per cycle through a ringing burst and a ring-back within the conduction', () => {
    const w = ringingWaveforms(6);
    const on = turnOnTimes(w.t, w.i, w.col);
    // The ramp runs from 0.5 A to the 1.5 A peak, so it rises through half the peak at 0.25·onS; the first
    // ramp, already above a tenth of the peak at t = 0, is not armed.
    expect(on.length).toBe(5);
    on.forEach((tOn, k) => expect(tOn).toBeCloseTo((k + 1) * periodS + 0.25 * onS, 8));
    const f = oscillationFigures(w.t, w.i, w.col, w.i)!;
    expect(f.frequencyHz).toBeCloseTo(25e3, 2);
    expect(f.isIrregular).toBe(false);
  });

  it('the online trigger counts the same one turn-on per cycle through the rings', () => {
    // The same waveforms fed one sample at a time after 1 µs at rest (as a run starts: no current), the
    // trigger's first reference the true 1.5 A peak: it re-arms only after each fall and fires once per
    // conduction, never on the 0.8 A rings nor on the ring-back.
    const w = ringingWaveforms(6);
    const restS = 1e-6;
    const trigger = new TurnOnTrigger(1.5, 3 * periodS);
    trigger.push(0, 0, 0);
    const turnOns: number[] = [];
    w.t.forEach((t, k) => {
      if (!Number.isNaN(trigger.push(restS + t, w.i[k]!, w.col[k]!))) turnOns.push(trigger.lastTurnOnS - restS);
    });
    expect(turnOns.length).toBe(6);
    // Within 50 ns (five samples): the first level is half of 1.5 A, the later ones half of the sampled peak.
    turnOns.forEach((tOn, k) => expect(tOn).toBeCloseTo(k * periodS + 0.25 * onS, 7));
  });

  it('flags cycles whose periods spread (bursts) and gives their mean frequency', () => {
    expect(isIrregularCycles([0, 40e-6, 80e-6, 120e-6])).toBe(false);
    // Periods 40, 60, 40, 60 µs: spread 20 µs over a 50 µs mean.
    const on = [0, 40e-6, 100e-6, 140e-6, 200e-6];
    expect(isIrregularCycles(on)).toBe(true);
  });
});

describe('settling times of a charging curve', () => {
  it('reads 90 % and 1 % of a first-order charge at τ·ln 10 and τ·ln 100', () => {
    // v(t) = V(1 − e^(−t/τ)): 90 % at τ ln 10, within 1 % from τ ln 100 (exact for a first-order system).
    const tau = 2e-3;
    const t = Array.from({ length: 2001 }, (_, k) => k * 1e-5);
    const v = t.map((x) => 1500 * (1 - Math.exp(-x / tau)));
    const r = readSettlingTimes(t, v, 1500);
    expect(r.to90S! / (tau * Math.log(10))).toBeCloseTo(1, 4);
    expect(r.to1S! / (tau * Math.log(100))).toBeCloseTo(1, 4);
  });

  it('reads a negative output in its own sign and an overshoot as leaving the 1 % band', () => {
    const t = [0, 1, 2, 3, 4, 5];
    const v = [0, -800, -1100, -1020, -1005, -1000];
    const r = readSettlingTimes(t, v, -1000);
    expect(r.to90S).toBeCloseTo(1 + 100 / 300, 9);
    // Last outside ±1 %: −1020 at t = 3; enters the band at −1010 between t = 3 and 4.
    expect(r.to1S).toBeCloseTo(3 + 10 / 15, 9);
  });
});
