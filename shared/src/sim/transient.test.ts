import { describe, expect, it } from 'vitest';
import { buildLadderCircuit, type LadderCircuitSpec } from '../circuits/build-ladder-circuit';
import { MnaSystem } from './mna-system';
import { TransientStepper } from './transient';

// The periodic predictor and the period lock change how many Newton iterations a step takes, never its
// answer; the answers are checked against ngspice in test/ngspice. These tests guard the mechanism itself
// (our own regression guards, no outside source).

const f = 20e3;
const periodS = 1 / f;

function ladder(extra: Partial<LadderCircuitSpec> = {}): LadderCircuitSpec {
  return {
    topology: 'half-wave',
    cellCount: 8,
    capacitorsF: Array<number>(8).fill(10e-9),
    diode: { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 },
    drive: { kind: 'sine', peakV: 500, frequencyHz: f, sourceResistanceOhm: 10 },
    load: { kind: 'current', currentA: 100e-6 },
    ...extra,
  };
}

function run(system: MnaSystem, cycles: number, stepsPerPeriod: number): TransientStepper {
  const stepper = new TransientStepper(system, { maxStepS: periodS / stepsPerPeriod });
  stepper.startFromCharges(system.initialCharge);
  while (stepper.timeS < cycles * periodS * (1 - 1e-12)) stepper.step(cycles * periodS);
  return stepper;
}

describe('TransientStepper on a periodic drive', () => {
  it('finds the period of its sources, and none for a piecewise-linear or mixed drive', () => {
    expect(new MnaSystem(buildLadderCircuit(ladder())).sourcePeriodS()).toBeCloseTo(periodS, 15);
    const pulse = ladder({
      drive: {
        kind: 'pulse',
        forwardPeakV: 150,
        flybackPeakV: 450,
        frequencyHz: f,
        dutyCycle: 0.7,
        sourceResistanceOhm: 10,
      },
    });
    expect(new MnaSystem(buildLadderCircuit(pulse)).sourcePeriodS()).toBeCloseTo(periodS, 15);
    const circuit = buildLadderCircuit(ladder());
    const withPwl = {
      ...circuit,
      elements: [
        ...circuit.elements,
        {
          kind: 'current-source' as const,
          name: 'Iextra',
          nodePlus: 'top',
          nodeMinus: '0',
          waveform: { kind: 'pwl' as const, points: [{ timeS: 0, value: 0 }] },
        },
      ],
    };
    expect(new MnaSystem(withPwl).sourcePeriodS()).toBeNaN();
  });

  it('settles onto one step grid per period, where the last periods cut the Newton iterations', () => {
    // Loaded to 2 mA, still charging at cycle 100: 1.33 iterations per step with the periodic predictor
    // here, 1.81 with the extrapolation of the last two points alone (measured when this was written).
    const stepper = run(
      new MnaSystem(buildLadderCircuit(ladder({ load: { kind: 'current', currentA: 2e-3 } }))),
      100,
      200,
    );
    const before = { steps: stepper.acceptedSteps, newton: stepper.newtonIterations };
    const end = 120 * periodS;
    while (stepper.timeS < end * (1 - 1e-12)) stepper.step(end);
    const steps = stepper.acceptedSteps - before.steps;
    expect(steps).toBeGreaterThanOrEqual(20 * 200);
    expect(steps).toBeLessThanOrEqual(20 * 200 + 2);
    expect((stepper.newtonIterations - before.newton) / steps).toBeLessThan(1.55);
  });

  it('gives the same waveform whether or not the last periods are kept (restart clears them)', () => {
    const spec = ladder();
    const plain = run(new MnaSystem(buildLadderCircuit(spec)), 60, 100);
    const system = new MnaSystem(buildLadderCircuit(spec));
    const cleared = new TransientStepper(system, { maxStepS: periodS / 100 });
    cleared.startFromCharges(system.initialCharge);
    const end = 60 * periodS;
    let n = 0;
    while (cleared.timeS < end * (1 - 1e-12)) {
      cleared.step(end);
      // A restart every 37 steps forgets the periods (and the integration history) each time.
      if (++n % 37 === 0) cleared.restart();
    }
    const top = system.probeIndex('top');
    // Same answer to well within the 0.5 % the simulator promises (the restarts change the steps taken).
    expect(Math.abs(cleared.value(top) / plain.value(plain.system.probeIndex('top')) - 1)).toBeLessThan(1e-3);
  });
});
