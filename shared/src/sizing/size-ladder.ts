import { DomainError } from '../errors';
import type { DiodePart, DischargeRule, PulseDrive, SineDrive, Topology } from '../designs/design.types';
import { analyzePrepared, operatingFigures, prepareLadder, withDiode } from '../multiplier/analyze-ladder';
import { capacitorGradeFactors } from '../multiplier/capacitor-places';
import { DERATING } from '../multiplier/ladder-stress';
import type { LadderAnalysis, LadderInput } from '../multiplier/ladder.types';
import type { MethodInfo } from '../methods';
import { dischargeRuleLimits } from '../safety/discharge';
import { preferredValuesBetween } from '../units/e-series';
import type { ESeriesName } from '../units/e-series';

export interface CapacitorOption {
  valueF: number;
  ratedVoltageV: number;
  costEach?: number;
  partCode?: string;
}

export interface DiodeOption extends DiodePart {
  costEach?: number;
}

export interface ResistorOption {
  valueOhm: number;
  ratedPowerW: number;
  limitingVoltageV: number;
  costEach?: number;
  partCode?: string;
}

export interface SizerRequest {
  /** Signed target at the load terminal. */
  targetOutputV: number;
  loadCurrentA: number;
  rippleMaxV: number;
  drive: SineDrive | PulseDrive;
  topologies?: readonly Topology[];
  /** Capacitor values from this E-series when no capacitor list is given (default E12, 100 pF … 10 µF). */
  series?: ESeriesName;
  capacitorRangeF?: readonly [number, number];
  parts?: {
    capacitors?: readonly CapacitorOption[];
    diodes?: readonly DiodeOption[];
    resistors?: readonly ResistorOption[];
  };
  /** Largest accepted excess of the mean output over the target, as a fraction (default 0.3). */
  maxOvershoot?: number;
  /** Extra cells (stages for full-wave) tried above the smallest count that can reach the target (default 8). */
  extraCells?: number;
  gradings?: ReadonlyArray<'equal' | 'graded'>;
  safeVoltageV?: number;
  dischargeRule?: DischargeRule;
  /** Stop after this many evaluated candidates (default 20 000). */
  maxCandidates?: number;
  resultCount?: number;
}

export interface SizerCandidate {
  rank: number;
  topology: Topology;
  cellCount: number;
  grading: 'equal' | 'graded';
  capacitorsF: number[];
  /** Rating chosen for each capacitor (from the parts list, or the next standard rating above the derated need). */
  capacitorRatedV: number[];
  capacitorPartCodes: Array<string | null>;
  diode: DiodeOption;
  bleeder: { count: number; resistor: ResistorOption } | null;
  outputMeanV: number;
  ripplePeakToPeakV: number;
  storedEnergyJ: number;
  totalCapacitanceF: number;
  partCount: number;
  /** Smallest margin of capacitor voltage and diode PIV to their derated ratings, percent. */
  worstMarginPct: number;
  /** Sum of part costs; null when any part has no cost. */
  cost: number | null;
}

export interface SizerResult {
  candidates: SizerCandidate[];
  evaluatedCount: number;
  meetingSpecCount: number;
  method: MethodInfo;
}

const SIZER_METHOD: MethodInfo = {
  methodId: 'sizer-enumerate-v1',
  summary:
    'Enumerates topology × cell count × capacitor value × grading × diode, analyses each with the steady-state model, keeps those meeting output (target to target + overshoot) and ripple, and ranks by cost (or part count), then stored energy.',
  assumptions: [
    'graded ladders give stage k of n the value (n − k + 1)·C (J. Lux, read)',
    `capacitor ratings from the parts list or the next standard rating at or above the voltage / ${DERATING.capacitorVoltage} (derating, common practice)`,
    `diodes with PIV rating below 2·Vmax / ${DERATING.diodePiv} are skipped`,
    'bleeder: the largest string from the resistor list that meets the discharge rule within its voltage and power ratings',
  ],
  source:
    'steady-state method charge-transfer-v1; cascade closed forms (J. Lux, read; Kuffel, Zaengl & Kuffel, from memory); IEC 61010-1 / IEC 60335-1 stored-energy limits; IEC 60063 preferred values',
};

const STANDARD_CAPACITOR_RATINGS_V = [
  50, 100, 250, 400, 630, 1000, 1600, 2000, 3000, 4000, 5000, 6000, 8000, 10000, 15000, 20000, 30000,
];

/** Generic diode choices when the request gives none (invented Northfold parts, common-practice figures). */
const DEFAULT_DIODES: DiodeOption[] = [
  {
    saturationCurrentA: 1e-9,
    emissionCoefficient: 3,
    seriesResistanceOhm: 10,
    ratedPivV: 1000,
    ratedAverageCurrentA: 0.1,
    ratedSurgeCurrentA: 10,
    partCode: 'NF-D1K-100M',
  },
  {
    saturationCurrentA: 2e-9,
    emissionCoefficient: 8,
    seriesResistanceOhm: 40,
    ratedPivV: 2500,
    ratedAverageCurrentA: 0.05,
    ratedSurgeCurrentA: 10,
    partCode: 'NF-D2K5-50M',
  },
  {
    saturationCurrentA: 2e-9,
    emissionCoefficient: 16,
    seriesResistanceOhm: 80,
    ratedPivV: 6000,
    ratedAverageCurrentA: 0.02,
    ratedSurgeCurrentA: 5,
    partCode: 'NF-D6K-20M',
  },
];

/** Generic bleeder resistors (common practice figures, REFERENCES.md §6). */
const DEFAULT_RESISTORS: ResistorOption[] = [
  { valueOhm: 10e6, ratedPowerW: 0.5, limitingVoltageV: 500, partCode: 'NF-R10M-500' },
  { valueOhm: 47e6, ratedPowerW: 0.5, limitingVoltageV: 1600, partCode: 'NF-R47M-HV' },
  { valueOhm: 100e6, ratedPowerW: 0.5, limitingVoltageV: 2500, partCode: 'NF-R100M-HV' },
];

function perCellV(drive: SineDrive | PulseDrive): number {
  return drive.kind === 'sine' ? drive.peakV : (drive.forwardPeakV + drive.flybackPeakV) / 2;
}

function capacitorCount(topology: Topology, cells: number): number {
  return topology === 'full-wave' ? 3 * cells : topology === 'bridge-doubler' ? 2 : cells;
}

/**
 * Capacitor values of a candidate with top-stage value `c`: equal, or graded by `gradeFactors`
 * (`capacitorGradeFactors` of its topology and count), snapped to the nearest available value (log distance).
 */
function gradedValues(
  topology: Topology,
  cells: number,
  c: number,
  grading: 'equal' | 'graded',
  gradeFactors: readonly number[] | null,
  available: readonly number[],
): number[] {
  const count = capacitorCount(topology, cells);
  if (grading === 'equal' || topology === 'bridge-doubler' || !gradeFactors) return Array<number>(count).fill(c);
  return Array.from({ length: count }, (_, i) => {
    const wanted = c * (gradeFactors[i] as number);
    // Binary search in the ascending list, then the nearer neighbour in log terms.
    let lo = 0;
    let hi = available.length - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if ((available[mid] as number) < wanted) lo = mid;
      else hi = mid;
    }
    const below = available[lo] as number;
    const above = available[hi] as number;
    return Math.abs(Math.log(below / wanted)) <= Math.abs(Math.log(above / wanted)) ? below : above;
  });
}

function ratingFor(
  voltageV: number,
  options: readonly CapacitorOption[] | undefined,
  valueF: number,
): CapacitorOption | null {
  const need = voltageV / DERATING.capacitorVoltage;
  if (options) {
    const fits = options.filter((o) => Math.abs(o.valueF / valueF - 1) < 1e-9 && o.ratedVoltageV >= need);
    fits.sort((a, b) => (a.costEach ?? a.ratedVoltageV) - (b.costEach ?? b.ratedVoltageV));
    return fits[0] ?? null;
  }
  const rated = STANDARD_CAPACITOR_RATINGS_V.find((r) => r >= need);
  return rated === undefined ? null : { valueF, ratedVoltageV: rated };
}

function chooseBleeder(
  analysis: Pick<LadderAnalysis, 'ladderTopMeanV'>,
  storedEnergyJ: number,
  request: SizerRequest,
  resistors: readonly ResistorOption[],
): { count: number; resistor: ResistorOption } | null {
  if (request.safeVoltageV === undefined) return null;
  const v = Math.abs(analysis.ladderTopMeanV);
  const rule = dischargeRuleLimits(request.dischargeRule ?? { voltageV: request.safeVoltageV, timeS: 60 });
  if (v <= rule.voltageV) return null;
  const equivalentF = (2 * storedEnergyJ) / (v * v);
  const maxTotalOhm = rule.timeS / (equivalentF * Math.log(v / rule.voltageV));
  let best: { count: number; resistor: ResistorOption; totalOhm: number } | null = null;
  for (const resistor of resistors) {
    const count = Math.max(1, Math.ceil(v / (resistor.limitingVoltageV * DERATING.resistorVoltage)));
    const totalOhm = count * resistor.valueOhm;
    const powerW = (v / count) ** 2 / resistor.valueOhm;
    if (totalOhm > maxTotalOhm || powerW > resistor.ratedPowerW * DERATING.resistorPower) continue;
    if (!best || totalOhm > best.totalOhm) best = { count, resistor, totalOhm };
  }
  return best ? { count: best.count, resistor: best.resistor } : null;
}

/**
 * Proposes ranked ladders for a target output, load current and ripple limit from a given drive
 * (SIZER_METHOD). Values from an E-series or a supplied parts list with ratings and costs.
 */
export function sizeLadder(request: SizerRequest): SizerResult {
  const target = Math.abs(request.targetOutputV);
  if (!(target > 0)) throw new DomainError('invalid_argument', 'target output must be non-zero', 'targetOutputV');
  if (!(request.rippleMaxV > 0))
    throw new DomainError('invalid_argument', 'ripple limit must be positive', 'rippleMaxV');
  const polarity: 1 | -1 = request.targetOutputV < 0 ? -1 : 1;
  const vmax = perCellV(request.drive);
  const topologies = request.topologies ?? (['half-wave', 'full-wave', 'bridge-doubler'] as const);
  const capacitorValues = request.parts?.capacitors
    ? [...new Set(request.parts.capacitors.map((c) => c.valueF))].sort((a, b) => a - b)
    : preferredValuesBetween(
        request.capacitorRangeF?.[0] ?? 100e-12,
        request.capacitorRangeF?.[1] ?? 10e-6,
        request.series ?? 'E12',
      );
  // Graded ladders snap to values one decade beyond the range as well (the bottom stage is n times the top).
  const snapValues = request.parts?.capacitors
    ? capacitorValues
    : preferredValuesBetween(
        request.capacitorRangeF?.[0] ?? 100e-12,
        (request.capacitorRangeF?.[1] ?? 10e-6) * 100,
        request.series ?? 'E12',
      );
  const diodes = (request.parts?.diodes ?? DEFAULT_DIODES).filter((d) => d.ratedPivV * DERATING.diodePiv >= 2 * vmax);
  const resistors = request.parts?.resistors ?? DEFAULT_RESISTORS;
  const gradings = request.gradings ?? (['equal', 'graded'] as const);
  const maxOvershoot = request.maxOvershoot ?? 0.3;
  const maxCandidates = request.maxCandidates ?? 20000;
  const extra = request.extraCells ?? 8;

  let evaluated = 0;
  // Each keeps only what its bleeder is chosen by (thousands may meet the spec; a few are shown).
  const meeting: Array<
    Omit<SizerCandidate, 'rank' | 'bleeder'> & { analysis: Pick<LadderAnalysis, 'ladderTopMeanV'> }
  > = [];
  outer: for (const topology of topologies) {
    const perUnitV = topology === 'full-wave' ? 2 * vmax : vmax;
    const minUnits = topology === 'bridge-doubler' ? 2 : Math.max(1, Math.ceil(target / perUnitV));
    const maxUnits = topology === 'bridge-doubler' ? 2 : minUnits + extra;
    for (let cells = minUnits; cells <= maxUnits; cells += 1) {
      const gradeFactors = capacitorGradeFactors(topology, capacitorCount(topology, cells));
      for (const grading of topology === 'bridge-doubler' ? (['equal'] as const) : gradings) {
        for (const c of capacitorValues) {
          const capacitorsF = gradedValues(topology, cells, c, grading, gradeFactors, snapValues);
          const input: LadderInput = {
            topology,
            capacitorsF,
            drive: request.drive,
            diode: diodes[0] as DiodeOption,
            polarity,
            load: { kind: 'current', currentA: request.loadCurrentA },
            bleederOhm: null,
            seriesOutputResistanceOhm: 0,
          };
          // One network per capacitor set; only the diode changes between the candidates below.
          const prepared = prepareLadder(input);
          for (const diode of diodes) {
            if (evaluated >= maxCandidates) break outer;
            evaluated += 1;
            // Output and ripple first: most candidates miss them, and need no stress figures.
            const withThisDiode = withDiode(prepared, diode);
            const figures = operatingFigures(withThisDiode);
            const out = Math.abs(figures.outputMeanV);
            if (out < target || out > target * (1 + maxOvershoot) || figures.ripplePeakToPeakV > request.rippleMaxV)
              continue;
            const analysis = analyzePrepared(withThisDiode, { operatingPointOnly: true });
            const chosen = analysis.capacitors.map((cap) =>
              ratingFor(cap.maxVoltageV, request.parts?.capacitors, cap.valueF),
            );
            if (chosen.some((x) => x === null)) continue;
            const ratings = chosen as CapacitorOption[];
            let worst = Infinity;
            let energy = 0;
            analysis.capacitors.forEach((cap, i) => {
              const rated = (ratings[i] as CapacitorOption).ratedVoltageV * DERATING.capacitorVoltage;
              worst = Math.min(worst, ((rated - cap.maxVoltageV) / rated) * 100);
              energy += 0.5 * cap.valueF * cap.maxVoltageV ** 2;
            });
            for (const d of analysis.diodes) {
              const rated = diode.ratedPivV * DERATING.diodePiv;
              worst = Math.min(worst, ((rated - d.peakInverseV) / rated) * 100);
            }
            const costs = [...ratings.map((r) => r.costEach), ...analysis.diodes.map(() => diode.costEach)];
            const cost = costs.every((x) => x !== undefined) ? costs.reduce<number>((s, x) => s + (x ?? 0), 0) : null;
            meeting.push({
              topology,
              cellCount: cells,
              grading,
              capacitorsF,
              capacitorRatedV: ratings.map((r) => r.ratedVoltageV),
              capacitorPartCodes: ratings.map((r) => r.partCode ?? null),
              diode,
              outputMeanV: analysis.outputMeanV,
              ripplePeakToPeakV: analysis.ripplePeakToPeakV,
              storedEnergyJ: energy,
              totalCapacitanceF: capacitorsF.reduce((s, x) => s + x, 0),
              partCount: capacitorsF.length + analysis.diodes.length,
              worstMarginPct: worst,
              cost,
              analysis: { ladderTopMeanV: analysis.ladderTopMeanV },
            });
          }
        }
      }
    }
  }
  const score = (c: { cost: number | null; partCount: number }): number => c.cost ?? c.partCount;
  meeting.sort(
    (a, b) => score(a) - score(b) || a.storedEnergyJ - b.storedEnergyJ || b.worstMarginPct - a.worstMarginPct,
  );
  const candidates = meeting.slice(0, request.resultCount ?? 20).map((c, i) => {
    const { analysis, ...rest } = c;
    const bleeder = chooseBleeder(analysis, c.storedEnergyJ, request, resistors);
    const bleederCost = bleeder
      ? bleeder.resistor.costEach === undefined
        ? null
        : bleeder.count * bleeder.resistor.costEach
      : 0;
    return {
      ...rest,
      rank: i + 1,
      bleeder,
      partCount: rest.partCount + (bleeder?.count ?? 0),
      cost: rest.cost === null || bleederCost === null ? null : rest.cost + bleederCost,
    };
  });
  return { candidates, evaluatedCount: evaluated, meetingSpecCount: meeting.length, method: SIZER_METHOD };
}
