import { describe, expect, it } from 'vitest';
import { buildDriverCircuit } from '../../src/circuits/build-driver-circuit';
import type { DriverStage } from '../../src/designs/driver-stage.types';
import { estimateBlockingOscillator } from '../../src/driver/blocking-oscillator';
import { stageTransformerOperatingPoint } from '../../src/analysis/transformer-report';
import { MnaSystem } from '../../src/sim/mna-system';
import { TransientStepper } from '../../src/sim/transient';
import { driverExamples } from '../../src/designs/driver-examples';
import {
  analyzeTransformer,
  demoTransformerSection,
  derivedTransformerNumbers,
  effectiveDriverStage,
  type TransformerSection,
} from '../../src/transformer';
import { e20Section } from './tester-fixtures';

// A bare base-limited stage (secondary open, flyback into the zener clamp) on the E20 section, its peak
// primary current about 0.3 of the section's saturation current; the flux comparison also runs it on the demo
// E25 section (a gap that can be made) over three base resistors, and the demo tester's own stage.
const stage: DriverStage = {
  supply: { kind: 'dc', voltageV: 3, sourceResistanceOhm: 0.05 },
  transformer: {
    // Given numbers the designed transformer replaces.
    primaryTurns: 1,
    feedbackTurns: 1,
    secondaryTurns: 1,
    primaryInductanceH: 1,
    couplingCoefficient: 0.5,
    primaryResistanceOhm: 0,
    feedbackResistanceOhm: 0,
    secondaryResistanceOhm: 0,
    saturationCurrentA: 1,
  },
  transformerChoice: 'designed',
  transformerDesign: e20Section,
  transistor: { forwardBeta: 100, reverseBeta: 2, vbeOnV: 0.7, vceSatV: 0.2, vceoMaxV: 60, icMaxA: 2 },
  baseResistorOhm: 5600,
  clamp: { kind: 'zener', clampVoltageV: 15 },
};

describe('the driver reads a designed transformer from its section', () => {
  const derived = derivedTransformerNumbers(e20Section);
  const effective = effectiveDriverStage(stage);

  it('takes turns, inductance, couplings, resistances, saturation and self-capacitance from the section', () => {
    expect(effective.transformer).toMatchObject({
      primaryTurns: 20,
      feedbackTurns: 8,
      secondaryTurns: 1200,
      primaryInductanceH: derived.primaryInductanceH,
      couplingCoefficient: derived.couplingCoefficient,
      saturationCurrentA: derived.saturationCurrentA,
      secondaryCapacitanceF: derived.secondaryCapacitanceF,
    });
    const circuit = buildDriverCircuit(effective);
    const self = circuit.elements.find((e) => e.name === 'Cself');
    expect(self && self.kind === 'capacitor' ? self.capacitanceF : null).toBeCloseTo(derived.secondaryCapacitanceF, 20);
  });

  it('the estimate charges the reflected self-capacitance at each turn-on: ½·Cs·(Ns/Np)²·V²·f more switching loss', () => {
    const without = { ...effective, transformer: { ...effective.transformer, secondaryCapacitanceF: 0 } };
    const a = estimateBlockingOscillator(effective);
    const b = estimateBlockingOscillator(without);
    // The ramp barely moves (the supply sags a little more); the ring-back after the flyback swings the larger
    // node, so the period grows (its recovery ∝ √C at the same reflected voltage, resonant LC ring, common
    // practice, no source); the switching term takes the reflected capacitance beside the 100 pF default stray
    // (½·C·V² per cycle, common practice, no source).
    expect(a.onTimeS.value / b.onTimeS.value).toBeCloseTo(1, 2);
    expect(a.frequencyHz.value).toBeLessThan(b.frequencyHz.value);
    const ratio = a.ringBack.recoveryS / b.ringBack.recoveryS;
    // 1 %: the supply voltage in the recovery's slope and the reflected voltage move a little with the sag.
    expect(
      Math.abs(ratio / Math.sqrt((100e-12 + derived.secondaryCapacitanceF * (1200 / 20) ** 2) / 100e-12) - 1),
    ).toBeLessThan(0.01);
    const nodeF = 100e-12 + derived.secondaryCapacitanceF * (1200 / 20) ** 2;
    const expectedW = 0.5 * nodeF * a.supplyVoltageV.value ** 2 * a.frequencyHz.value;
    expect(a.losses.transistorSwitchingW / expectedW).toBeCloseTo(1, 9);
    // Against the bare 100 pF node, the same ½·C·V²·f at each one's own supply voltage and frequency.
    const bareW = 0.5 * 100e-12 * b.supplyVoltageV.value ** 2 * b.frequencyHz.value;
    expect(b.losses.transistorSwitchingW / bareW).toBeCloseTo(1, 9);
    expect(a.losses.transistorSwitchingW).toBeGreaterThan(50 * b.losses.transistorSwitchingW);
  });

  it('leaves a given transformer as stated', () => {
    expect(effectiveDriverStage({ ...stage, transformerChoice: 'given' })).toEqual({
      ...stage,
      transformerChoice: 'given',
    });
  });

  it.each([
    { name: 'the E20 section, 5.6 kΩ base resistor', stage, section: e20Section },
    ...[3300, 5600, 10000].map((baseResistorOhm) => ({
      name: `the demo E25 section, ${baseResistorOhm / 1000} kΩ base resistor`,
      stage: { ...stage, baseResistorOhm, transformerDesign: demoTransformerSection },
      section: demoTransformerSection,
    })),
    {
      name: 'the demo E25 section on the tester’s stage (two cells, 30 V clamp)',
      stage: {
        ...driverExamples.surfaceChargeTester,
        transformerChoice: 'designed' as const,
        transformerDesign: demoTransformerSection,
      },
      section: demoTransformerSection,
    },
  ])(
    'the core’s simulated peak flux, ∫v dt of the primary, equals the section’s figure from the estimate within 2 %: $name',
    ({ stage: caseStage, section }) => {
      const effective = effectiveDriverStage(caseStage);
      const derived = derivedTransformerNumbers(section);
      const { simulatedT, magnetizingPeakA, primaryPeakA } = simulatedPeakFlux(effective, section);
      const estimate = estimateBlockingOscillator(effective);
      const tx = effective.transformer;

      // The section's figure as the Workbench computes it: the estimate's operating point, its collector peak
      // grown by the turn-off slew across the leakage-split collector node.
      const spacing = { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false } as const;
      const load = { flybackSecondaryPeakV: estimate.flybackSecondaryPeakV.value, forwardLoadPowerW: 0 };
      const report = analyzeTransformer(section, stageTransformerOperatingPoint(effective, estimate, load), spacing);
      expect(Math.abs(report.peakFluxDensityT / simulatedT - 1)).toBeLessThan(0.02);
      // Without the slew, at the collector's peak current alone, the figure is 5 % or more low: the slew matters.
      const atCollectorPeak =
        (derived.primaryInductanceH * estimate.peakPrimaryCurrentA.value) /
        (tx.primaryTurns * section.core.effectiveAreaM2);
      expect(simulatedT / atCollectorPeak - 1).toBeGreaterThan(0.05);
      // The primary's own current peaks higher still: the reflected self-capacitance rings with the leakage
      // through the on-time, a current that carries no flux of its own.
      expect(primaryPeakA).toBeGreaterThan(magnetizingPeakA);
      expect(magnetizingPeakA / tx.saturationCurrentA).toBeLessThan(0.5);
    },
  );
});

/**
 * Runs the stage 40 periods of the estimate in the simulator and measures the core's peak flux density over the
 * last cycle by Faraday's law: the primary's flux linkage is ∫(v − R·i) dt (trapezoidal over the simulator's own
 * steps); it needs no core law. Its zero is where the ampere-turns Σ Nj·ij cross zero (no MMF, no flux).
 */
function simulatedPeakFlux(effective: DriverStage, section: TransformerSection) {
  const periodS = 1 / estimateBlockingOscillator(effective).frequencyHz.value;
  const circuit = buildDriverCircuit(effective);
  const t1 = circuit.elements.find((e) => e.name === 'T1');
  if (!t1 || t1.kind !== 'coupled-inductors') throw new Error('the stage has its transformer T1');
  const winding = t1.windings[0]!;
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, { maxStepS: periodS / 300 });
  stepper.startFromCharges(system.initialCharge);
  const node = (name: string) =>
    name === '0'
      ? () => 0
      : (
          (i: number) => () =>
            system.x[i]!
        )(system.probeIndex(name));
  const [va, vb] = [node(winding.nodeA), node(winding.nodeB)];
  const probe = (name: string) => system.probeIndex(`I(T1.${name})`);
  const [p, fb, s] = [probe('Lp'), probe('Lfb'), probe('Ls')];
  const tx = effective.transformer;
  const endS = 40 * periodS;
  let linkageWb = 0;
  let lastV = 0;
  let lastT = stepper.timeS;
  const trace: { t: number; linkageWb: number; ampereTurns: number; primaryA: number }[] = [];
  while (stepper.timeS < endS * (1 - 1e-12)) {
    stepper.step(endS);
    const x = system.x;
    const v = va() - vb() - winding.resistanceOhm * x[p]!;
    linkageWb += 0.5 * (v + lastV) * (stepper.timeS - lastT);
    [lastV, lastT] = [v, stepper.timeS];
    if (stepper.timeS < endS - 2 * periodS) continue;
    const ampereTurns = tx.primaryTurns * x[p]! + tx.feedbackTurns * x[fb]! + tx.secondaryTurns * x[s]!;
    trace.push({ t: stepper.timeS, linkageWb, ampereTurns, primaryA: x[p]! });
  }
  const rising = trace.findIndex((r, i) => i > 0 && trace[i - 1]!.ampereTurns < 0 && r.ampereTurns >= 0);
  expect(rising).toBeGreaterThan(0);
  const zero = trace[rising]!;
  const cycle = trace.filter((r) => r.t >= zero.t && r.t < zero.t + periodS);
  return {
    simulatedT:
      Math.max(...cycle.map((r) => r.linkageWb - zero.linkageWb)) / (tx.primaryTurns * section.core.effectiveAreaM2),
    primaryPeakA: Math.max(...cycle.map((r) => r.primaryA)),
    magnetizingPeakA: Math.max(...cycle.map((r) => r.ampereTurns)) / tx.primaryTurns,
  };
}
