import { ESTIMATE_VALIDITY_BOUNDS } from '../driver';
import type { MethodInfo } from '../methods';
import { upperLimitVerdict, type CheckVerdict } from '../safety';
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

/**
 * The agreement the steady-state ladder model holds against ngspice on the same netlist (shared/test/ngspice:
 * mean within 0.5 %, ripple within 5 %); the driver estimate states its own (ESTIMATE_VALIDITY_BOUNDS).
 */
export const LADDER_ESTIMATE_TOLERANCE = { output: 0.005, ripple: 0.05 } as const;
/** Where the estimate states no tolerance, a difference beyond this is still called out. */
const UNSTATED_TOLERANCE = 0.02;

/** The method line of a figure taken from the stored simulation. */
export const STORED_SIMULATION_METHOD: MethodInfo = {
  methodId: 'stored-simulation',
  summary: 'from the stored full simulation of this revision (same engine version, same document)',
  assumptions: ['the circuit as the design states it, integrated in time to steady state'],
  source: 'Ladderwright simulator, compared with ngspice on the exported netlist (shared/test/ngspice)',
};

function percent(fraction: number): string {
  const value = Math.abs(fraction) * 100;
  return value >= 10 ? value.toFixed(0) : value.toFixed(1);
}

function difference(
  key: ComparedFigure,
  label: string,
  estimate: number,
  simulation: number,
  tolerance: number | null,
): FigureDifference | null {
  if (!Number.isFinite(estimate) || !Number.isFinite(simulation)) return null;
  const isPoints = key === 'efficiency';
  if (!isPoints && simulation === 0) return null;
  const delta = isPoints ? estimate - simulation : (estimate - simulation) / Math.abs(simulation);
  const exceedsTolerance = Math.abs(delta) > (tolerance ?? UNSTATED_TOLERANCE);
  const shown =
    key === 'efficiency'
      ? `${(estimate * 100).toFixed(0)} %`
      : formatQuantity(estimate, key === 'frequency' ? 'Hz' : key === 'discharge' ? 's' : 'V');
  const direction = isPoints
    ? `${(Math.abs(delta) * 100).toFixed(0)} points ${delta < 0 ? 'below' : 'above'} the simulation`
    : `${percent(delta)} % ${delta < 0 ? 'below' : 'above'} the simulation`;
  const tolerated = isPoints ? `${((tolerance ?? 0) * 100).toFixed(0)} points` : `${percent(tolerance ?? 0)} %`;
  const stated =
    tolerance === null
      ? 'the estimate states no tolerance for it'
      : `${exceedsTolerance ? 'beyond' : 'within'} the estimate's stated ${tolerated}`;
  return {
    key,
    label,
    estimate,
    simulation,
    difference: delta,
    tolerance,
    exceedsTolerance,
    text: `estimate ${shown}, ${direction} (${stated})`,
  };
}

/** The discharge-time check evaluated again on the simulated time, against the same limit. */
function dischargeCheckAt(check: CheckVerdict, dischargeTimeS: number): CheckVerdict {
  if (check.unit !== 's') return check;
  return upperLimitVerdict({
    id: check.id,
    subject: check.subject,
    rule: check.rule,
    value: dischargeTimeS,
    limit: check.limit,
    unit: check.unit,
  });
}

/**
 * The headline figures a revision shows: a stored full simulation's when there is one of the same document under
 * the engine version that produced the report, else the estimate's. Output, ripple, discharge time (and its check),
 * and a driver's efficiency come from the simulation; every figure both give is set beside the other with its
 * difference, flagged where the difference exceeds the estimate's stated tolerance.
 */
export function headlineSource(
  report: DesignReport,
  simulation: SimulatedFigures | null,
  targets: { outputV: number; rippleMaxV: number },
): HeadlineSource {
  if (!simulation || simulation.engineVersion !== report.engineVersion) {
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
  const driver = report.driver;
  const outputTolerance = driver ? ESTIMATE_VALIDITY_BOUNDS.output : LADDER_ESTIMATE_TOLERANCE.output;
  const differences: FigureDifference[] = [];
  const simulatedKeys: ComparedFigure[] = [];
  const next: DesignReport = { ...report, checks: report.checks, meetsTargets: { ...report.meetsTargets } };
  const push = (entry: FigureDifference | null) => {
    if (entry) differences.push(entry);
  };
  if (simulation.outputMeanV !== null) {
    simulatedKeys.push('output');
    push(difference('output', 'Output (mean, loaded)', report.outputMeanV, simulation.outputMeanV, outputTolerance));
    next.outputMeanV = simulation.outputMeanV;
  }
  if (simulation.ripplePeakToPeakV !== null) {
    simulatedKeys.push('ripple');
    push(
      difference(
        'ripple',
        'Ripple (peak-to-peak)',
        report.ripplePeakToPeakV,
        simulation.ripplePeakToPeakV,
        driver ? null : LADDER_ESTIMATE_TOLERANCE.ripple,
      ),
    );
    next.ripplePeakToPeakV = simulation.ripplePeakToPeakV;
  }
  if (simulation.dischargeTimeS !== null && report.dischargeTimeS !== null) {
    simulatedKeys.push('discharge');
    push(difference('discharge', 'Discharge time', report.dischargeTimeS, simulation.dischargeTimeS, null));
    const dischargeTimeS = simulation.dischargeTimeS;
    next.dischargeTimeS = dischargeTimeS;
    next.checks = report.checks.map((check) =>
      check.id === 'discharge-time' ? dischargeCheckAt(check, dischargeTimeS) : check,
    );
  }
  if (driver) {
    const frequencyHz = simulation.oscillationFrequencyHz;
    if (frequencyHz !== null && frequencyHz !== undefined) {
      const entry = difference(
        'frequency',
        'Oscillation frequency',
        driver.benchFigures.oscillationFrequencyHz,
        frequencyHz,
        ESTIMATE_VALIDITY_BOUNDS.frequency,
      );
      push(
        entry && simulation.isOscillationIrregular
          ? { ...entry, text: `${entry.text}; ${IRREGULAR_OSCILLATION_NOTE}` }
          : entry,
      );
    }
    const efficiency = simulation.efficiency;
    if (efficiency !== null && efficiency !== undefined) {
      simulatedKeys.push('efficiency');
      push(difference('efficiency', 'Driver efficiency', driver.figures.efficiency.value, efficiency, null));
      next.driver = {
        ...driver,
        figures: { ...driver.figures, efficiency: { value: efficiency, method: STORED_SIMULATION_METHOD } },
      };
    }
  }
  next.meetsTargets = {
    output:
      Math.sign(next.outputMeanV) === Math.sign(targets.outputV) &&
      Math.abs(next.outputMeanV) >= Math.abs(targets.outputV),
    ripple: next.ripplePeakToPeakV <= targets.rippleMaxV,
  };
  return {
    source: 'simulation',
    report: next,
    simulatedKeys,
    differences,
    simulatedAt: simulation.finishedAt,
    notSettledWithinS: simulation.notSettledWithinS ?? null,
    isOscillationIrregular: Boolean(driver && simulation.isOscillationIrregular),
  };
}
