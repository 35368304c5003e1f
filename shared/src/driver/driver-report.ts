import { cellCurveOf, type BatteryLifeResult } from './battery';
import type { BlockingOscillatorEstimate } from './blocking-oscillator';
import { runDriverChecks, type DriverCheckVerdict } from './driver-checks';
import type { DriverEnergy } from './driver-energy';
import type { CellCurvePoint, DriverStage } from '../designs/driver-stage.types';
import type { Estimated, MethodInfo } from '../methods';
import { driverOperatingPoint, type LadderLoadLine, type LoadPoint, type OperatingLimit } from './operating-point';

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
  const checks = runDriverChecks(driver, { ladder, ratedLoadCurrentA });
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
    energy,
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
