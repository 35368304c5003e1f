import { describe, expect, it } from 'vitest';
import type { Design } from '../../src/designs/design.types';
import { driverFiguresBoth, driverMismatches, supply, threeCells } from './driver-comparison';
import { hasNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the netlist our exporter writes (driver-comparison.ts), for
// ten blocking-oscillator supplies spanning 2.4–12 V, turns ratios 50–200, base-limited and saturation-limited
// drive, with and without a collector resistor, 3- and 4-cell ladders, a zener, an RCD clamp and an RC
// snubber, flyback- and forward-fed.
const supplies = [
  supply('3 V cells, 1:60, base-limited, zener, 4 cells', () => {}),
  // With 1:200 here the two now also agree within every bound (an earlier 3.3-point efficiency gap is gone,
  // its cause not traced), but from an empty ladder the window ends at ~12 V; 1:100 keeps a ladder that moves.
  supply('2.4 V DC, 1:100, tripler, flyback-fed', (d, design) => {
    d.supply = { kind: 'dc', voltageV: 2.4, sourceResistanceOhm: 0.3 };
    d.transformer.secondaryTurns = 2000;
    d.transformer.secondaryPhasing = 'flyback';
    threeCells(design);
  }),
  supply('6 V DC, 1:50, RCD clamp, 4 cells', (d) => {
    d.supply = { kind: 'dc', voltageV: 6, sourceResistanceOhm: 0.1 };
    d.transformer.secondaryTurns = 1000;
    d.baseResistorOhm = 10e3;
    d.clamp = { kind: 'rcd', resistorOhm: 4.7e3, capacitorF: 10e-9 };
  }),
  // At 1:150 and 1:200 the ladder sits at 5–10 kV: the case where a first-iteration Newton accept left the
  // junction charges scattered by the node tolerance and the step collapsed (see sim/newton.ts). Loaded with
  // 100 µA there: at 20 µA both simulators agree on output (0.01 %) and efficiency but the oscillator runs in
  // irregular bursts whose turn-on count differs by a few per window between the two.
  ...[1000, 3000, 4000].map((secondaryTurns) =>
    supply(`12 V DC, 1:${secondaryTurns / 20}, zener 60 V, tripler`, (d, design) => {
      if (secondaryTurns > 1000) design.load = { kind: 'current', currentA: 100e-6 };
      d.supply = { kind: 'dc', voltageV: 12, sourceResistanceOhm: 0.2 };
      d.transformer.secondaryTurns = secondaryTurns;
      d.baseResistorOhm = 22e3;
      d.transistor.vceoMaxV = 80;
      d.clamp = { kind: 'zener', clampVoltageV: 60 };
      threeCells(design);
    }),
  ),
  // Two competing modes: both simulators run irregular ~128 kHz cycles over the short window (within 1 %), then
  // ngspice moves to a ~150 kHz mode after ~40 periods while ours stays at ~128 kHz (at reltol 1e-4 and 1e-5;
  // at 1e-3 ours moves to ~158 kHz too): which mode the run falls into hangs on local truncation errors, so the
  // long window of irregular designs would compare one mode with the other. Read over the short window.
  {
    ...supply('3 V cells, saturation-limited core (20 mA)', (d) => {
      d.transformer.saturationCurrentA = 0.02;
    }),
    keepShortWindow: true,
  },
  supply('3 V cells, 1 Ω collector resistor', (d) => {
    d.collectorResistorOhm = 1;
  }),
  supply('9 V DC, 1:80, RC snubber and zener, tripler', (d, design) => {
    d.supply = { kind: 'dc', voltageV: 9, sourceResistanceOhm: 0.2 };
    d.transformer.secondaryTurns = 1600;
    d.baseResistorOhm = 15e3;
    d.transistor.vceoMaxV = 60;
    d.clamp = { kind: 'zener', clampVoltageV: 45 };
    d.snubber = { resistorOhm: 100, capacitorF: 1e-9 };
    threeCells(design);
  }),
  supply('3.7 V DC, 1:120, flyback-fed, pair couplings, 4 cells', (d) => {
    d.supply = { kind: 'dc', voltageV: 3.7, sourceResistanceOhm: 0.15 };
    d.transformer.secondaryTurns = 2400;
    d.transformer.secondaryPhasing = 'flyback';
    d.transformer.windingCouplings = { primaryFeedback: 0.99, primarySecondary: 0.97, feedbackSecondary: 0.96 };
  }),
];

describe.skipIf(!hasNgspice())('blocking-oscillator supplies against ngspice on the exported netlist', () => {
  it.concurrent.each(supplies)(
    '$name: frequency within 3 %, output mean within 1 %, efficiency within 2 points, primary peak within 5 %',
    async ({ design, keepShortWindow }: { design: Design; keepShortWindow?: boolean }) => {
      const { ours, spice } = await driverFiguresBoth(design, { keepShortWindow });
      // The bounds; both integrate the same equations from the same state.
      expect(driverMismatches(ours, spice)).toEqual([]);
    },
    240_000,
  );
});
