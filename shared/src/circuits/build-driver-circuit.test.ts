import { describe, expect, it } from 'vitest';
import { simulateTransient } from '../sim/transient-analysis';
import { estimateBlockingOscillator } from '../driver/blocking-oscillator';
import { DRIVER_NODES, DRIVER_SUPPLY_SOURCE, buildDriverCircuit } from './build-driver-circuit';
import { driverExamples } from '../designs/driver-examples';

const demo = driverExamples.surfaceChargeTester;

/** Mean frequency from the collector's rising crossings of a level after `fromS`. */
function crossingFrequencyHz(timeS: Float64Array, v: Float64Array, levelV: number, fromS: number): number {
  const crossings: number[] = [];
  for (let i = 1; i < timeS.length; i++) {
    if (timeS[i]! > fromS && v[i - 1]! < levelV && v[i]! >= levelV) crossings.push(timeS[i]!);
  }
  if (crossings.length < 3) throw new Error('no steady oscillation');
  return (crossings.length - 1) / (crossings[crossings.length - 1]! - crossings[0]!);
}

describe('fast estimate against the full simulation (driver alone, flyback held by the clamp)', () => {
  const stopS = 1e-3;
  const result = simulateTransient(buildDriverCircuit(demo), {
    stopTimeS: stopS,
    maxStepS: 2e-7,
    probes: [DRIVER_NODES.collector, DRIVER_NODES.supply, `I(${DRIVER_SUPPLY_SOURCE})`],
  });
  const estimate = estimateBlockingOscillator(demo);

  it('starts from a cold supply and oscillates at the estimated frequency within 10 %', () => {
    // 10 %: the estimate neglects the dead time after the flyback and the transistor's storage time.
    const fHz = crossingFrequencyHz(result.timeS, result.signals[DRIVER_NODES.collector]!, 10, stopS / 2);
    expect(Math.abs(fHz - estimate.frequencyHz.value) / estimate.frequencyHz.value).toBeLessThan(0.1);
  });

  it('holds the collector peak at the zener clamp voltage within 5 %', () => {
    // 5 %: the zener's series resistance adds a little above its knee at the clamp current.
    let peakV = 0;
    result.signals[DRIVER_NODES.collector]!.forEach((v) => (peakV = Math.max(peakV, v)));
    expect(Math.abs(peakV - estimate.collectorPeakV.value) / estimate.collectorPeakV.value).toBeLessThan(0.05);
  });

  it('draws the estimated supply current within 15 %', () => {
    // 15 %: the estimate ignores the ringing after each flyback and the base charge; mean over the last half.
    const t = result.timeS;
    const i = result.signals[`I(${DRIVER_SUPPLY_SOURCE})`]!;
    let charge = 0;
    let span = 0;
    for (let k = 1; k < t.length; k++) {
      if (t[k]! <= stopS / 2) continue;
      const dt = t[k]! - t[k - 1]!;
      charge += 0.5 * (i[k]! + i[k - 1]!) * dt;
      span += dt;
    }
    // SPICE convention: a source delivering power carries a negative current.
    const meanA = -charge / span;
    expect(Math.abs(meanA - estimate.inputCurrentA.value) / estimate.inputCurrentA.value).toBeLessThan(0.15);
  });
});

describe('every element of the driver circuit is a field of the design', () => {
  const windingOf = (driver: typeof demo, name: string) => {
    const t = buildDriverCircuit(driver).elements.find((e) => e.kind === 'coupled-inductors');
    if (t?.kind !== 'coupled-inductors') throw new Error('no transformer');
    return { transformer: t, winding: t.windings.find((w) => w.name === name)! };
  };

  it('feeds the ladder from the flyback by default (secondary dot at ground) or from the forward pulse', () => {
    const flyback = structuredClone(demo);
    delete flyback.transformer.secondaryPhasing;
    expect(windingOf(flyback, 'Ls').winding).toMatchObject({ nodeA: '0', nodeB: DRIVER_NODES.secondary });
    expect(windingOf(demo, 'Ls').winding).toMatchObject({ nodeA: DRIVER_NODES.secondary, nodeB: '0' });
  });

  it('takes bypass, stray capacitance, snubber, junction capacitances and pair couplings from the design', () => {
    const d = structuredClone(demo);
    d.supplyBypassCapacitanceF = 0;
    d.collectorStrayCapacitanceF = 47e-12;
    d.snubber = { resistorOhm: 220, capacitorF: 1e-9 };
    d.transistor.baseCollectorCapacitanceF = 8e-12;
    d.transformer.windingCouplings = { primarySecondary: 0.95 };
    const elements = buildDriverCircuit(d).elements;
    expect(elements.find((e) => e.name === 'Cbyp')).toBeUndefined();
    expect(elements.find((e) => e.name === 'Ccol')).toMatchObject({ capacitanceF: 47e-12 });
    expect(elements.find((e) => e.name === 'Csn')).toMatchObject({ capacitanceF: 1e-9 });
    expect(elements.find((e) => e.name === 'Rsn')).toMatchObject({ resistanceOhm: 220 });
    expect(elements.find((e) => e.kind === 'npn')).toMatchObject({ model: { baseCollectorCapacitanceF: 8e-12 } });
    expect(windingOf(d, 'Lp').transformer.couplings).toEqual([{ windingA: 'Lp', windingB: 'Ls', coefficient: 0.95 }]);
  });
});
