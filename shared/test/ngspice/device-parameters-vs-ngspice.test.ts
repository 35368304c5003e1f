import { describe, expect, it } from 'vitest';
import type { Design } from '../../src/designs/design.types';
import { driverFiguresBoth, driverMismatches, supply, threeCells } from './driver-comparison';
import { hasNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the netlist our exporter writes (driver-comparison.ts), for
// blocking-oscillator supplies whose transistor and diodes use the Gummel–Poon and diode parameters a design
// can set: a finite Early voltage (VAF), forward and reverse transit times (TF, TR), terminal resistances (RB,
// RC, RE), the junctions' potentials and gradings, and the depletion capacitance and breakdown of the ladder
// and clamp diodes (CJO, VJ, M, BV, IBV). Each parameter moves the figures of its design by more than the
// bounds or close to them (beside each, our simulator with the parameters against without, same window), so the
// agreement is the parameters' own, not the defaults'.
const deviceSupplies = [
  // VAF 5 V (low, for a large effect): frequency −9 %, efficiency −9 points against no Early effect.
  supply('3 V cells, Early voltage 5 V', (d) => {
    d.transistor.earlyVoltageV = 5;
  }),
  // TF 20 ns, TR 1 µs (a slow switching transistor's stored charge): frequency −5 %, efficiency −3.5 points.
  supply('3 V cells, transit times 20 ns and 1 µs, own junction potentials', (d) => {
    d.transistor.forwardTransitTimeS = 20e-9;
    d.transistor.reverseTransitTimeS = 1e-6;
    d.transistor.baseEmitterPotentialV = 0.8;
    d.transistor.baseEmitterGrading = 0.4;
    d.transistor.baseCollectorPotentialV = 0.6;
    d.transistor.baseCollectorGrading = 0.3;
  }),
  // RB 500 Ω, RC 2 Ω, RE 1 Ω: frequency +9 %, primary peak −13 %, efficiency +13 points.
  supply('3 V cells, terminal resistances', (d) => {
    d.transistor.baseResistanceOhm = 500;
    d.transistor.collectorResistanceOhm = 2;
    d.transistor.emitterResistanceOhm = 1;
  }),
  // Ladder diodes at 8 pF (against 1.5 pF) and a 30 pF clamp diode: frequency ×2.6, efficiency +7 points.
  // Its cycles come in bursts whose pattern after about 40 periods hangs on small numerical differences: over
  // periods 20–40 the two read 27.74 and 27.74 kHz, over 20–100 23.9 and 26.1 kHz, over 60–100 20.5 and 25.0 kHz,
  // while output mean (0.01 %) and efficiency (0.2 points) agree in every window. The short window compares the
  // same bursts.
  {
    keepShortWindow: true,
    ...supply('6 V DC, 1:50, RCD clamp, ladder and clamp diodes with CJO and BV', (d, design) => {
      d.supply = { kind: 'dc', voltageV: 6, sourceResistanceOhm: 0.1 };
      d.transformer.secondaryTurns = 1000;
      d.baseResistorOhm = 10e3;
      d.clamp = {
        kind: 'rcd',
        resistorOhm: 4.7e3,
        capacitorF: 10e-9,
        junctionCapacitanceF: 30e-12,
        junctionPotentialV: 0.7,
        gradingCoefficient: 0.45,
        breakdownVoltageV: 200,
        breakdownCurrentA: 1e-5,
      };
      design.multiplier.diode.junctionCapacitanceF = 8e-12;
      design.multiplier.diode.junctionPotentialV = 0.6;
      design.multiplier.diode.gradingCoefficient = 0.4;
      design.multiplier.diode.breakdownVoltageV = 4000;
      design.multiplier.diode.breakdownCurrentA = 1e-6;
    }),
  },
  // A 200 pF zener and VAF 40 V: frequency −3 %, efficiency −2 points.
  supply('9 V DC, 1:80, zener with 200 pF, VAF 40 V and RC snubber, tripler', (d, design) => {
    d.supply = { kind: 'dc', voltageV: 9, sourceResistanceOhm: 0.2 };
    d.transformer.secondaryTurns = 1600;
    d.baseResistorOhm = 15e3;
    d.transistor.vceoMaxV = 60;
    d.clamp = { kind: 'zener', clampVoltageV: 45, junctionCapacitanceF: 200e-12, breakdownCurrentA: 5e-3 };
    d.snubber = { resistorOhm: 100, capacitorF: 1e-9 };
    d.transistor.earlyVoltageV = 40;
    threeCells(design);
  }),
];

describe.skipIf(!hasNgspice())('device parameters against ngspice on the exported netlist', () => {
  it.concurrent.each(deviceSupplies)(
    '$name: frequency within 3 %, output mean within 1 %, efficiency within 2 points, primary peak within 5 %',
    async ({ design, keepShortWindow }: { design: Design; keepShortWindow?: boolean }) => {
      const { ours, spice } = await driverFiguresBoth(design, { keepShortWindow });
      expect(driverMismatches(ours, spice)).toEqual([]);
    },
    240_000,
  );
});
