import { describe, expect, it } from 'vitest';
import {
  applyParameterValues,
  calibrateDesign,
  inProcessPredictor,
  type CalibrationParameterId,
} from '../../src/calibration';
import { designExamples } from '../../src/designs/design-examples';
import type { Design } from '../../src/designs/design.types';
import { driverPeriodGuessS } from '../../src/runs/driver-design-circuit';
import { hasNgspice } from '../ngspice/run-ngspice';
import { fitOne, expectRecovered } from './recovery';
import { ngspiceWaveform, withRangeNoise } from './synthetic-bench';

// Scope captures of the demo tester's collector in steady state by ngspice (REFERENCES.md §7) on the netlist
// our exporter writes, with known, perturbed parameters; seeded noise of 1 % of the capture's range stands for
// the scope (an 8-bit converter's step is 0.4 % of its range). The capture starts at an arbitrary point of the
// cycle (DELAY_PERIODS after the settling run), so the fit has to align it in time before it compares samples.
const tester: Design = designExamples.surfaceChargeTester;
const periodS = tester.drive.kind === 'driver' ? driverPeriodGuessS(tester.drive.driver) : 0;
const SPAN_PERIODS = 1.2;
const DELAY_PERIODS = 0.37;
const SAMPLES = 150;
/** A fit runs the simulator some 15–35 times over the settling run and the capture (minutes when busy). */
const FIT_TIMEOUT_MS = 480_000;

describe.skipIf(!hasNgspice())('waveform fits against ngspice scope captures', () => {
  it.each([
    ['transistor gain 80 instead of 100', 'transistorGain', 80, 20, 500, 51],
    ['coupling 0.95 instead of 0.98', 'couplingCoefficient', 0.95, 0.85, 0.999, 52],
  ] as const)(
    'recovers %s from the collector within its 95 % interval',
    async (_name, id, truth, min, max, seed) => {
      const ids: CalibrationParameterId[] = [id];
      const capture = await ngspiceWaveform(
        applyParameterValues(tester, ids, [truth]),
        'collector',
        SPAN_PERIODS * periodS,
        SAMPLES,
        DELAY_PERIODS * periodS,
      );
      const points = withRangeNoise(capture, 0.01, seed);
      const result = await fitOne(tester, id, min, max, {
        benchRunId: 'scope-1',
        label: 'collector',
        use: 'collector-waveform',
        points,
      });
      expectRecovered(result, truth);
      // The curve overlays keep the scope's own time axis and the signed voltages.
      expect(result.curves[0]!.x[0]).toBeCloseTo(capture[0]!.x, 12);
      expect(Math.min(...result.curves[0]!.measuredV)).toBeLessThan(0);
    },
    FIT_TIMEOUT_MS,
  );
});

describe('waveform fit bad data', () => {
  it('names the run and the time column when a capture in µs was read as s', async () => {
    const points = Array.from({ length: 40 }, (_, i) => ({ x: i * 1e-6 * 1e6, y: i % 10 === 0 ? 30 : 0.1 }));
    const error = await calibrateDesign(
      {
        design: tester,
        parameters: [{ id: 'couplingCoefficient', prior: { min: 0.85, max: 0.999 } }],
        datasets: [{ benchRunId: 'scope-2', label: 'Collector capture', use: 'collector-waveform', points }],
      },
      inProcessPredictor(),
    ).catch((caught: unknown) => caught);
    expect(error).toMatchObject({ code: 'invalid_argument', field: 'runs[0]' });
    expect((error as Error).message).toMatch(/Collector capture.*time.*cut the capture to one cycle/);
  });
});
