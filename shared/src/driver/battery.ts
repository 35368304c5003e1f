import { DomainError } from '../errors';
import { bracketedRoot } from '../multiplier/bracketed-root';
import {
  customCellRateModel,
  defaultCellCurves,
  defaultCellMaxContinuousCurrentA,
  defaultCellRateModels,
  type CellRateModel,
} from './cell-curves';
import type { CellCurvePoint, CellsSupply, DriverSupply } from '../designs/driver-stage.types';
import type { Estimated, MethodInfo } from '../methods';

/** The per-cell curve of a cells supply, sorted by rising charge fraction and checked. */
export function cellCurveOf(supply: CellsSupply): CellCurvePoint[] {
  const raw = supply.curve ?? (supply.chemistry === 'custom' ? undefined : defaultCellCurves[supply.chemistry]);
  if (!raw || raw.length < 2) {
    throw new DomainError(
      'invalid_design',
      'a custom cell needs a discharge curve of at least two points',
      'driver.supply.curve',
    );
  }
  const curve = [...raw].sort((a, b) => a.chargeFraction - b.chargeFraction);
  curve.forEach((p, i) => {
    if (!(p.chargeFraction >= 0 && p.chargeFraction <= 1) || !(p.voltageV > 0)) {
      throw new DomainError(
        'invalid_design',
        'curve points need 0 ≤ chargeFraction ≤ 1 and a positive voltage',
        `driver.supply.curve[${i}]`,
      );
    }
  });
  return curve;
}

/** Per-cell open-circuit voltage at a state of charge, by linear interpolation of the curve (clamped at its ends). */
export function cellOpenCircuitVoltageV(curve: readonly CellCurvePoint[], chargeFraction: number): number {
  const first = curve[0];
  const last = curve[curve.length - 1];
  if (!first || !last) throw new DomainError('invalid_argument', 'empty cell curve');
  if (chargeFraction <= first.chargeFraction) return first.voltageV;
  if (chargeFraction >= last.chargeFraction) return last.voltageV;
  for (let i = 1; i < curve.length; i++) {
    const a = curve[i - 1]!;
    const b = curve[i]!;
    if (chargeFraction <= b.chargeFraction) {
      const span = b.chargeFraction - a.chargeFraction;
      return span > 0
        ? a.voltageV + ((b.voltageV - a.voltageV) * (chargeFraction - a.chargeFraction)) / span
        : b.voltageV;
    }
  }
  return last.voltageV;
}

/** The rate model of a cells supply: its chemistry's (`defaultCellRateModels`), none for a custom cell; the design's own exponent and rated time override. */
export function cellRateModelOf(supply: CellsSupply): CellRateModel {
  const base = supply.chemistry === 'custom' ? customCellRateModel : defaultCellRateModels[supply.chemistry];
  if (supply.peukertExponent === undefined && supply.ratedDischargeH === undefined) return base;
  return {
    ...base,
    peukertExponent: supply.peukertExponent ?? base.peukertExponent,
    ratedDischargeH: supply.ratedDischargeH ?? base.ratedDischargeH,
    source: `design's own figures where given; otherwise ${base.source}`,
  };
}

/** Internal resistance of one cell (Ω) at a state of charge: R_full·(1 + m·(1 − σ)^p) (see CellRateModel; `rateModel`, the supply's own, when the caller has it). */
export function cellInternalResistanceOhm(
  supply: CellsSupply,
  chargeFraction: number,
  rateModel?: CellRateModel,
): number {
  const depth = Math.min(1, Math.max(0, 1 - chargeFraction));
  // A full cell (the driver's every solve) needs no rate model: the rise term is zero.
  if (depth === 0) return supply.internalResistanceOhm;
  const m = rateModel ?? cellRateModelOf(supply);
  return supply.internalResistanceOhm * (1 + m.resistanceRiseAtEmpty * depth ** m.resistanceRisePower);
}

/**
 * The current (A) that drains a cell's rated capacity as fast as the drain `currentA` does, by Peukert's law:
 * I·(I/I_rated)^(k − 1) above the rated current I_rated = C/H, the drain itself below it.
 */
export function peukertEquivalentCurrentA(
  supply: CellsSupply,
  currentA: number,
  rateModel: CellRateModel = cellRateModelOf(supply),
): number {
  const m = rateModel;
  const ratedA = supply.capacityAh / m.ratedDischargeH;
  return currentA > ratedA ? currentA * (currentA / ratedA) ** (m.peukertExponent - 1) : currentA;
}

/** Sorted and checked curves by the array they came from: the driver's solves ask for the supply thousands of times. */
const checkedCurves = new WeakMap<readonly CellCurvePoint[], CellCurvePoint[]>();

function checkedCurveOf(supply: CellsSupply): CellCurvePoint[] {
  const raw = supply.curve ?? (supply.chemistry === 'custom' ? undefined : defaultCellCurves[supply.chemistry]);
  const cached = raw && checkedCurves.get(raw);
  if (cached) return cached;
  const curve = cellCurveOf(supply);
  if (raw) checkedCurves.set(raw, curve);
  return curve;
}

/** Open-circuit voltage (V) and series resistance (Ω) of the whole supply at a state of charge (cells) . */
export function supplyThevenin(
  supply: DriverSupply,
  chargeFraction = 1,
): { openCircuitV: number; resistanceOhm: number } {
  if (supply.kind === 'dc') return { openCircuitV: supply.voltageV, resistanceOhm: supply.sourceResistanceOhm };
  const curve = checkedCurveOf(supply);
  return {
    openCircuitV: supply.cellsInSeries * cellOpenCircuitVoltageV(curve, chargeFraction),
    resistanceOhm: supply.cellsInSeries * cellInternalResistanceOhm(supply, chargeFraction),
  };
}

/** Continuous drain one cell tolerates (A): the supply's own figure, else the chemistry's common-practice figure. */
export function cellMaxContinuousCurrentA(supply: CellsSupply): number {
  if (supply.maxContinuousCurrentA !== undefined) return supply.maxContinuousCurrentA;
  if (supply.chemistry === 'custom') {
    throw new DomainError(
      'invalid_design',
      'a custom cell needs maxContinuousCurrentA',
      'driver.supply.maxContinuousCurrentA',
    );
  }
  return defaultCellMaxContinuousCurrentA[supply.chemistry];
}

export interface BatteryLifeResult {
  lifeS: Estimated;
  /** State of charge at which the loaded cell voltage reaches the end voltage (0 when the curve never reaches it). */
  endChargeFraction: number;
  /** Mean supply current over the life (A): the draw the life is reported at. */
  meanCurrentA: number;
  /** Charge the cells deliver to the end voltage at this draw (Ah): the rated capacity less the rate's toll. */
  deliveredAh: number;
  /** The rate model used (Peukert exponent, rated discharge time, resistance rise) with its source. */
  rateModel: CellRateModel;
}

const batteryLifeMethod: MethodInfo = {
  methodId: 'battery-life.curve-integral',
  summary:
    'Time to the end voltage: t = ∫ C dσ / I_p(σ) from full charge down to the state of charge σ at which the loaded cell voltage V = Voc(σ) − I·R(σ) falls to the end voltage; I_p = I·(I/I_rated)^(k − 1) is the Peukert-equivalent drain (capacity falls with the rate) and R(σ) = R_full·(1 + m·(1 − σ)^p) rises as the cell empties.',
  assumptions: [
    'Peukert’s law above the rated current, the rated capacity below it',
    'room temperature, continuous operation without recovery',
    'per-cell curve interpolated linearly between its points',
  ],
  source:
    'Charge balance (definition of capacity); Peukert’s law (W. Peukert, 1897; Linden & Reddy, Handbook of Batteries, 4th ed., from memory); curve shape common practice, no source; exponents and resistance rise per chemistry from memory (see the rate model)',
};

/**
 * Battery life (s) of a cells supply drawn by a load whose current depends on the supply's terminal voltage.
 * `currentAtTerminalV(V)` gives the supply current (A) at terminal voltage V (V). The terminal voltage at
 * each state of charge solves V = n·(Voc(σ) − I(V)·R) by secant steps on the fixed point. Integration: composite
 * Gauss-Legendre (4 points) on each curve segment, 8 sub-intervals per segment, down to the end point
 * found by Brent's method. Method: charge balance, see `batteryLifeMethod`.
 */
export function batteryLife(supply: CellsSupply, currentAtTerminalV: (terminalV: number) => number): BatteryLifeResult {
  if (!(supply.capacityAh > 0))
    throw new DomainError('invalid_design', 'capacity must be positive', 'driver.supply.capacityAh');
  if (!(supply.cellsInSeries >= 1))
    throw new DomainError('invalid_design', 'at least one cell', 'driver.supply.cellsInSeries');
  const curve = cellCurveOf(supply);
  const n = supply.cellsInSeries;
  const rateModel = cellRateModelOf(supply);
  const currentAt = (sigma: number): { currentA: number; cellV: number } => {
    const voc = cellOpenCircuitVoltageV(curve, sigma);
    const resistanceOhm = cellInternalResistanceOhm(supply, sigma, rateModel);
    let cellV = voc;
    let currentA = 0;
    // Secant steps on the fixed point's residual next(V) − V from the open-circuit voltage and a half step
    // (a load's current is smooth in its voltage, so they settle in a few), halving towards `next` wherever a
    // step would leave (0, Voc] or stall.
    let previousV = NaN;
    let previousResidual = NaN;
    for (let k = 0; k < 60; k++) {
      currentA = Math.max(0, currentAtTerminalV(n * cellV));
      const next = voc - currentA * resistanceOhm;
      const residual = next - cellV;
      if (Math.abs(residual) < 1e-9) {
        cellV = next;
        break;
      }
      const secantV = cellV - (residual * (cellV - previousV)) / (residual - previousResidual);
      previousV = cellV;
      previousResidual = residual;
      cellV = secantV > 0 && secantV <= voc ? secantV : 0.5 * (cellV + next);
    }
    return { currentA, cellV };
  };
  const margin = (sigma: number): number => currentAt(sigma).cellV - supply.endVoltagePerCellV;
  const marginAtFull = margin(1);
  if (marginAtFull <= 0) {
    return {
      lifeS: { value: 0, method: batteryLifeMethod },
      endChargeFraction: 1,
      meanCurrentA: currentAt(1).currentA,
      deliveredAh: 0,
      rateModel,
    };
  }
  let endSigma = 0;
  const marginAtEmpty = margin(0);
  if (marginAtEmpty < 0) {
    // Brent's method to 1e-14 of the state of charge: the life moves by less than 1e-13 of itself.
    endSigma = bracketedRoot(margin, 0, 1, marginAtEmpty, marginAtFull, 1e-14);
  }
  const breaks = [endSigma, ...curve.map((p) => p.chargeFraction).filter((s) => s > endSigma && s < 1), 1];
  const gaussX = [-0.8611363115940526, -0.3399810435848563, 0.3399810435848563, 0.8611363115940526];
  const gaussW = [0.3478548451374538, 0.6521451548625461, 0.6521451548625461, 0.3478548451374538];
  const capacityC = supply.capacityAh * 3600;
  let lifeS = 0;
  let deliveredC = 0;
  for (let b = 1; b < breaks.length; b++) {
    const a0 = breaks[b - 1]!;
    const a1 = breaks[b]!;
    const subs = 8;
    for (let s = 0; s < subs; s++) {
      const x0 = a0 + ((a1 - a0) * s) / subs;
      const x1 = a0 + ((a1 - a0) * (s + 1)) / subs;
      gaussX.forEach((g, j) => {
        const sigma = 0.5 * (x0 + x1) + 0.5 * (x1 - x0) * g;
        const i = currentAt(sigma).currentA;
        if (!(i > 0)) throw new DomainError('invalid_argument', 'the load draws no current: battery life is unbounded');
        // dt = C·dσ / I_p: the state of charge falls at the Peukert-equivalent rate; the charge delivered is I·dt.
        const dtS = 0.5 * (x1 - x0) * gaussW[j]! * (capacityC / peukertEquivalentCurrentA(supply, i, rateModel));
        lifeS += dtS;
        deliveredC += i * dtS;
      });
    }
  }
  return {
    lifeS: { value: lifeS, method: batteryLifeMethod },
    endChargeFraction: endSigma,
    meanCurrentA: deliveredC / lifeS,
    deliveredAh: deliveredC / 3600,
    rateModel,
  };
}
