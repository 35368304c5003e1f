import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import type { PulseDrive } from '../designs/design.types';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import { analyzePrepared, prepareLadder, terminalMeanAt } from './analyze-ladder';
import { withDrive } from './with-drive';

const design = designExamples.surfaceChargeTester;
const resolved = resolveDrive(design);
const input = ladderInputOf(design, resolved.drive, resolved.currentLimitA);
const pulse = resolved.drive as PulseDrive;
const drives: PulseDrive[] = [
  pulse,
  { ...pulse, flybackPeakV: 0.3 * pulse.flybackPeakV },
  { ...pulse, forwardPeakV: 2 * pulse.forwardPeakV, frequencyHz: 0.5 * pulse.frequencyHz, dutyCycle: 0.2 },
];

describe('withDrive', () => {
  it.each(drives.map((d, i) => [i, d] as const))(
    'drive %i: the redriven ladder gives exactly what a fresh preparation gives',
    (_, drive) => {
      const redriven = withDrive(prepareLadder({ ...input, drive: drives[2] as PulseDrive }), drive);
      const fresh = prepareLadder({ ...input, drive });
      // Exact: the same arithmetic on the same numbers.
      expect(terminalMeanAt(redriven, 3e-6)).toBe(terminalMeanAt(fresh, 3e-6));
      expect(analyzePrepared(redriven)).toEqual(analyzePrepared(fresh));
    },
  );

  it('prepares afresh for another kind of drive, and reports a drive outside the model’s range', () => {
    const sine = { kind: 'sine' as const, peakV: 500, frequencyHz: 20e3, sourceResistanceOhm: 60 };
    expect(analyzePrepared(withDrive(prepareLadder(input), sine))).toEqual(
      analyzePrepared(prepareLadder({ ...input, drive: sine })),
    );
    expect(() => withDrive(prepareLadder(input), { ...pulse, dutyCycle: 1 })).toThrow(
      expect.objectContaining({ field: 'drive.dutyCycle' }),
    );
  });
});
