import { describe, expect, it } from 'vitest';
import {
  isIrregularCycles,
  oscillationFigures,
  readSettlingTimes,
  turnOnTimes,
  TurnOnTrigger,
} from './oscillation-measures';

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

  it('the online trigger fires at the same instants as the offline search', () => {
    const w = waveforms(6);
    const trigger = new TurnOnTrigger(2, 3 * periodS);
    const fired: number[] = [];
    w.t.forEach((t, k) => {
      const f = trigger.push(t, w.i[k]!, w.col[k]!);
      if (!Number.isNaN(f)) fired.push(f);
    });
    // Its first reference is 2 A (a saturation current above the real 1 A peak): it lowers the reference
    // after three periods without a turn-on, so it finds the later cycles.
    expect(fired.length).toBeGreaterThanOrEqual(2);
    for (const f of fired) expect(((f - 0.5 * onS) / periodS) % 1).toBeCloseTo(0, 6);
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
