import { beforeAll, describe, expect, it } from 'vitest';
import { DRIVER_NODES, DRIVER_SUPPLY_SOURCE, buildDriverCircuit } from '../../src/circuits/build-driver-circuit';
import { driverExamples } from '../../src/designs/driver-examples';
import { solveLoadPoint } from '../../src/driver/operating-point';
import { halfWaveCascadeLoadLine } from '../../src/driver/ladder-load-line';
import { EnergyMeter, type EnergyAccount } from '../../src/sim/energy-meter';
import { MnaSystem } from '../../src/sim/mna-system';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { SampleBuffer } from '../../src/sim/sample-buffer';
import { TransientStepper } from '../../src/sim/transient';
import { hasNgspice, runNgspice } from '../ngspice/run-ngspice';

// Demo driver (two alkaline cells) into a four-cell half-wave ladder of 220 pF, 200 MΩ load. Small
// capacitors so that the ladder settles in ~35 ms of simulated time.
const demo = driverExamples.surfaceChargeTester;
const loadOhm = 200e6;
const capacitorF = 220e-12;
const built = buildDriverCircuit(demo, {
  ladder: {
    topology: 'half-wave',
    cellCount: 4,
    capacitorsF: [capacitorF, capacitorF, capacitorF, capacitorF],
    diode: { saturationCurrentA: 1e-12, emissionCoefficient: 2, seriesResistanceOhm: 10 },
    load: { kind: 'resistance', resistanceOhm: loadOhm },
  },
});
// The transformer here is linear (its core far from saturation either way): at reltol 1e-4 ngspice does not
// get through the behavioural flux formulation of the saturating core on this circuit ("timestep too
// small"); the core is compared with ngspice at reltol 1e-5 in test/ngspice/saturable-core-vs-ngspice.test.ts.
const circuit = {
  ...built,
  elements: built.elements.map((e) => (e.kind === 'coupled-inductors' ? { ...e, core: undefined } : e)),
};
const stopS = 40e-3;
const fromS = 36e-3; // steady-state window: the output moves < 0.1 % between 35 and 40 ms
const maxStepS = 2e-7;

interface Window {
  frequencyHz: number;
  outputV: number;
  inputEnergyJ: number;
}

function steadyWindow(
  timeS: Float64Array,
  col: Float64Array,
  out: Float64Array,
  supplyA: Float64Array,
  supplyV: number,
): Window {
  const crossings: number[] = [];
  let area = 0;
  let charge = 0;
  let span = 0;
  for (let i = 1; i < timeS.length; i++) {
    if (timeS[i]! <= fromS) continue;
    if (col[i - 1]! < 10 && col[i]! >= 10) crossings.push(timeS[i]!);
    const dt = timeS[i]! - timeS[i - 1]!;
    area += 0.5 * (out[i]! + out[i - 1]!) * dt;
    charge += 0.5 * (supplyA[i]! + supplyA[i - 1]!) * dt;
    span += dt;
  }
  return {
    frequencyHz: (crossings.length - 1) / (crossings[crossings.length - 1]! - crossings[0]!),
    outputV: area / span,
    // SPICE sign convention: a source delivering power carries negative current.
    inputEnergyJ: -charge * supplyV,
  };
}

let ours: Window;
let energy: EnergyAccount;
const supplyV = 2 * 1.6; // two fresh alkaline cells, built-in curve (common practice, no source)

beforeAll(() => {
  const system = new MnaSystem(circuit);
  const stepper = new TransientStepper(system, { maxStepS });
  stepper.startFromCharges(system.initialCharge);
  const meter = new EnergyMeter(circuit, system);
  meter.record(0);
  const probes = [
    system.probeIndex(DRIVER_NODES.collector),
    system.probeIndex('out'),
    system.probeIndex(`I(${DRIVER_SUPPLY_SOURCE})`),
  ];
  const time = new SampleBuffer();
  const traces = probes.map(() => new SampleBuffer());
  while (stepper.timeS < stopS * (1 - 1e-12)) {
    stepper.step(stopS);
    meter.record(stepper.timeS);
    time.push(stepper.timeS);
    probes.forEach((p, i) => traces[i]!.push(system.x[p]!));
  }
  energy = meter.account();
  const [col, out, supply] = traces.map((t) => t.toArray()) as [Float64Array, Float64Array, Float64Array];
  ours = steadyWindow(time.toArray(), col, out, supply, supplyV);
}, 120_000);

describe('energy balance of the full simulation', () => {
  it('accounts for the energy drawn from the supply within 2 %: load, losses and stored energy', () => {
    // Tellegen's theorem: supplied = dissipated in every element + stored change. 2 %: the bound;
    // the gap is the integration error of charge and energy over 40 ms of switching.
    const dissipatedJ = Object.values(energy.dissipatedJ).reduce((a, b) => a + b, 0);
    expect(energy.dissipatedJ.Rload).toBeGreaterThan(0);
    expect(Math.abs((dissipatedJ + energy.storedChangeJ) / energy.suppliedJ - 1)).toBeLessThan(0.02);
  });
});

describe('fast estimate against the full simulation, driver with a four-cell ladder', () => {
  it('puts the output within 5 % of the operating point', () => {
    // 5 %: the fast estimate takes ideal diodes and a stiff forward pulse.
    const p = solveLoadPoint(demo, halfWaveCascadeLoadLine(2, capacitorF), ours.outputV / loadOhm);
    expect(Math.abs(ours.outputV - p.outputV) / p.outputV).toBeLessThan(0.05);
  });

  it('puts the frequency within 10 % of the operating point', () => {
    // 10 %: dead time and storage time are outside the closed form.
    const p = solveLoadPoint(demo, halfWaveCascadeLoadLine(2, capacitorF), ours.outputV / loadOhm);
    expect(Math.abs(ours.frequencyHz - p.frequencyHz) / p.frequencyHz).toBeLessThan(0.1);
  });
});

describe.skipIf(!hasNgspice())('full simulation against ngspice on the exported netlist', () => {
  let spice: Window;
  beforeAll(async () => {
    // ngspice at its default reltol of 1e-3 has not converged on this circuit: its mean output over the
    // window reads 3231 V, at reltol 1e-4 3384 V (and 3326 V at reltol 1e-3 with half the maximum step,
    // 3383 V with Gear integration and half the step), measured while fixing this test. Ours reads 3383 V
    // at reltol 1e-3 since each junction's current is part of the Newton convergence test (as in SPICE);
    // without that test a junction could move by a volt within the node tolerance (kV nodes), and the
    // energy balance missed by 38 %.
    // So the reference runs at reltol 1e-4, as the oscillator test in test/ngspice does.
    const netlist = toSpiceNetlist(circuit, {
      transient: { stopTimeS: stopS, maxStepS, startFrom: 'element-initial-conditions' },
      extraLines: ['.options reltol=1e-4'],
    });
    const s = await runNgspice(netlist, ['v(col)', 'v(out)', 'i(vbat)']);
    spice = steadyWindow(s.timeS, s.signals['v(col)']!, s.signals['v(out)']!, s.signals['i(vbat)']!, supplyV);
  }, 120_000);

  it('agrees on the oscillation frequency within 3 %', () => {
    // 3 %: both integrate the same equations; the difference is time-step control at the switching edges.
    expect(Math.abs(ours.frequencyHz - spice.frequencyHz) / spice.frequencyHz).toBeLessThan(0.03);
  });

  it('agrees on the mean output within 1 %', () => {
    // 1 %: the output is a slow quantity, far less sensitive to step control than the edges.
    expect(Math.abs(ours.outputV - spice.outputV) / spice.outputV).toBeLessThan(0.01);
  });

  it('agrees on the energy drawn from the supply within 2 %', () => {
    // 2 %: the supply energy is the sum of the output and all losses; the same netlist must draw the same.
    expect(Math.abs(ours.inputEnergyJ - spice.inputEnergyJ) / spice.inputEnergyJ).toBeLessThan(0.02);
  });
});
