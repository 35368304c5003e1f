import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { MeasuredPoint } from '../../../src/bench/bench.types';
import { applyParameterValues, type CalibrationParameterId } from '../../../src/calibration';
import { designExamples } from '../../../src/designs/design-examples';
import type { Design } from '../../../src/designs/design.types';
import { startUpNetlist } from '../synthetic-bench';

/**
 * The start-up fits' synthetic bench curves: ngspice runs of the demo tester's driver (ladder capacitors
 * 470 pF, as in the driver supplies' ngspice comparison, so that a short window sees the ladder charge) with
 * one parameter set to a known value, read as cycle means (`ngspiceStartUp`), stored in
 * START_UP_REFERENCE_FILE with their decks by make-start-up-references.ts.
 */
export const START_UP_REFERENCE_FILE = 'start-up-curves.ngspice.json';

export const startUpTester: Design = structuredClone(designExamples.surfaceChargeTester);
startUpTester.multiplier.capacitors = startUpTester.multiplier.capacitors.map((c) => ({ ...c, valueF: 470e-12 }));

export interface StartUpCase {
  key: string;
  id: CalibrationParameterId;
  truth: number;
  /** Window in period guesses of the design. */
  periods: number;
  count: number;
}

export const START_UP_CASES: readonly StartUpCase[] = [
  { key: 'gain-80', id: 'transistorGain', truth: 80, periods: 12, count: 10 },
  { key: 'coupling-0.95', id: 'couplingCoefficient', truth: 0.95, periods: 12, count: 10 },
  // Half the window: the loaded secondary's output levels off within it, and each model run costs half.
  { key: 'self-capacitance-20p', id: 'secondarySelfCapacitance', truth: 20e-12, periods: 6, count: 10 },
];

export interface StoredStartUpCurve extends StartUpCase {
  deck: string;
  points: MeasuredPoint[];
}

export interface StartUpReference {
  about: string;
  ngspiceVersion: string;
  command: string;
  curves: StoredStartUpCurve[];
}

/** The tester with the case's parameter at its true value. */
export function caseDesign(entry: StartUpCase): Design {
  return applyParameterValues(startUpTester, [entry.id], [entry.truth]);
}

/** The deck our exporter writes today for a case (a stored curve is current while its deck is the same). */
export function caseDeck(entry: StartUpCase): string {
  return startUpNetlist(caseDesign(entry), entry.periods);
}

export function readStartUpReference(): StartUpReference {
  return JSON.parse(readFileSync(path.join(__dirname, START_UP_REFERENCE_FILE), 'utf8')) as StartUpReference;
}

/** The stored curve of a case. */
export function storedCurve(reference: StartUpReference, key: string): StoredStartUpCurve {
  const curve = reference.curves.find((entry) => entry.key === key);
  if (!curve) throw new Error(`no stored start-up curve ${key}; run make-start-up-references.ts`);
  return curve;
}
