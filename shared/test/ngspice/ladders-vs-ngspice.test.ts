import { describe, expect, it } from 'vitest';
import {
  buildLadderCircuit,
  idealCapacitorVoltagesV,
  type LadderCircuitSpec,
} from '../../src/circuits/build-ladder-circuit';
import { simulateTransient } from '../../src/sim/transient-analysis';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { windowMean, windowPeakToPeak } from '../../src/sim/waveform-measures';
import { hasNgspice, runNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the very netlist our exporter writes.
const ngspiceAvailable = hasNgspice();
if (!ngspiceAvailable)
  console.warn('ngspice not found on PATH: the ngspice reference tests are skipped (CI installs it).');

const diode = { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 };
const f = 20e3;
const periodS = 1 / f;

/** Load current for a droop of about `fraction` of the no-load output by the textbook ΔV0 (REFERENCES.md §1). */
function droopCurrentA(stages: number, peakV: number, capF: number, fraction: number): number {
  const n = stages;
  return (fraction * 2 * n * peakV * f * capF) / ((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6);
}

interface LadderCase {
  name: string;
  spec: LadderCircuitSpec;
  cycles: number;
  isLoaded: boolean;
}

function halfWave(stages: number, loadFraction: number, caps?: number[], cells = 2 * stages): LadderCase {
  const capacitorsF = caps ?? Array<number>(cells).fill(10e-9);
  return {
    name: `half-wave, ${cells} cells${caps ? ', unequal capacitors' : ''}, ${loadFraction > 0 ? `loaded to ~${loadFraction * 100} % droop` : 'unloaded'}`,
    spec: {
      topology: 'half-wave',
      cellCount: cells,
      capacitorsF,
      diode,
      drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
      load:
        loadFraction > 0
          ? { kind: 'current', currentA: droopCurrentA(Math.max(1, cells / 2), 500, 10e-9, loadFraction) }
          : null,
    },
    cycles: 60 + 20 * cells,
    isLoaded: loadFraction > 0,
  };
}

const cases: LadderCase[] = [
  halfWave(1, 0),
  halfWave(1, 0.1),
  halfWave(2, 0.1),
  halfWave(3, 0),
  halfWave(5, 0.1),
  halfWave(10, 0.1),
  halfWave(3, 0.1, [30e-9, 30e-9, 20e-9, 20e-9, 10e-9, 10e-9]),
  halfWave(1.5, 0.1, undefined, 3),
  {
    name: 'full-wave cascade, 2 stages, loaded',
    spec: {
      topology: 'full-wave',
      cellCount: 2,
      capacitorsF: Array<number>(6).fill(10e-9),
      diode,
      drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
      load: { kind: 'current', currentA: 2e-3 },
    },
    cycles: 120,
    isLoaded: true,
  },
  {
    // A pulse drive puts four corners in every period, where the stepper lands and restarts; the
    // periodic predictor has to carry across them.
    name: 'half-wave, 4 cells, pulse drive (flyback shape), loaded',
    spec: {
      topology: 'half-wave',
      cellCount: 4,
      capacitorsF: Array<number>(4).fill(10e-9),
      diode,
      drive: {
        kind: 'pulse',
        forwardPeakV: 150,
        flybackPeakV: 450,
        frequencyHz: f,
        dutyCycle: 0.7,
        sourceResistanceOhm: 10,
      },
      load: { kind: 'current', currentA: 1e-3 },
    },
    cycles: 140,
    isLoaded: true,
  },
  {
    name: 'bridge doubler, loaded',
    spec: {
      topology: 'bridge-doubler',
      cellCount: 2,
      capacitorsF: [10e-9, 10e-9],
      diode,
      drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
      load: { kind: 'resistance', resistanceOhm: 100e3 },
    },
    cycles: 80,
    isLoaded: true,
  },
];

describe.skipIf(!ngspiceAvailable)('ladders: our transient against ngspice on the same exported netlist', () => {
  it.concurrent.each(cases)('$name', async ({ spec, cycles, isLoaded }) => {
    const withStart = { ...spec, initialCapacitorVoltagesV: idealCapacitorVoltagesV(spec) };
    const circuit = buildLadderCircuit(withStart);
    const run = { stopTimeS: cycles * periodS, maxStepS: periodS / 100 };
    const reference = runNgspice(toSpiceNetlist(circuit, { transient: run }), ['v(top)']);
    const ours = simulateTransient(circuit, { ...run, probes: ['top'], recordFromS: (cycles - 2) * periodS });
    const ng = await reference;
    const from = (cycles - 1) * periodS;
    const to = cycles * periodS;
    const ourMean = windowMean(ours.timeS, ours.signals.top!, from, to);
    const ngMean = windowMean(ng.timeS, ng.signals['v(top)']!, from, to);
    // Cycle-mean output within 0.5 % (the agreement the simulator promises at steady state).
    expect(Math.abs(ourMean / ngMean - 1)).toBeLessThan(0.005);
    if (isLoaded) {
      const ourRipple = windowPeakToPeak(ours.timeS, ours.signals.top!, from, to);
      const ngRipple = windowPeakToPeak(ng.timeS, ng.signals['v(top)']!, from, to);
      // Ripple within 5 %: a peak-to-peak of a sampled waveform depends on where the steps fall.
      expect(Math.abs(ourRipple / ngRipple - 1)).toBeLessThan(0.05);
      expect(ngRipple).toBeGreaterThan(0);
    }
  });
});
