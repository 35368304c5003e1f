import { describe, expect, it } from 'vitest';
import { applicableParameters, applyParameterValues, loadSweepEstimate } from '../../src/calibration';
import { collectorNodeCapacitanceOf } from '../../src/driver/oscillator-stage';
import { driverDesignCircuit } from '../../src/runs/driver-design-circuit';
import { designExamples } from '../../src/designs/design-examples';
import { testLadder } from './synthetic-bench';

describe('secondary self-capacitance as an uncertain parameter', () => {
  const tester = designExamples.surfaceChargeTester;

  it('applies to a driver whose transformer is given as numbers, from 0 to 100 pF', () => {
    const option = applicableParameters(tester).find((p) => p.id === 'secondarySelfCapacitance');
    expect(option).toMatchObject({ unit: 'F', value: 0, prior: { min: 0, max: 100e-12 } });
    expect(applicableParameters(testLadder).map((p) => p.id)).not.toContain('secondarySelfCapacitance');
  });

  it('is written to the transformer and reaches the simulator circuit across the secondary', () => {
    const design = applyParameterValues(tester, ['secondarySelfCapacitance'], [20e-12]);
    if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
    expect(design.drive.driver.transformer.secondaryCapacitanceF).toBe(20e-12);
    const circuit = driverDesignCircuit(
      design,
      design.multiplier.capacitors.map(() => 0),
    );
    const capacitances = circuit.elements.flatMap((e) => (e.kind === 'capacitor' ? [e.capacitanceF] : []));
    expect(capacitances).toContain(20e-12);
  });

  it('reaches the estimate as collector-node capacitance, reflected by the turns ratio squared', () => {
    // A capacitance across a winding appears at another winding times (N_other / N_this)²: transformer
    // impedance reflection (any circuits text, e.g. Hayt & Kemmerly, ideal transformer, from memory).
    const design = applyParameterValues(tester, ['secondarySelfCapacitance'], [20e-12]);
    if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
    expect(collectorNodeCapacitanceOf(design.drive.driver)).toBeCloseTo(100e-12 + 20e-12 * (1200 / 20) ** 2, 18);
    // At no load the output hardly moves (the flyback still charges the ladder to the same peak); under load
    // the reflected capacitance slows the collector's ring-back after the flyback, the cycle lengthens, less
    // power reaches the ladder and the output falls, so a load sweep carries information about it.
    const currents = [0, 10e-6];
    const without = loadSweepEstimate(tester, currents);
    const withSelf = loadSweepEstimate(design, currents);
    expect(Math.abs(withSelf[0]! / without[0]! - 1)).toBeLessThan(1e-3);
    expect(withSelf[1]!).toBeLessThan(without[1]!);
  });
});
