import { ladderInputOf } from '../analysis/analyze-design';
import type { Design } from '../designs/design.types';
import { designExamples } from '../designs/design-examples';
import { driverExamples } from '../designs/driver-examples';
import type { DriverStage } from '../designs/driver-stage.types';
import { DomainError } from '../errors';
import { batteryLife } from '../driver/battery';
import { runDriverChecks } from '../driver/driver-checks';
import { isFlybackFed, solveLoadPoint, supplyCurrentAt } from '../driver/operating-point';
import { engineLadderLoadLine, pulseDriveOf } from '../driver/ladder-load-line';
import { bracketedRoot } from '../multiplier/bracketed-root';
import { analyzeLadder } from '../multiplier/analyze-ladder';
import type { MethodInfo } from '../methods';
import { preferredValuesBetween } from '../units/e-series';

/** What the driver Sizer is asked for. SI units. */
export interface DriverSizerRequest {
  /** Target output at the load terminal (V, positive). */
  targetOutputV: number;
  loadCurrentA: number;
  rippleMaxV: number;
  /** The stage to start from: transistor, core, windings other than the secondary, clamp, supply kind and cells. */
  stage: DriverStage;
  /** Cells in series to try (cells supply only); default 1–4. */
  cellCounts?: readonly number[];
  /** Ladder cells to try (half-wave); default 2–6. */
  ladderCells?: readonly number[];
  /** Equal ladder capacitor values to try (F); default E6 from 1 nF to 22 nF. */
  capacitorsF?: readonly number[];
  /** Total bleeder resistances to try (Ω; null for none); default 100 MΩ and 470 MΩ. */
  bleedersOhm?: ReadonlyArray<number | null>;
  /** Accepted distance of the predicted output from the target at the rated load (fraction); default 0.03. */
  tolerance?: number;
  /** How many ranked supplies to return; default 10. */
  resultCount?: number;
}

export interface DriverSizerCandidate {
  rank: number;
  cellsInSeries: number | null;
  secondaryTurns: number;
  turnsRatio: number;
  ladderCells: number;
  capacitorF: number;
  bleederOhm: number | null;
  outputMeanV: number;
  ripplePeakToPeakV: number;
  supplyCurrentA: number;
  efficiency: number;
  /** Battery life to the end voltage at the rated load (s); null on a DC supply. */
  batteryLifeS: number | null;
  /** The driver checks' worst verdict and its margin (percent). */
  worstCheck: { id: string; verdict: 'pass' | 'marginal' | 'fail'; marginPct: number };
}

export interface DriverSizerResult {
  candidates: DriverSizerCandidate[];
  evaluatedCount: number;
  /** Supplies whose output lands within the tolerance at the rated load and whose ripple meets the limit. */
  meetingSpecCount: number;
  method: MethodInfo;
}

/** The defaults the Sizer's form and the CLI share. */
export const DRIVER_SIZER_DEFAULTS = {
  cellCounts: [1, 2, 3, 4],
  ladderCells: [2, 3, 4, 5, 6],
  capacitorRangeF: [1e-9, 22e-9] as const,
  bleedersOhm: [100e6, 470e6],
  tolerance: 0.03,
  resultCount: 10,
  /** The stage a supply starts from: the demo handheld tester's transistor, core, windings and clamp. */
  stage: driverExamples.surfaceChargeTester,
} as const;

export const DRIVER_SIZER_METHOD: MethodInfo = {
  methodId: 'driver-sizer-v1',
  summary:
    'Every combination of cells in series, ladder cells, capacitor value and bleeder; for each, the secondary turns that land the rated-load output on the target (Brent’s method on the driver–ladder operating point), rounded to a whole turn; kept when the output is within the tolerance and the ripple within its limit; one per structure (the smallest capacitors meeting the ripple); ranked by the driver checks’ worst verdict, then battery life, then fewer ladder cells.',
  assumptions: [
    'half-wave ladder with equal capacitors; the stage’s other windings, transistor and clamp as given',
    'operating point and ripple from the instant estimate (driver-ladder.power-balance-v2, charge-transfer-v1)',
  ],
  source:
    'driver-ladder.power-balance-v2; charge-transfer-v1; Brent, Algorithms for Minimization without Derivatives (from memory)',
};

const VERDICT_ORDER = { pass: 0, marginal: 1, fail: 2 } as const;

/** The design of one Sizer supply: the demo tester's parts and targets around the chosen stage, ladder and bleeder. */
export function designOf(
  stage: DriverStage,
  request: DriverSizerRequest,
  ladderCells: number,
  capacitorF: number,
  bleederOhm: number | null,
): Design {
  const demo = designExamples.surfaceChargeTester;
  const ratedV = 2 * request.targetOutputV;
  return {
    ...demo,
    name: 'Sizer candidate',
    drive: { kind: 'driver', driver: stage },
    multiplier: {
      topology: 'half-wave',
      cellCount: ladderCells,
      capacitors: Array.from({ length: ladderCells }, () => ({
        valueF: capacitorF,
        tolerance: 0.1,
        ratedVoltageV: ratedV,
      })),
      diode: { ...demo.multiplier.diode, ratedPivV: ratedV },
    },
    outputNetwork: {
      bleeder:
        bleederOhm === null ? null : { count: 1, valueOhm: bleederOhm, ratedPowerW: 1, limitingVoltageV: ratedV },
      seriesOutputResistanceOhm: 0,
    },
    load: { kind: 'current', currentA: request.loadCurrentA },
    targets: {
      ...demo.targets,
      outputV: request.targetOutputV,
      rippleMaxV: request.rippleMaxV,
      loadCurrentA: request.loadCurrentA,
    },
  };
}

/**
 * Whole supplies (cells, turns ratio, ladder cells, capacitors, bleeder) for a target output at a rated load,
 * ranked (method DRIVER_SIZER_METHOD). SI units in and out.
 */
export function sizeDriverSupply(request: DriverSizerRequest): DriverSizerResult {
  if (!(request.targetOutputV > 0))
    throw new DomainError('invalid_argument', 'target output must be positive', 'targetOutputV');
  if (!(request.loadCurrentA >= 0))
    throw new DomainError('invalid_argument', 'load current must be ≥ 0', 'loadCurrentA');
  if (!(request.rippleMaxV > 0))
    throw new DomainError('invalid_argument', 'ripple limit must be positive', 'rippleMaxV');
  const tolerance = request.tolerance ?? DRIVER_SIZER_DEFAULTS.tolerance;
  const base = request.stage;
  const cellCounts = base.supply.kind === 'cells' ? (request.cellCounts ?? DRIVER_SIZER_DEFAULTS.cellCounts) : [null];
  const capacitorsF = request.capacitorsF ?? preferredValuesBetween(...DRIVER_SIZER_DEFAULTS.capacitorRangeF, 'E6');
  const found: Omit<DriverSizerCandidate, 'rank' | 'batteryLifeS' | 'worstCheck'>[] = [];
  let evaluated = 0;
  for (const cells of cellCounts) {
    const supplied: DriverStage =
      cells === null || base.supply.kind !== 'cells'
        ? base
        : { ...base, supply: { ...base.supply, cellsInSeries: cells } };
    for (const ladderCells of request.ladderCells ?? DRIVER_SIZER_DEFAULTS.ladderCells) {
      for (const capacitorF of capacitorsF) {
        for (const bleederOhm of request.bleedersOhm ?? DRIVER_SIZER_DEFAULTS.bleedersOhm) {
          evaluated++;
          const outputAt = (secondaryTurns: number) => {
            const stage: DriverStage = { ...supplied, transformer: { ...supplied.transformer, secondaryTurns } };
            const design = designOf(stage, request, ladderCells, capacitorF, bleederOhm);
            const ladder = engineLadderLoadLine(
              ladderInputOf(design, pulseDriveOf({ forwardPeakV: 1, flybackPeakV: 1, frequencyHz: 1e4 }, 0)),
            );
            return { stage, design, ladder, point: solveLoadPoint(stage, ladder, request.loadCurrentA) };
          };
          const turnsOf = (ratio: number) => ratio * supplied.transformer.primaryTurns;
          const excess = (ratio: number) => {
            try {
              return outputAt(turnsOf(ratio)).point.outputV - request.targetOutputV;
            } catch (error) {
              if (error instanceof DomainError) return -request.targetOutputV;
              throw error;
            }
          };
          const lo = 5;
          const hi = 500;
          const excessLo = excess(lo);
          const excessHi = excess(hi);
          if (excessLo > 0 || excessHi < 0) continue;
          const ratio = bracketedRoot(excess, lo, hi, excessLo, excessHi, 1e-3);
          const secondaryTurns = Math.round(turnsOf(ratio));
          let result;
          try {
            result = outputAt(secondaryTurns);
          } catch (error) {
            if (error instanceof DomainError) continue;
            throw error;
          }
          const { point, design, stage } = result;
          if (Math.abs(point.outputV / request.targetOutputV - 1) > tolerance) continue;
          const analysis = analyzeLadder(
            ladderInputOf(
              design,
              pulseDriveOf(
                {
                  forwardPeakV: point.forwardSecondaryPeakV,
                  flybackPeakV: point.flybackSecondaryPeakV,
                  frequencyHz: point.frequencyHz,
                  dutyCycle: point.dutyCycle,
                  isFlybackFed: isFlybackFed(stage),
                },
                stage.transformer.secondaryResistanceOhm,
              ),
            ),
          );
          if (analysis.ripplePeakToPeakV > request.rippleMaxV) continue;
          found.push({
            cellsInSeries: cells,
            secondaryTurns,
            turnsRatio: secondaryTurns / stage.transformer.primaryTurns,
            ladderCells,
            capacitorF,
            bleederOhm,
            outputMeanV: point.outputV,
            ripplePeakToPeakV: analysis.ripplePeakToPeakV,
            supplyCurrentA: point.supplyCurrentA,
            efficiency: point.efficiency,
          });
        }
      }
    }
  }
  // One supply per structure (cells, ladder cells, bleeder): the smallest capacitors that meet the ripple
  // (least stored energy). Checks and battery life (the costly part) only for those, at most three times the
  // result count of them: the fewest ladder cells, then the highest efficiency, first.
  const byStructure = new Map<string, (typeof found)[number]>();
  for (const c of found) {
    const key = `${c.cellsInSeries}/${c.ladderCells}/${c.bleederOhm}`;
    const held = byStructure.get(key);
    if (!held || c.capacitorF < held.capacitorF) byStructure.set(key, c);
  }
  const shortlist = [...byStructure.values()]
    .sort((a, b) => a.ladderCells - b.ladderCells || b.efficiency - a.efficiency)
    .slice(0, 3 * (request.resultCount ?? DRIVER_SIZER_DEFAULTS.resultCount));
  const scored = shortlist.map((c) => {
    const stage: DriverStage = {
      ...base,
      ...(c.cellsInSeries !== null && base.supply.kind === 'cells'
        ? { supply: { ...base.supply, cellsInSeries: c.cellsInSeries } }
        : {}),
      transformer: { ...base.transformer, secondaryTurns: c.secondaryTurns },
    };
    const design = designOf(stage, request, c.ladderCells, c.capacitorF, c.bleederOhm);
    const ladder = engineLadderLoadLine(
      ladderInputOf(design, pulseDriveOf({ forwardPeakV: 1, flybackPeakV: 1, frequencyHz: 1e4 }, 0)),
    );
    const checks = runDriverChecks(stage, { ladder, ratedLoadCurrentA: request.loadCurrentA });
    const worst = checks.verdicts.reduce((a, b) =>
      VERDICT_ORDER[b.verdict] > VERDICT_ORDER[a.verdict] ||
      (VERDICT_ORDER[b.verdict] === VERDICT_ORDER[a.verdict] && b.marginPct < a.marginPct)
        ? b
        : a,
    );
    let lifeS: number | null = null;
    if (stage.supply.kind === 'cells') {
      const supply = stage.supply;
      lifeS =
        checks.batteryLife?.lifeS.value ??
        batteryLife(supply, () => supplyCurrentAt(stage, ladder, request.loadCurrentA)).lifeS.value;
    }
    return {
      ...c,
      batteryLifeS: lifeS,
      worstCheck: { id: worst.id, verdict: worst.verdict, marginPct: worst.marginPct },
    };
  });
  scored.sort(
    (a, b) =>
      VERDICT_ORDER[a.worstCheck.verdict] - VERDICT_ORDER[b.worstCheck.verdict] ||
      (b.batteryLifeS ?? 0) - (a.batteryLifeS ?? 0) ||
      a.ladderCells - b.ladderCells,
  );
  return {
    candidates: scored
      .slice(0, request.resultCount ?? DRIVER_SIZER_DEFAULTS.resultCount)
      .map((c, i) => ({ ...c, rank: i + 1 })),
    evaluatedCount: evaluated,
    meetingSpecCount: found.length,
    method: DRIVER_SIZER_METHOD,
  };
}
