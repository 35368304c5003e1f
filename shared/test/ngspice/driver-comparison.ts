import { designExamples } from '../../src/designs/design-examples';
import type { Design } from '../../src/designs/design.types';
import type { DriverStage } from '../../src/designs/driver-stage.types';
import {
  driverDesignCircuit,
  driverPeriodGuessS,
  engineCapacitorVoltagesV,
} from '../../src/runs/driver-design-circuit';
import { oscillationFigures } from '../../src/sim/oscillation-measures';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { simulateTransient } from '../../src/sim/transient-analysis';
import { runNgspice, type NgspiceTrace } from './run-ngspice';

// One blocking-oscillator supply run by our simulator and by ngspice (REFERENCES.md §7) on the netlist our
// exporter writes. Both start from the same state (the ladder at the engine's estimate where it has one and
// the ladder is forward-fed, else empty) and run the same short window; the figures are read over the whole
// cycles of its second half by the same code (oscillation-measures.ts). Both at reltol 1e-5: at ngspice's
// default 1e-3 its own answer on these circuits moves by a few % with the tolerance, and at 1e-4 it stops on
// "timestep too small" in the saturating core's behavioural flux formulation (DEVELOPERS.md).

const base = designExamples.surfaceChargeTester;

/** The demo tester with small ladder capacitors and a heavier load, changed by `change`. */
export function supply(
  name: string,
  change: (driver: DriverStage, design: Design) => void,
): { name: string; design: Design } {
  const design = structuredClone(base);
  if (design.drive.kind !== 'driver') throw new Error('the tester has a driver stage');
  // Small ladder capacitors and a heavier load, so that the window sees a loaded, moving ladder.
  design.multiplier.capacitors = design.multiplier.capacitors.map((c) => ({ ...c, valueF: 470e-12 }));
  design.load = { kind: 'current', currentA: 20e-6 };
  change(design.drive.driver, design);
  return { name, design };
}

/**
 * The 6 V, 1:50 stage with an RCD clamp (4.7 kΩ, 10 nF), its diode and the ladder's with junction capacitance and
 * breakdown: a stage whose cycles come in bursts.
 */
export function rcdWithJunctions(d: DriverStage, design: Design): void {
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
  Object.assign(design.multiplier.diode, {
    junctionCapacitanceF: 8e-12,
    junctionPotentialV: 0.6,
    gradingCoefficient: 0.4,
    breakdownVoltageV: 4000,
    breakdownCurrentA: 1e-6,
  });
}

/** A tripler: three cells, the first three capacitors. */
export function threeCells(design: Design): void {
  design.multiplier.cellCount = 3;
  design.multiplier.capacitors = design.multiplier.capacitors.slice(0, 3);
}

/** The figures both simulators are compared on. */
export interface DriverFigures {
  frequencyHz: number;
  /** The turn-on periods spread (bursts; oscillation-measures.ts): frequencyHz is their mean. */
  isIrregular: boolean;
  outputMeanV: number;
  primaryPeakA: number;
  efficiency: number;
}

interface DriverTraces {
  col: ArrayLike<number>;
  vcc: ArrayLike<number>;
  primary: ArrayLike<number>;
  top: ArrayLike<number>;
  out: ArrayLike<number>;
  emf: ArrayLike<number>;
  supplyA: ArrayLike<number>;
}

/** Figures over the whole cycles of [fromS, end]: turn-on frequency, output mean, primary peak, P_load/P_in. */
function figuresOf(t: ArrayLike<number>, s: DriverTraces, fromS: number, loadA: number): DriverFigures {
  const keep = Array.from(t, (_, i) => i).filter((i) => t[i]! >= fromS);
  const pick = (a: ArrayLike<number>): number[] => keep.map((i) => a[i]!);
  const time = pick(t);
  const primary = pick(s.primary);
  const collector = keep.map((i) => s.col[i]! - s.vcc[i]!);
  const mean = (values: number[]): number => oscillationFigures(time, primary, collector, values)!.mean;
  const f = oscillationFigures(time, primary, collector, pick(s.top))!;
  // Power drawn (SPICE sign: a source delivering power carries negative current) and power into the load.
  const inW = mean(keep.map((i) => -s.emf[i]! * s.supplyA[i]!));
  const loadW = mean(keep.map((i) => Math.abs(s.out[i]!) * loadA));
  return {
    frequencyHz: f.frequencyHz,
    isIrregular: f.isIrregular,
    outputMeanV: f.mean,
    primaryPeakA: f.primaryCurrentPeakA,
    efficiency: loadW / inW,
  };
}

/** The ladder state both simulators start from (see the note at the top of this file), V per capacitor. */
export function comparisonStartV(design: Design): number[] {
  if (design.drive.kind !== 'driver') throw new Error('driver designs only');
  // Flyback-fed ladders start empty: from the estimate's charge, which sits well off where they settle, our
  // Newton gave up in the first periods on one of them. Both simulators always start from the same state.
  const isFlybackFed = design.drive.driver.transformer.secondaryPhasing !== 'forward';
  try {
    if (!isFlybackFed) return engineCapacitorVoltagesV(design);
  } catch {
    // The engine refuses some designs; both simulators then start from an empty ladder.
  }
  return design.multiplier.capacitors.map(() => 0);
}

const NGSPICE_VECTORS = ['v(col)', 'v(vcc)', 'i(vt1_lp_sense)', 'v(top)', 'v(out)', 'v(emf)', 'i(vbat)'];

/** The exported netlist of a driver design from a ladder state, run to `stopS` with steps of `maxStepS`. */
function comparisonNetlist(design: Design, initialV: number[], stopS: number, maxStepS: number): string {
  return toSpiceNetlist(driverDesignCircuit(design, initialV), {
    transient: { stopTimeS: stopS, maxStepS, startFrom: 'element-initial-conditions' },
    extraLines: ['.options reltol=1e-5'],
  });
}

/** ngspice's figures over the whole cycles of [fromS, stopS] of a driver design started from `initialV`. */
export async function ngspiceDriverFigures(
  design: Design,
  initialV: number[],
  window: { fromS: number; stopS: number },
): Promise<DriverFigures> {
  if (design.drive.kind !== 'driver') throw new Error('driver designs only');
  const periodS = driverPeriodGuessS(design.drive.driver);
  const netlist = comparisonNetlist(design, initialV, window.stopS, periodS / 200);
  const ng = await runNgspice(netlist, NGSPICE_VECTORS);
  return ngspiceFiguresOf(ng, window.fromS, design);
}

function ngspiceFiguresOf(ng: NgspiceTrace, fromS: number, design: Design): DriverFigures {
  const g = (v: string): Float64Array => ng.signals[v]!;
  return figuresOf(
    ng.timeS,
    {
      col: g('v(col)'),
      vcc: g('v(vcc)'),
      primary: g('i(vt1_lp_sense)'),
      top: g('v(top)'),
      out: g('v(out)'),
      emf: g('v(emf)'),
      supplyA: g('i(vbat)'),
    },
    fromS,
    design.load?.kind === 'current' ? design.load.currentA : 0,
  );
}

/** The window read, in estimated periods: the second half of 40, or [20, 100] when the cycles come in bursts. */
const WINDOW = { fromPeriods: 20, stopPeriods: 40 };
const IRREGULAR_WINDOW = { fromPeriods: 20, stopPeriods: 100 };

/**
 * Our figures and ngspice's for one driver design (see the note at the top of this file). When either side's
 * cycles are irregular (bursts whose periods spread by over 20 %), the few whole cycles of the short window
 * differ between two correct solvers by a whole burst (12 V at 1:200: 7 cycles against 6, 40.0 against
 * 37.6 kHz), so both run again and are read over a window four times as long (there 41.79 against 41.85 kHz):
 * the mean frequency of irregular cycles is compared over many bursts, like with like. `keepShortWindow` for a
 * design with two competing modes, where the long window would compare one mode with the other.
 */
export async function driverFiguresBoth(
  design: Design,
  options: { keepShortWindow?: boolean } = {},
): Promise<{ ours: DriverFigures; spice: DriverFigures }> {
  const short = await driverFiguresOver(design, WINDOW);
  if (options.keepShortWindow || (!short.ours.isIrregular && !short.spice.isIrregular)) return short;
  return driverFiguresOver(design, IRREGULAR_WINDOW);
}

/** Our figures and ngspice's over the whole cycles of a window, in estimated periods. */
export async function driverFiguresOver(
  design: Design,
  window: { fromPeriods: number; stopPeriods: number },
): Promise<{ ours: DriverFigures; spice: DriverFigures }> {
  if (design.drive.kind !== 'driver') throw new Error('driver designs only');
  const initialV = comparisonStartV(design);
  const circuit = driverDesignCircuit(design, initialV);
  const periodS = driverPeriodGuessS(design.drive.driver);
  const run = { stopTimeS: window.stopPeriods * periodS, maxStepS: periodS / 200 };
  const fromS = window.fromPeriods * periodS;
  const loadA = design.load?.kind === 'current' ? design.load.currentA : 0;
  const reference = runNgspice(comparisonNetlist(design, initialV, run.stopTimeS, run.maxStepS), NGSPICE_VECTORS);
  const r = simulateTransient(circuit, {
    ...run,
    probes: ['col', 'vcc', 'I(T1.Lp)', 'top', 'out', 'emf', 'I(Vbat)'],
    tolerances: { relative: 1e-5 },
  });
  const s = r.signals;
  const ours = figuresOf(
    r.timeS,
    {
      col: s.col!,
      vcc: s.vcc!,
      primary: s['I(T1.Lp)']!,
      top: s.top!,
      out: s.out!,
      emf: s.emf!,
      supplyA: s['I(Vbat)']!,
    },
    fromS,
    loadA,
  );
  return { ours, spice: ngspiceFiguresOf(await reference, fromS, design) };
}

/**
 * The bounds both simulators must meet on one design: frequency within 3 % (for irregular cycles their mean
 * over the long window, see driverFiguresBoth), output mean within 1 %, efficiency within 2 points, primary
 * peak within 5 % (ngspice's figures the reference).
 */
export function driverMismatches(ours: DriverFigures, spice: DriverFigures): string[] {
  const out: string[] = [];
  const relative = (a: number, b: number): number => Math.abs(a / b - 1);
  if (!(relative(ours.frequencyHz, spice.frequencyHz) < 0.03))
    out.push(`frequency ${ours.frequencyHz} Hz against ngspice's ${spice.frequencyHz} Hz`);
  if (!(relative(ours.outputMeanV, spice.outputMeanV) < 0.01))
    out.push(`output mean ${ours.outputMeanV} V against ngspice's ${spice.outputMeanV} V`);
  if (!(Math.abs(ours.efficiency - spice.efficiency) < 0.02))
    out.push(`efficiency ${ours.efficiency} against ngspice's ${spice.efficiency}`);
  if (!(relative(ours.primaryPeakA, spice.primaryPeakA) < 0.05))
    out.push(`primary peak ${ours.primaryPeakA} A against ngspice's ${spice.primaryPeakA} A`);
  return out;
}
