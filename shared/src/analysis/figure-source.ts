import type { MethodInfo } from '../methods';
import { formatQuantity } from '../units';
import type { DesignReport } from './analyze-design';

/**
 * The figures of a stored full simulation (start-up, steady state and discharge in one run) of a revision,
 * with the engine version that ran it: what may stand in for the instant estimate's figures.
 */
export interface SimulatedFigures {
  engineVersion: string;
  outputMeanV: number | null;
  ripplePeakToPeakV: number | null;
  dischargeTimeS: number | null;
  oscillationFrequencyHz?: number | null;
  /** The simulated cycles spread in length (bursts): the frequency is their mean (SimulationSummary). */
  isOscillationIrregular?: boolean | null;
  efficiency?: number | null;
  /**
   * The simulated time (s) within which the run did not settle (the steady run, or a driver's cold start),
   * or null when it settled; absent in summaries written before it was recorded.
   */
  notSettledWithinS?: number | null;
  /** When the run finished (ISO 8601). */
  finishedAt: string;
}

export type FigureSource = 'simulation' | 'estimate';

export type ComparedFigure = 'output' | 'ripple' | 'frequency' | 'efficiency' | 'discharge';

/** One figure of the estimate beside the simulation's, with their difference against the estimate's tolerance. */
export interface FigureDifference {
  key: ComparedFigure;
  label: string;
  estimate: number;
  simulation: number;
  /** (estimate − simulation)/|simulation|; for efficiency the difference in fraction points. */
  difference: number;
  /** The agreement with the simulation the estimate states for this figure, or null where it states none. */
  tolerance: number | null;
  /** True when the difference is beyond the stated tolerance (or beyond 2 % where none is stated). */
  exceedsTolerance: boolean;
  /** The difference in words: "estimate 1.35 kV, 11 % below the simulation (beyond the estimate's stated 5.0 %)". */
  text: string;
  /** The estimate and its signed difference, for a narrow cell: "estimate 1.35 kV (−11 %)". */
  brief: string;
}

export interface HeadlineSource {
  source: FigureSource;
  /** The report with the simulated figures in place of the estimate's where the simulation gives them. */
  report: DesignReport;
  /** The figures taken from the simulation (empty for 'estimate'). */
  simulatedKeys: ComparedFigure[];
  differences: FigureDifference[];
  /** When the simulation used finished (ISO 8601), or null. */
  simulatedAt: string | null;
  /** The simulated time (s) within which the simulation used did not settle; null when it settled or none is used. */
  notSettledWithinS: number | null;
  /** The simulation used found the oscillation irregular (IRREGULAR_OSCILLATION_NOTE); false when none is used. */
  isOscillationIrregular: boolean;
}

/**
 * What an irregular simulated oscillation means, in plain words, wherever its frequency is shown (Waveforms,
 * the estimate's difference, spec sheet).
 */
export const IRREGULAR_OSCILLATION_NOTE =
  'irregular oscillation: the transistor turns on in bursts and the cycles differ in length by more than 20 %, so the frequency is their mean';

/**
 * How a figure taken from the stored simulation is marked wherever it is shown (Workbench, Checks, Sign-off,
 * spec sheet): "from simulation", or "from simulation, not settled within 20 ms" when the run did not settle.
 * An unsettled run's figures still stand in for the estimate's: they are the circuit integrated in time, the
 * remaining approach is stated, and the estimate beside them says how far apart the two are.
 */
export function simulationSourceLabel(headline: Pick<HeadlineSource, 'notSettledWithinS'>): string {
  return headline.notSettledWithinS === null
    ? 'from simulation'
    : `from simulation, not settled within ${formatQuantity(headline.notSettledWithinS, 's')}`;
}

/** The method line of a figure taken from the stored simulation. */
export const STORED_SIMULATION_METHOD: MethodInfo = {
  methodId: 'stored-simulation',
  summary: 'from the stored full simulation of this revision (same engine version, same document)',
  assumptions: ['the circuit as the design states it, integrated in time to steady state'],
  source: 'Ladderwright simulator, compared with ngspice on the exported netlist (shared/test/ngspice)',
};

/** The headline of a report shown on its own estimate: no simulation stands in for any figure. */
export function estimateHeadline(report: DesignReport): HeadlineSource {
  return {
    source: 'estimate',
    report,
    simulatedKeys: [],
    differences: [],
    simulatedAt: null,
    notSettledWithinS: null,
    isOscillationIrregular: false,
  };
}
