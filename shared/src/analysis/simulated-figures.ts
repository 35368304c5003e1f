import { ESTIMATE_VALIDITY_BOUNDS } from '../driver';
import type { DischargeRule } from '../designs/design.types';
import { dischargeRuleLimits, upperLimitVerdict, type CheckVerdict } from '../safety';
import { formatQuantity } from '../units';
import type { DesignReport } from './analyze-design';
import {
  estimateHeadline,
  IRREGULAR_OSCILLATION_NOTE,
  STORED_SIMULATION_METHOD,
  type ComparedFigure,
  type FigureDifference,
  type HeadlineSource,
  type SimulatedFigures,
} from './figure-source';

/**
 * The agreement the steady-state ladder model holds against ngspice on the same netlist (shared/test/ngspice:
 * mean within 0.5 %, ripple within 5 %); the driver estimate states its own (ESTIMATE_VALIDITY_BOUNDS).
 */
export const LADDER_ESTIMATE_TOLERANCE = { output: 0.005, ripple: 0.05 } as const;

/** A difference of two fractions in whole percentage points: "1 point", "10 points". */
function percentagePoints(fraction: number): string {
  const points = (Math.abs(fraction) * 100).toFixed(0);
  return `${points} ${points === '1' ? 'point' : 'points'}`;
}

/** Where the estimate states no tolerance, a difference beyond this is still called out. */
const UNSTATED_TOLERANCE = 0.02;

function percent(fraction: number): string {
  const value = Math.abs(fraction) * 100;
  return value >= 10 ? value.toFixed(0) : value.toFixed(1);
}

/** The signed difference as it reads in a narrow cell, unbroken (no-break space): "−3.6 %", "+10 %", "−1 point". */
function signedDifference(delta: number, isPoints: boolean): string {
  const sign = delta < 0 ? '−' : '+';
  return `${sign}${isPoints ? percentagePoints(delta) : `${percent(delta)} %`}`.replace(' ', '\u00a0');
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
    ? `${percentagePoints(delta)} ${delta < 0 ? 'below' : 'above'} the simulation`
    : `${percent(delta)} % ${delta < 0 ? 'below' : 'above'} the simulation`;
  const tolerated = isPoints ? percentagePoints(tolerance ?? 0) : `${percent(tolerance ?? 0)} %`;
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
    brief: `estimate ${shown} (${signedDifference(delta, isPoints)})`,
  };
}

/** The discharge rule's voltage is the design's safe voltage (a time to one is a time to the other); true when not told. */
function isRuleAtSafeLevel(targets: { safeVoltageV?: number; dischargeRule?: DischargeRule }): boolean {
  if (targets.safeVoltageV === undefined || targets.dischargeRule === undefined) return true;
  return dischargeRuleLimits(targets.dischargeRule).voltageV === targets.safeVoltageV;
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
  targets: { outputV: number; rippleMaxV: number; safeVoltageV?: number; dischargeRule?: DischargeRule },
): HeadlineSource {
  if (!simulation || simulation.engineVersion !== report.engineVersion) return estimateHeadline(report);
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
  // A simulation discharges to the rule's voltage (its check's level): it is set beside the estimate to the same level,
  // and stands for the time to the safe level only where the two levels are one.
  const estimateToRuleS = report.dischargeTimeToRuleS ?? report.dischargeTimeS;
  if (simulation.dischargeTimeS !== null && estimateToRuleS !== null) {
    simulatedKeys.push('discharge');
    push(difference('discharge', 'Discharge time', estimateToRuleS, simulation.dischargeTimeS, null));
    const dischargeTimeS = simulation.dischargeTimeS;
    next.dischargeTimeToRuleS = dischargeTimeS;
    if (isRuleAtSafeLevel(targets)) next.dischargeTimeS = dischargeTimeS;
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
