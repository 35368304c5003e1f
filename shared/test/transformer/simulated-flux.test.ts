import { describe, expect, it } from 'vitest';
import { buildDriverCircuit } from '../../src/circuits/build-driver-circuit';
import type { DriverStage } from '../../src/designs/driver-stage.types';
import { estimateBlockingOscillator } from '../../src/driver/blocking-oscillator';
import { coreFluxCorrection } from '../../src/sim/devices/saturable-core';
import { MnaSystem } from '../../src/sim/mna-system';
import { TransientStepper } from '../../src/sim/transient';
import {
  analyzeTransformer,
  demoTransformerSection,
  derivedTransformerNumbers,
  effectiveDriverStage,
  pulseOperatingPoint,
} from '../../src/transformer';

// A bare base-limited stage (secondary open, flyback into the zener clamp) on the demo transformer section,
// its peak primary current about 0.3 of the section's saturation current.
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
  transformerDesign: demoTransformerSection,
  transistor: { forwardBeta: 100, reverseBeta: 2, vbeOnV: 0.7, vceSatV: 0.2, vceoMaxV: 60, icMaxA: 2 },
  baseResistorOhm: 5600,
  clamp: { kind: 'zener', clampVoltageV: 15 },
};

describe('the driver reads a designed transformer from its section', () => {
  const derived = derivedTransformerNumbers(demoTransformerSection);
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
    // The ramp barely moves (the supply sags a little more); the switching term takes the reflected capacitance
    // beside the 100 pF default stray (½·C·V² per cycle, common practice, no source).
    expect(a.frequencyHz.value / b.frequencyHz.value).toBeCloseTo(1, 4);
    const nodeF = 100e-12 + derived.secondaryCapacitanceF * (1200 / 20) ** 2;
    const expectedW = 0.5 * nodeF * a.supplyVoltageV.value ** 2 * a.frequencyHz.value;
    expect(a.losses.transistorSwitchingW / expectedW).toBeCloseTo(1, 9);
    expect(a.losses.transistorSwitchingW).toBeGreaterThan(100 * b.losses.transistorSwitchingW);
  });

  it('leaves a given transformer as stated', () => {
    expect(effectiveDriverStage({ ...stage, transformerChoice: 'given' })).toEqual({
      ...stage,
      transformerChoice: 'given',
    });
  });

  it('the simulated peak flux density equals the section’s figure at the simulated peak magnetizing current within 2 %', () => {
    const estimate = estimateBlockingOscillator(effective);
    const periodS = 1 / estimate.frequencyHz.value;
    const system = new MnaSystem(buildDriverCircuit(effective));
    const stepper = new TransientStepper(system, { maxStepS: periodS / 300 });
    stepper.startFromCharges(system.initialCharge);
    const probe = (name: string) => system.probeIndex(`I(T1.${name})`);
    const [p, fb, s] = [probe('Lp'), probe('Lfb'), probe('Ls')];
    const tx = effective.transformer;
    const endS = 40 * periodS;
    let peakPrimaryA = 0;
    let peakMagnetizingA = 0;
    let atPeakA = 0;
    while (stepper.timeS < endS * (1 - 1e-12)) {
      stepper.step(endS);
      if (stepper.timeS < endS / 2) continue;
      const x = system.x;
      // The simulator's magnetizing current, referred to the primary: Σ (Nj/Np)·ij over the windings.
      const im = x[p]! + (tx.feedbackTurns / tx.primaryTurns) * x[fb]! + (tx.secondaryTurns / tx.primaryTurns) * x[s]!;
      if (im > peakMagnetizingA) {
        peakMagnetizingA = im;
        atPeakA = x[p]!;
      }
      peakPrimaryA = Math.max(peakPrimaryA, x[p]!);
    }
    // The simulated core's flux linkage at that current, by the simulator's own core law (k·Lp plus the knee).
    const core = {
      magnetizingInductanceH: tx.couplingCoefficient * tx.primaryInductanceH,
      saturationCurrentA: tx.saturationCurrentA,
      saturatedInductanceH: tx.saturatedInductanceH!,
    };
    const correction = { fluxWb: 0, inductanceH: 0 };
    coreFluxCorrection(core, peakMagnetizingA, correction);
    const linkageWb = core.magnetizingInductanceH * peakMagnetizingA + correction.fluxWb;
    const simulatedT = linkageWb / (tx.primaryTurns * demoTransformerSection.core.effectiveAreaM2);

    expect(peakMagnetizingA / tx.saturationCurrentA).toBeGreaterThan(0.15);
    expect(peakMagnetizingA / tx.saturationCurrentA).toBeLessThan(0.5);
    // The primary's own peak is higher: the secondary's self-capacitance, reflected by (Ns/Np)², rings with
    // the leakage through the on-time, a current that carries no flux.
    expect(peakPrimaryA).toBeGreaterThan(atPeakA);
    const section = analyzeTransformer(
      demoTransformerSection,
      pulseOperatingPoint({
        frequencyHz: estimate.frequencyHz.value,
        onTimeS: estimate.onTimeS.value,
        flybackTimeS: estimate.flybackTimeS.value,
        primaryPeakCurrentA: peakMagnetizingA,
        baseCurrentA: estimate.baseCurrentA.value,
        primaryOnVoltageV: 2.8,
        forwardSecondaryPeakV: estimate.forwardSecondaryPeakV.value,
        flybackSecondaryPeakV: estimate.flybackSecondaryPeakV.value,
        primaryTurns: 20,
        feedbackTurns: 8,
        secondaryTurns: 1200,
        ambientTemperatureC: 25,
      }),
      { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false },
    );
    // 2 %: the simulator's magnetizing inductance is k·Lp and its knee bends the flux a little.
    expect(Math.abs(simulatedT / section.peakFluxDensityT - 1)).toBeLessThan(0.02);
  });
});
