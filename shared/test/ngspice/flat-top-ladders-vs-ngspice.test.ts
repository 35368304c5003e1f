import { describe, expect, it } from 'vitest';
import { buildLadderCircuit, type LadderCircuitSpec } from '../../src/circuits/build-ladder-circuit';
import { chargeBalanceCapacitorVoltagesV } from '../../src/circuits/steady-state-estimate';
import { analyzeLadder } from '../../src/multiplier/analyze-ladder';
import { createWorkspace } from '../../src/multiplier/charge-transfer-model';
import type { LadderInput } from '../../src/multiplier/ladder.types';
import { plateauRates } from '../../src/multiplier/plateau-rates';
import { buildLadderNetwork, EVENT_H, EVENT_L } from '../../src/multiplier/topologies';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { windowMean, windowPeakToPeak } from '../../src/sim/waveform-measures';
import { hasNgspice, runNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the netlist our exporter writes, a transient of 300 cycles
// from the charge-balance start (its cycle mean then moves less than 1e-6 per 100 cycles). The engine's flat-top
// (pulse) rates come from the active-set solve on ladders where diodes drop out of conduction through a phase:
// every cell count of 3 and up has such a phase, and six cells or more take more rounds than the engine once
// allowed, when it fell back to instantaneous transfer (then 0.7–1.2 % low on the mean and 7–52 % high on the
// ripple of these ladders, measured when this test was written).
const ngspiceAvailable = hasNgspice();
if (!ngspiceAvailable)
  console.warn('ngspice not found on PATH: the ngspice reference tests are skipped (CI installs it).');

const diode = { saturationCurrentA: 1e-9, emissionCoefficient: 1.8, seriesResistanceOhm: 1 };
const drive = {
  kind: 'pulse' as const,
  forwardPeakV: 150,
  flybackPeakV: 450,
  frequencyHz: 20e3,
  dutyCycle: 0.7,
  sourceResistanceOhm: 10,
};
const periodS = 1 / drive.frequencyHz;
/** The engine's input but its capacitors and load: no bleeder or series resistor, as in the circuit. */
const bareLadder = {
  topology: 'half-wave' as const,
  drive,
  diode,
  polarity: 1 as const,
  bleederOhm: null,
  seriesOutputResistanceOhm: 0,
};
/** Capacitors between 5 and 15 nF, unequal so that no symmetry leaves every diode conducting. */
const unequal = (count: number) => Array.from({ length: count }, (_, i) => 10e-9 * (0.5 + ((i * 0.618) % 1)));

const cases = [
  {
    name: 'half-wave, 3 cells (no diode holds through the L phase)',
    capacitorsF: Array<number>(3).fill(10e-9),
    loadA: 1e-3,
  },
  { name: 'half-wave, 6 cells, unequal capacitors', capacitorsF: unequal(6), loadA: 0.5e-3 },
  { name: 'half-wave, 8 cells, unequal capacitors', capacitorsF: unequal(8), loadA: 0.3e-3 },
];

describe('flat-top rates of ladders whose diodes drop out', () => {
  it.each(cases)('come from the active-set solve, both phases: $name', ({ capacitorsF }) => {
    const net = buildLadderNetwork('half-wave', capacitorsF);
    const input = { drive, polarity: 1, diode } as unknown as LadderInput;
    const loadRate = createWorkspace(net, input).loadRate;
    for (const event of [EVENT_H, EVENT_L]) {
      const rates = plateauRates(net, loadRate, event);
      expect(rates).not.toBeNull();
      const atEvent = net.diodeEvent.filter((e) => e === event).length;
      const holding = [...rates!.conducting].filter((on, d) => on === 1 && net.diodeEvent[d] === event).length;
      // Some of the event's diodes stop conducting through the phase: the solve had to drop them.
      if (event === EVENT_L) expect(holding).toBeLessThan(atEvent);
    }
  });
});

describe.skipIf(!ngspiceAvailable)('pulse-driven ladders: the engine against ngspice', () => {
  it.concurrent.each(cases)('$name', async ({ capacitorsF, loadA }) => {
    const load = { kind: 'current' as const, currentA: loadA };
    const spec: LadderCircuitSpec = {
      topology: 'half-wave',
      cellCount: capacitorsF.length,
      capacitorsF,
      diode,
      drive,
      load,
    };
    const circuit = buildLadderCircuit({ ...spec, initialCapacitorVoltagesV: chargeBalanceCapacitorVoltagesV(spec) });
    const cycles = 300;
    const ng = await runNgspice(
      toSpiceNetlist(circuit, { transient: { stopTimeS: cycles * periodS, maxStepS: periodS / 200 } }),
      ['v(top)'],
    );
    const top = ng.signals['v(top)']!;
    const from = (cycles - 1) * periodS;
    const to = cycles * periodS;
    const ngMean = windowMean(ng.timeS, top, from, to);
    const ngRipple = windowPeakToPeak(ng.timeS, top, from, to);
    const engine = analyzeLadder({ ...bareLadder, capacitorsF, load });
    // Mean within 0.3 % (measured 0.03–0.24 %); ripple within 10 % (measured 1–8 % low: the model's linear
    // fall between transfers against the circuit's rounded conduction).
    expect(Math.abs(engine.outputMeanV / ngMean - 1)).toBeLessThan(0.003);
    expect(Math.abs(engine.ripplePeakToPeakV / ngRipple - 1)).toBeLessThan(0.1);
  });
});
