import { cellCurveOf, type BatteryLifeResult } from './battery';
import type { BlockingOscillatorEstimate } from './blocking-oscillator.types';
import { runDriverChecks, type DriverCheckVerdict } from './driver-checks';
import type { DriverEnergy, LossKind } from './driver-energy';
import { estimateValidity, type EstimateValidity } from './estimate-validity';
import type { CellCurvePoint, DriverStage } from '../designs/driver-stage.types';
import type { Estimated, MethodInfo } from '../methods';
import { driverOperatingPoint, isFlybackFed, type LoadPoint, type OperatingLimit } from './operating-point';
import { type LadderLoadLine } from './ladder-load-line';

const FIGURE_KEYS = [
  'onTimeS',
  'onTimeLimit',
  'peakPrimaryCurrentA',
  'collectorPeakCurrentA',
  'flybackTimeS',
  'frequencyHz',
  'energyPerCycleJ',
  'deliverablePowerW',
  'forwardSecondaryPeakV',
  'flybackSecondaryPeakV',
  'collectorPeakV',
  'baseCurrentA',
  'supplyVoltageV',
  'inputCurrentA',
  'inputPowerW',
  'efficiency',
] as const;

/** The driver stage's figures at the rated load, each with the method that produced it. */
export type DriverFigures = Pick<BlockingOscillatorEstimate, (typeof FIGURE_KEYS)[number]>;

/** The driver section of a design report (SI units). */
export interface DriverReport {
  /** The stage at the rated load, flyback held by the ladder (or at its clamp limit when ladder-limited). */
  figures: DriverFigures;
  /** The stage with the flyback at its clamp or breakdown limit: the largest it can deliver. */
  atLimit: Pick<DriverFigures, 'deliverablePowerW' | 'flybackSecondaryPeakV' | 'frequencyHz'>;
  /**
   * The design's external load against the largest the supply holds its output at. Beyond it the output
   * cannot hold the load: the figures are then the stage at `maxLoadCurrentA`, and a Check fails. Absent from
   * reports of engines before 1.3.0.
   */
  loadCapacity?: { loadCurrentA: number; maxLoadCurrentA: number; isLoadBeyond: boolean };
  operatingPoint: {
    limitedBy: OperatingLimit;
    ratedLoad: LoadPoint;
    powerLimitOnsetA: number;
    curve: LoadPoint[];
    method: MethodInfo;
  };
  /** Null for a DC supply. */
  batteryLife:
    (BatteryLifeResult & { endVoltagePerCellV: number; cellCurve: CellCurvePoint[]; targetS: number | null }) | null;
  hipotTestVoltageV: Estimated;
  checks: DriverCheckVerdict[];
  /** Power balance at the rated load: input, output, efficiency (the one efficiency figure), losses by kind, transistor and clamp dissipation. */
  energy: DriverEnergy;
  /** The rated-load estimate under the names the simulation's figures use, to set side by side. */
  benchFigures: DriverBenchFigures;
  /** Whether these instant figures may stand for a simulation; outside, the figures say so and ask for one. */
  validity: EstimateValidity;
}

/** Loss groups of the simulation's figures (an element kind each). */
export type BenchLossKind =
  | 'transistor'
  | 'windingCopper'
  | 'clamp'
  | 'snubber'
  | 'baseResistor'
  | 'collectorResistor'
  | 'supplyResistance'
  | 'ladderDiodes'
  | 'bleeder'
  | 'outputResistor'
  | 'indicatorLamp'
  | 'other';

/** The estimate at the rated load with the simulation's field names (SI units; efficiency 0–1; losses in W). */
export interface DriverBenchFigures {
  oscillationFrequencyHz: number;
  dutyOnFraction: number;
  primaryCurrentPeakA: number;
  collectorVoltagePeakV: number;
  /** Secondary's positive peak at the ladder end: the forward pulse, or the flyback with flyback phasing. */
  secondaryVoltagePeakPositiveV: number;
  /** Secondary's negative peak at the ladder end. */
  secondaryVoltagePeakNegativeV: number;
  inputPowerW: number;
  outputPowerW: number;
  efficiency: number;
  losses: Partial<Record<BenchLossKind, number>>;
}

const BENCH_LOSS_KIND: Record<LossKind, BenchLossKind> = {
  transistorConduction: 'transistor',
  transistorSwitching: 'transistor',
  baseEmitter: 'transistor',
  baseResistor: 'baseResistor',
  primaryCopper: 'windingCopper',
  collectorResistor: 'collectorResistor',
  secondaryCopper: 'windingCopper',
  clamp: 'clamp',
  core: 'other',
  diodes: 'ladderDiodes',
  bleeder: 'bleeder',
  seriesOutputResistor: 'outputResistor',
  lamp: 'indicatorLamp',
  supplyResistance: 'supplyResistance',
};

/** The rated-load estimate under the simulation's names. */
function benchFiguresOf(
  point: LoadPoint,
  atLoad: BlockingOscillatorEstimate,
  energy: DriverEnergy,
  flybackFed: boolean,
): DriverBenchFigures {
  const losses: Partial<Record<BenchLossKind, number>> = {};
  for (const [kind, w] of Object.entries(energy.losses) as [LossKind, number][]) {
    if (w === 0) continue;
    const group = BENCH_LOSS_KIND[kind];
    losses[group] = (losses[group] ?? 0) + w;
  }
  return {
    oscillationFrequencyHz: point.frequencyHz,
    // The transistor's on-time share, as the simulation measures it (the ladder's forward share also holds the ring-back).
    dutyOnFraction: atLoad.onTimeS.value * point.frequencyHz,
    primaryCurrentPeakA: atLoad.collectorPeakCurrentA.value,
    collectorVoltagePeakV: atLoad.collectorPeakV.value,
    // Flyback phasing turns the secondary over: the flyback is then its positive peak.
    secondaryVoltagePeakPositiveV: flybackFed ? point.flybackSecondaryPeakV : point.forwardSecondaryPeakV,
    secondaryVoltagePeakNegativeV: -(flybackFed ? point.forwardSecondaryPeakV : point.flybackSecondaryPeakV),
    inputPowerW: energy.inputPowerW,
    outputPowerW: energy.outputPowerW,
    efficiency: energy.efficiency,
    losses,
  };
}

function figuresOf(e: BlockingOscillatorEstimate): DriverFigures {
  return Object.fromEntries(FIGURE_KEYS.map((key) => [key, e[key]])) as DriverFigures;
}

/**
 * The driver stage joined to its ladder: the closed-form figures at the rated external load current (A), the
 * operating point and output-vs-load curve (`driverOperatingPoint`), battery life to the end voltage
 * (`batteryLife`, the stage's `batteryLifeTargetH` checked when given) and the driver checks (`runDriverChecks`).
 */
export function driverReport(driver: DriverStage, ladder: LadderLoadLine, ratedLoadCurrentA: number): DriverReport {
  const op = driverOperatingPoint(driver, ladder, ratedLoadCurrentA);
  const checks = runDriverChecks(driver, {
    ladder,
    atLimit: op.atLimit,
    ratedLoadCurrentA: op.isRatedLoadBeyond ? op.maxLoadCurrentA : ratedLoadCurrentA,
    ratedLoad: op.ratedLoad,
    ...(ratedLoadCurrentA > 0
      ? { loadCapacity: { loadCurrentA: ratedLoadCurrentA, maxLoadCurrentA: op.maxLoadCurrentA } }
      : {}),
  });
  const { driver: atLoad, ...ratedLoad } = op.ratedLoad;
  const limit = checks.estimate;
  const supply = driver.supply;
  const energy = checks.energy;
  const figures = figuresOf(atLoad);
  // One efficiency everywhere: output into the load over the supply's EMF power at the rated load.
  figures.efficiency = {
    value: energy.efficiency,
    method: {
      ...energy.method,
      methodId: 'driver.efficiency-at-rated-load',
      summary: 'η = P_out/P_in at the rated load: power into the external load over the power from the supply’s EMF.',
    },
  };
  figures.inputPowerW = {
    value: energy.inputPowerW,
    method: {
      ...energy.method,
      methodId: 'driver.input-power-at-rated-load',
      summary: 'P_in = Voc·I_in: power from the supply’s EMF at the rated load (its own resistance’s loss included).',
    },
  };
  return {
    loadCapacity: {
      loadCurrentA: ratedLoadCurrentA,
      maxLoadCurrentA: op.maxLoadCurrentA,
      isLoadBeyond: op.isRatedLoadBeyond,
    },
    energy,
    benchFigures: benchFiguresOf(ratedLoad, atLoad, energy, isFlybackFed(driver)),
    validity: estimateValidity(driver, atLoad, { feedsLadder: true }),
    figures,
    atLimit: {
      deliverablePowerW: limit.deliverablePowerW,
      flybackSecondaryPeakV: limit.flybackSecondaryPeakV,
      frequencyHz: limit.frequencyHz,
    },
    operatingPoint: {
      limitedBy: ratedLoad.limitedBy,
      ratedLoad,
      powerLimitOnsetA: op.powerLimitOnsetA,
      curve: op.curve,
      method: op.method,
    },
    batteryLife:
      checks.batteryLife && supply.kind === 'cells'
        ? {
            ...checks.batteryLife,
            endVoltagePerCellV: supply.endVoltagePerCellV,
            cellCurve: cellCurveOf(supply),
            targetS: driver.batteryLifeTargetH !== undefined ? driver.batteryLifeTargetH * 3600 : null,
          }
        : null,
    hipotTestVoltageV: checks.hipotTestVoltageV,
    checks: checks.verdicts,
  };
}
