import type { Design } from '@ladderwright/shared/designs';
import {
  STORED_SIMULATION_METHOD,
  type ComparedFigure,
  type DesignReport,
  type FigureDifference,
  type FigureSource,
  type HeadlineSource,
} from '@ladderwright/shared/analysis';
import type { MethodInfo } from '@ladderwright/shared/methods';
import {
  describeMargin,
  lowerLimitVerdict,
  mergeCheckRows,
  upperLimitVerdict,
  type CheckVerdict,
} from '@ladderwright/shared/safety';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';

/** One figure of the Verdict strip: value, target and verdict (word and a bounded margin), or why there is none. */
export interface StripFigure {
  key: 'output' | 'ripple' | 'droop' | 'efficiency' | 'battery' | 'energy' | 'discharge' | 'worst';
  label: string;
  value: string;
  /** The target or limit as read ("≤ 2 V", "≥ 500 h"), or why there is none. */
  target: string;
  verdict: CheckVerdict['verdict'] | null;
  /** describeMargin's reading of the verdict, e.g. "38 % below the limit". */
  margin: string | null;
  method: MethodInfo | null;
  /** Where the value comes from: the stored simulation of the revision or the instant estimate; null for a verdict. */
  source: FigureSource | null;
  /** The estimate set against the simulation, where both give this figure. */
  difference: FigureDifference | null;
}

const verdictOrder: Record<CheckVerdict['verdict'], number> = { fail: 0, marginal: 1, pass: 2 };

/** The checks, worst first (fail, marginal, pass; smaller margin first within each). */
export function worstFirst<T extends Pick<CheckVerdict, 'verdict' | 'marginPct'>>(checks: readonly T[]): T[] {
  return [...checks].sort((a, b) => verdictOrder[a.verdict] - verdictOrder[b.verdict] || a.marginPct - b.marginPct);
}

function judged(check: CheckVerdict | undefined): Pick<StripFigure, 'verdict' | 'margin'> {
  return check ? { verdict: check.verdict, margin: describeMargin(check) } : { verdict: null, margin: null };
}

const quantityUnits = new Set(['V', 'A', 'F', 'Ohm', 'Hz', 'W', 'J', 'C', 's', 'H', 'm']);

/** A check's limit with its unit, in engineering notation where the unit is a quantity. */
function limitOf(check: CheckVerdict): string {
  if (quantityUnits.has(check.unit)) return formatQuantity(check.limit, check.unit as QuantityUnit);
  return `${Number(check.limit.toPrecision(3))} ${check.unit}`.trim();
}

function limitText(check: CheckVerdict | undefined, fallback: string): string {
  if (!check) return fallback;
  const unit = check.unit === 'C' || check.unit === 's' || check.unit === 'J' || check.unit === 'V' ? check.unit : null;
  const what = unit === 'C' ? 'charge' : unit === 'J' ? 'energy' : unit === 's' ? 'time' : 'voltage';
  return unit ? `${what} ≤ ${formatQuantity(check.limit, unit)}` : fallback;
}

const COMPARED: Partial<Record<StripFigure['key'], ComparedFigure>> = {
  output: 'output',
  ripple: 'ripple',
  efficiency: 'efficiency',
  discharge: 'discharge',
};

/** Source and difference of each figure: from the stored simulation where it gives the figure, else the estimate. */
function withSource(figure: Omit<StripFigure, 'source' | 'difference'>, headline: HeadlineSource | null): StripFigure {
  // The worst check is a verdict, and a figure the design does not have (no driver stage) comes from nowhere.
  if (figure.key === 'worst' || figure.value === 'n/a') return { ...figure, source: null, difference: null };
  const compared = COMPARED[figure.key];
  const isSimulated = compared !== undefined && (headline?.simulatedKeys.includes(compared) ?? false);
  return {
    ...figure,
    source: isSimulated ? 'simulation' : 'estimate',
    method: isSimulated ? STORED_SIMULATION_METHOD : figure.method,
    difference: headline?.differences.find((entry) => entry.key === compared) ?? null,
  };
}

/**
 * The eight figures an engineer watches while editing: output, ripple, droop, driver efficiency, battery life,
 * stored energy, discharge time and the worst check, each against its target or limit from the report's own checks.
 * With a `headline` (a current stored simulation), its figures stand in and each says where it comes from.
 */
export function verdictStripFigures(
  estimate: DesignReport,
  targets: Design['targets'],
  headline: HeadlineSource | null = null,
): StripFigure[] {
  const report = headline?.report ?? estimate;
  const steady = report.analysis.method;
  const output = lowerLimitVerdict({
    id: 'target-output',
    subject: 'output',
    rule: 'mean output at the operating load reaches the target magnitude',
    value: Math.abs(report.outputMeanV),
    limit: Math.abs(targets.outputV),
    unit: 'V',
  });
  const ripple = upperLimitVerdict({
    id: 'target-ripple',
    subject: 'ripple',
    rule: 'peak-to-peak ripple at the operating load stays below the target',
    value: report.ripplePeakToPeakV,
    limit: targets.rippleMaxV,
    unit: 'V',
  });
  // The droop the output target leaves room for: no-load output above the target magnitude.
  const allowedDroopV = Math.abs(report.noLoadOutputV) - Math.abs(targets.outputV);
  const droop =
    allowedDroopV > 0
      ? upperLimitVerdict({
          id: 'target-droop',
          subject: 'droop',
          rule: 'droop at the operating load stays within the room the no-load output leaves above the target',
          value: Math.abs(report.droopV),
          limit: allowedDroopV,
          unit: 'V',
        })
      : undefined;
  const driver = report.driver;
  const battery = driver?.batteryLife ?? null;
  const batteryVerdict =
    battery && battery.targetS !== null
      ? lowerLimitVerdict({
          id: 'target-battery',
          subject: 'battery life',
          rule: 'battery life to the end voltage reaches the target',
          value: battery.lifeS.value,
          limit: battery.targetS,
          unit: 's',
        })
      : undefined;
  const stored = worstFirst(report.checks.filter((check) => check.id.startsWith('stored-output')))[0];
  const discharge = report.checks.find((check) => check.id === 'discharge-time');
  const dischargeToRuleS = report.dischargeTimeToRuleS ?? report.dischargeTimeS;
  const worst = worstFirst(mergeCheckRows(report.checks))[0];
  // A load the supply cannot hold has no output figure: the strip says so and what it does hold.
  const capacity = headline?.source === 'simulation' ? null : driver?.loadCapacity;
  const figures: Omit<StripFigure, 'source' | 'difference'>[] = [
    capacity?.isLoadBeyond
      ? {
          key: 'output',
          label: 'Output (mean, loaded)',
          value: 'beyond supply',
          target: `${formatQuantity(targets.outputV, 'V')}`,
          verdict: 'fail',
          margin: `load beyond the supply: holds ${formatQuantity(capacity.maxLoadCurrentA, 'A')}, asked ${formatQuantity(capacity.loadCurrentA, 'A')}`,
          method: steady,
        }
      : {
          key: 'output',
          label: 'Output (mean, loaded)',
          value: formatQuantity(report.outputMeanV, 'V'),
          target: `${formatQuantity(targets.outputV, 'V')}`,
          ...judged(output),
          method: steady,
        },
    {
      key: 'ripple',
      label: 'Ripple (peak-to-peak)',
      value: formatQuantity(report.ripplePeakToPeakV, 'V'),
      target: `≤ ${formatQuantity(targets.rippleMaxV, 'V')}`,
      ...judged(ripple),
      method: steady,
    },
    {
      key: 'droop',
      label: 'Droop at load',
      value: formatQuantity(report.droopV, 'V'),
      target: droop ? `≤ ${formatQuantity(allowedDroopV, 'V')}` : 'no-load output below target',
      ...(droop ? judged(droop) : { verdict: 'fail', margin: 'no room' }),
      method: steady,
    },
    {
      key: 'efficiency',
      label: 'Driver efficiency',
      value: driver ? `${(driver.figures.efficiency.value * 100).toFixed(0)} %` : 'n/a',
      target: driver ? 'no target set' : 'no driver stage',
      verdict: null,
      margin: null,
      method: driver?.figures.efficiency.method ?? null,
    },
    {
      key: 'battery',
      label: 'Battery life',
      value: battery ? `${Number((battery.lifeS.value / 3600).toPrecision(3))} h` : 'n/a',
      target: battery
        ? battery.targetS !== null
          ? `≥ ${Number((battery.targetS / 3600).toPrecision(3))} h`
          : 'no target set'
        : driver
          ? 'no battery (DC supply)'
          : 'no driver stage',
      ...judged(batteryVerdict),
      method: battery?.lifeS.method ?? null,
    },
    {
      key: 'energy',
      label: 'Stored energy',
      value: formatQuantity(report.storedEnergyJ, 'J'),
      target: limitText(stored, 'no limit applies'),
      ...judged(stored),
      method: null,
    },
    {
      key: 'discharge',
      label: 'Discharge time',
      // The time to the rule's level, which the target below states (a stored simulation runs to it too).
      value: dischargeToRuleS === null ? 'no bleeder' : formatQuantity(dischargeToRuleS, 's'),
      target: discharge ? discharge.rule.split(';')[0]?.replace(/^[^:]*:\s*/, '') || '' : 'no rule applied',
      ...judged(discharge),
      method: null,
    },
    {
      key: 'worst',
      label: 'Worst check',
      value: worst ? worst.subject : 'none',
      target: worst ? `limit ${limitOf(worst)}` : 'no checks',
      ...judged(worst),
      method: null,
    },
  ];
  return figures.map((figure) => withSource(figure, headline));
}
