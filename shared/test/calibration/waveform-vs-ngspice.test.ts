import { describe, expect, it } from 'vitest';
import {
  applyParameterValues,
  calibrateDesign,
  waveformSimulation,
  WAVEFORM_RELATIVE_TOLERANCE,
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
// ngspice runs with steps of at most 1/2000 of the period guess: at 1/200 its own capture was 0.9 % of the
// range (RMS) off its converged one, where our simulator at the fit's tolerance (1e-6) is within 0.03 %.
const tester: Design = designExamples.surfaceChargeTester;
const periodS = tester.drive.kind === 'driver' ? driverPeriodGuessS(tester.drive.driver) : 0;
const SPAN_PERIODS = 1.2;
const DELAY_PERIODS = 0.37;
const SAMPLES = 150;
/**
 * A fit runs the simulator some 40–60 times over the settling run and the capture (16 start points, the steps,
 * the profile), some 25 s of CPU; minutes when the machine is busy.
 */
const FIT_TIMEOUT_MS = 900_000;

describe.skipIf(!hasNgspice())('waveform fits against ngspice scope captures', () => {
  // Coupling 0.93, not 0.95: at 0.95 the tester's oscillation sits on a jump of its period (3.5 % between
  // coupling 0.9499 and 0.9503 in our simulator), so the sample cost of a capture there is a needle 0.001 wide
  // beside a broad valley at 0.9475 that a fit lands in; at 0.93 the valley is smooth (the cost 77 and 55 times
  // the noise variance 0.001 either side). The intervals are profile-likelihood ones (profile-intervals.ts).
  it(
    'follows the capture at coupling 0.93 within 0.1 % of its range, and covers 0.93 for each of 3 noise seeds',
    async () => {
      const capture = await ngspiceWaveform(
        applyParameterValues(tester, ['couplingCoefficient'], [0.93]),
        'collector',
        SPAN_PERIODS * periodS,
        SAMPLES,
        DELAY_PERIODS * periodS,
      );
      const fit = (sigma: number, seed: number) =>
        fitOne(tester, 'couplingCoefficient', 0.85, 0.999, {
          benchRunId: 'scope-1',
          label: 'collector',
          use: 'collector-waveform',
          points: withRangeNoise(capture, sigma, seed),
        });
      // What a noise-free fit would take for a parameter: the simulator at the truth against ngspice (measured
      // 0.03 % RMS for gain 80; a noise-free fit of this capture gave 0.92996).
      const times = capture.map((p) => p.x);
      const measured = capture.map((p) => p.y);
      const model = waveformSimulation(
        applyParameterValues(tester, ['couplingCoefficient'], [0.93]),
        'collector',
        times,
        measured,
        { relativeTolerance: WAVEFORM_RELATIVE_TOLERANCE },
      );
      const range = Math.max(...measured.map(Math.abs));
      const rms = Math.sqrt(model.reduce((sum, v, i) => sum + (v - measured[i]!) ** 2, 0) / model.length);
      expect(rms / range).toBeLessThan(1e-3);
      for (const seed of [52, 53, 54]) {
        const result = await fit(0.01, seed);
        expect(result.parameters[0]!.intervalMethod).toBe('profile');
        expectRecovered(result, 0.93);
      }
    },
    FIT_TIMEOUT_MS,
  );

  it.each([['transistor gain 80 instead of 100', 'transistorGain', 80, 20, 500, 51]] as const)(
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
      expect(result.parameters[0]!.intervalMethod).toBe('profile');
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
