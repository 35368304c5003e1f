import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import type { PulseDrive } from '../designs/design.types';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import { prepareLadder, terminalMeanAt } from './analyze-ladder';
import type { LadderInput } from './ladder.types';
import { peakSlopes } from './peak-slopes';

const design = designExamples.surfaceChargeTester;
const resolved = resolveDrive(design);
const demo = ladderInputOf(design, resolved.drive, resolved.currentLimitA);
const pulse = resolved.drive as PulseDrive;
const bare = (input: LadderInput, drive: PulseDrive): LadderInput => ({
  ...input,
  drive,
  load: null,
  bleederOhm: null,
  seriesOutputResistanceOhm: 0,
});

/** Central difference of the bare ladder's mean output in one peak at a fixed current, step 1e-4 of the peak. */
function centralSlope(input: LadderInput, key: 'forwardPeakV' | 'flybackPeakV', currentA: number): number {
  const drive = input.drive as PulseDrive;
  const dv = 1e-4 * drive[key];
  const at = (v: number) => terminalMeanAt(prepareLadder({ ...input, drive: { ...drive, [key]: v } }), currentA);
  return (at(drive[key] + dv) - at(drive[key] - dv)) / (2 * dv);
}

const cases: [string, LadderInput][] = [
  ['demo ladder', bare(demo, pulse)],
  [
    'demo ladder with 2 pF node strays, short forward pulse',
    bare({ ...demo, strayCapacitanceF: 2e-12 }, { ...pulse, dutyCycle: 0.2 }),
  ],
  ['negative demo ladder, 10 kΩ source', bare({ ...demo, polarity: -1 }, { ...pulse, sourceResistanceOhm: 1e4 })],
  [
    'seven unequal cells',
    bare(
      {
        ...demo,
        capacitorsF: Array.from({ length: 7 }, (_, i) => 4.7e-9 * (1 + 0.3 * ((i * 0.618) % 1))),
      },
      pulse,
    ),
  ],
];

describe('peakSlopes', () => {
  it.each(cases)('%s: the central difference of the solve in each peak', (_, input) => {
    for (const currentA of [0, 3e-6, 40e-6]) {
      const slopes = peakSlopes(prepareLadder(input).workspace, currentA)!;
      const forward = input.polarity === 1 ? slopes.high : slopes.low;
      const flyback = input.polarity === 1 ? slopes.low : slopes.high;
      // 1e-7: the difference of an affine function, rounded at 1e-16 of the output over a step of 1e-4 of the peak.
      expect(Math.abs(forward - centralSlope(input, 'forwardPeakV', currentA))).toBeLessThan(1e-7 * Math.abs(forward));
      expect(Math.abs(flyback - centralSlope(input, 'flybackPeakV', currentA))).toBeLessThan(1e-7 * Math.abs(flyback));
    }
  });

  it('is n for each pulse of an n-stage (2n-cell) half-wave cascade without strays (REFERENCES.md §1: V0 = n·(V₊ + V₋))', () => {
    for (const cells of [2, 6, 12]) {
      const input = bare({ ...demo, capacitorsF: Array<number>(cells).fill(10e-9), strayCapacitanceF: 0 }, pulse);
      const slopes = peakSlopes(prepareLadder(input).workspace, 10e-6)!;
      // Exact in the model up to rounding: the charge ratio of an ideal cascade.
      expect(slopes.high).toBeCloseTo(cells / 2, 12);
      expect(slopes.low).toBeCloseTo(cells / 2, 12);
    }
  });

  it('passes on nothing of a peak the source resistance takes whole, and is null for a sine drive', () => {
    const starved = bare(demo, { ...pulse, sourceResistanceOhm: 1e12 });
    const slopes = peakSlopes(prepareLadder(starved).workspace, 40e-6)!;
    expect(centralSlope(starved, 'forwardPeakV', 40e-6)).toBe(0);
    expect(slopes.high).toBe(0);
    const sine = { kind: 'sine' as const, peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 60 };
    expect(peakSlopes(prepareLadder({ ...demo, drive: sine }).workspace, 1e-6)).toBeNull();
  });
});
