import { describe, expect, it } from 'vitest';
import {
  buildLadderCircuit,
  idealCapacitorVoltagesV,
  type LadderCircuitSpec,
} from '../../src/circuits/build-ladder-circuit';
import { MnaSystem } from '../../src/sim/mna-system';
import { findPeriodicSteadyState } from '../../src/sim/periodic-steady-state';
import { simulateTransient } from '../../src/sim/transient-analysis';
import { windowMean, windowPeakToPeak } from '../../src/sim/waveform-measures';

const f = 20e3;
const periodS = 1 / f;
const ladder = (cells: number, loadA: number): LadderCircuitSpec => ({
  topology: 'half-wave',
  cellCount: cells,
  capacitorsF: Array<number>(cells).fill(10e-9),
  diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
  drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
  load: { kind: 'current', currentA: loadA },
});

// The check is against a long transient run of the same circuit from empty capacitors: two independent
// routes to the same periodic solution (a long run is how ngspice would reach it).
describe('periodic steady state by shooting agrees with a long transient', () => {
  it.each([
    { name: 'doubler, 1 mA', cells: 2, loadA: 1e-3, cycles: 300 },
    { name: '3 stages, 2 mA', cells: 6, loadA: 2e-3, cycles: 600 },
    { name: 'tripler (odd cells), 2 mA', cells: 3, loadA: 2e-3, cycles: 400 },
  ])('$name', ({ cells, loadA, cycles }) => {
    const spec = ladder(cells, loadA);
    const circuit = buildLadderCircuit(spec);
    const system = new MnaSystem(circuit);
    const charges = Float64Array.from(idealCapacitorVoltagesV(spec), (v, i) => v * spec.capacitorsF[i]!);
    const pss = findPeriodicSteadyState(system, {
      periodS,
      stepsPerPeriod: 200,
      initialCharges: charges,
      probes: ['top'],
    });
    expect(pss.isConverged).toBe(true);
    expect(pss.relativeResidual).toBeLessThan(1e-5);
    const long = simulateTransient(circuit, {
      stopTimeS: cycles * periodS,
      maxStepS: periodS / 200,
      probes: ['top'],
      recordFromS: (cycles - 1) * periodS,
    });
    const from = (cycles - 1) * periodS;
    const longMean = windowMean(long.timeS, long.signals.top!, from, cycles * periodS);
    const pssMean = windowMean(pss.timeS, pss.signals.top!, 0, periodS);
    // 0.1 %: the long run still creeps towards the steady state by about that much in its last cycles.
    expect(Math.abs(pssMean / longMean - 1)).toBeLessThan(1e-3);
    const longRipple = windowPeakToPeak(long.timeS, long.signals.top!, from, cycles * periodS);
    const pssRipple = windowPeakToPeak(pss.timeS, pss.signals.top!, 0, periodS);
    // 3 %: peak-to-peak from samples on two different step grids.
    expect(Math.abs(pssRipple / longRipple - 1)).toBeLessThan(0.03);
  });
});
