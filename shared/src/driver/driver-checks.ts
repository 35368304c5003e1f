import { DomainError } from '../errors';
import { batteryLife, cellCurveOf, cellMaxContinuousCurrentA, type BatteryLifeResult } from './battery';
import { blockingOscillatorNumbers, estimateBlockingOscillator } from './blocking-oscillator';
import type { BlockingOscillatorEstimate, OscillatorNumbers } from './blocking-oscillator.types';
import type { DriverStage } from '../designs/driver-stage.types';
import type { Estimated } from '../methods';
import { HIPOT_METHOD, hipotTestVoltageV as hipotTestVoltageOf } from '../safety/hipot';
import { withLadderLoad } from './load-point';
import { solveLoadPoint, supplyCurrentNear, type LoadPoint, type WarmStart } from './operating-point';
import { type LadderLoadLine } from './ladder-load-line';
import { driverEnergy, type DriverEnergy } from './driver-energy';

/** One verdict of the Checks panel (same shape as the safety checks). */
export interface DriverCheckVerdict {
  id: string;
  subject: string;
  rule: string;
  verdict: 'pass' | 'marginal' | 'fail';
  /** (limit − value) / limit · 100 for an upper limit; negative when failing. */
  marginPct: number;
  value: number;
  limit: number;
  unit: string;
}

export interface DriverChecksInput {
  /** The ladder the driver feeds; without it the stage is checked at its clamp limit with no load. */
  ladder?: LadderLoadLine;
  ratedLoadCurrentA?: number;
  /** The design's external load against the largest the supply holds its output at (A), for the capacity check. */
  loadCapacity?: { loadCurrentA: number; maxLoadCurrentA: number };
  /** The rated load point already solved with this ladder and load (`solveLoadPoint`), so it is not solved again. */
  ratedLoad?: LoadPoint & { driver: BlockingOscillatorEstimate };
  /** The stage at its clamp limit with the ladder's secondary load (`estimateBlockingOscillator`), already computed. */
  atLimit?: BlockingOscillatorEstimate;
  /** Overrides the stage's own `batteryLifeTargetH`. */
  batteryLifeTargetS?: number;
}

export interface DriverChecksResult {
  verdicts: DriverCheckVerdict[];
  estimate: BlockingOscillatorEstimate;
  ratedLoad: (LoadPoint & { driver: BlockingOscillatorEstimate }) | null;
  /** Hipot test voltage to ask of the transformer supplier (V), secondary to primary/feedback. */
  hipotTestVoltageV: Estimated;
  batteryLife: BatteryLifeResult | null;
  /** Power balance at the rated load (with a ladder), else of the stage at its clamp limit with no load. */
  energy: DriverEnergy;
}

/** Semiconductor and insulation stress derating: pass at ≤ 80 % of the rating (common practice, no source). */
const stressDerating = 0.8;
/** Cell drain: pass at ≤ 50 % of the continuous capability, since capacity falls with rate (common practice, no source). */
const cellDrainDerating = 0.5;
/** Base overdrive for hFE spread: pass at ≥ 1.5 × the needed current (common practice, no source). */
const baseOverdrive = 1.5;
/** Battery life: pass at ≥ 1.2 × the target, leaving room for cold and ageing (common practice, no source). */
const lifeReserve = 1.2;

function upperLimit(
  id: string,
  subject: string,
  rule: string,
  value: number,
  limit: number,
  unit: string,
  passFraction: number,
): DriverCheckVerdict {
  const verdict = value <= passFraction * limit ? 'pass' : value <= limit ? 'marginal' : 'fail';
  return { id, subject, rule, verdict, marginPct: ((limit - value) / limit) * 100, value, limit, unit };
}

function lowerLimit(
  id: string,
  subject: string,
  rule: string,
  value: number,
  limit: number,
  unit: string,
  passFactor: number,
): DriverCheckVerdict {
  const verdict = value >= passFactor * limit ? 'pass' : value >= limit ? 'marginal' : 'fail';
  return { id, subject, rule, verdict, marginPct: ((value - limit) / limit) * 100, value, limit, unit };
}

/**
 * What a supply-current table keeps between calls, per stage, ladder and voltage span: the stage at its clamp
 * limit at each voltage (none where the stage stops there), which depends on neither the load nor the ladder's
 * capacitor values (only on the ladder's load on the secondary between pulses), and the power balance last
 * solved at the lowest voltage, which starts the next load's there (the others start from their neighbours').
 * A Workbench edit of the load so solves each voltage's balance from a nearby start, and an edit of the
 * capacitors takes the limits as they were.
 */
interface TableMemory {
  limits: (OscillatorNumbers | 'stops' | undefined)[];
  balance: { firstBalance: WarmStart | null };
}

const TABLE_MEMORY = 8;
const limitMemories = new Map<string, TableMemory['limits']>();
const balanceMemories = new Map<string, TableMemory['balance']>();

/** The entry of `memory` under `key`, made by `make` when missing; the last TABLE_MEMORY used are kept. */
function remembered<T>(memory: Map<string, T>, key: string, make: () => T): T {
  const known = memory.get(key);
  if (known) {
    memory.delete(key);
    memory.set(key, known);
    return known;
  }
  const made = make();
  memory.set(key, made);
  if (memory.size > TABLE_MEMORY) memory.delete(memory.keys().next().value as string);
  return made;
}

function tableMemoryOf(driver: DriverStage, ladder: LadderLoadLine, lowV: number, highV: number): TableMemory {
  const ladderKey = ladder.key;
  if (ladderKey === undefined) return { limits: [], balance: { firstBalance: null } };
  const span = `${JSON.stringify(driver)}|${lowV}|${highV}`;
  const limits = remembered(limitMemories, `${span}|${JSON.stringify(ladder.secondaryLoad ?? null)}`, () => []);
  const balance = remembered(balanceMemories, `${ladderKey}|${span}`, () => ({ firstBalance: null }));
  return { limits, balance };
}

/**
 * Supply current (A) of the driver at the rated load as a function of the supply terminal voltage (V),
 * tabulated on a voltage grid and interpolated linearly (the full solve at each integration point would be slow).
 */
function supplyCurrentTable(
  driver: DriverStage,
  ladder: LadderLoadLine | undefined,
  loadA: number,
  lowV: number,
  highV: number,
): (v: number) => number {
  const points = 8;
  const table: { v: number; i: number }[] = [];
  const memory = ladder ? tableMemoryOf(driver, ladder, lowV, highV) : null;
  // Each voltage's power balance starts from the line through the last two (the last one after the first, the
  // last call's at the first); none after a ladder-limited voltage (a higher supply delivers more, so the next is
  // ladder-limited too, which the warm start would only try to disprove).
  let last: WarmStart | null = null;
  let beforeLast: WarmStart | null = null;
  for (let k = 0; k < points; k++) {
    const v = lowV + ((highV - lowV) * k) / (points - 1);
    const bench: DriverStage = { ...driver, supply: { kind: 'dc', voltageV: v, sourceResistanceOhm: 0 } };
    const warm: WarmStart | null =
      k === 0
        ? (memory?.balance.firstBalance ?? null)
        : last && beforeLast
          ? { flybackV: 2 * last.flybackV - beforeLast.flybackV, slope: last.slope }
          : last;
    let i: number;
    try {
      if (ladder && memory) {
        let limit = memory.limits[k];
        if (limit === undefined) {
          try {
            limit = blockingOscillatorNumbers(bench, withLadderLoad({}, ladder));
          } catch (error) {
            if (error instanceof DomainError) memory.limits[k] = 'stops';
            throw error;
          }
          memory.limits[k] = limit;
        }
        if (limit === 'stops') throw new DomainError('invalid_design', 'the stage does not run at this supply');
        const near = supplyCurrentNear(bench, ladder, loadA, warm, limit);
        if (k === 0) memory.balance.firstBalance = near.balance;
        beforeLast = near.balance ? last : null;
        last = near.balance;
        i = near.supplyCurrentA;
      } else i = blockingOscillatorNumbers(bench).inputA;
    } catch (error) {
      if (error instanceof DomainError)
        i = 0; // the stage stops: no drain below this voltage
      else throw error;
    }
    table.push({ v, i });
  }
  return (v) => {
    if (v <= table[0]!.v) return table[0]!.i;
    for (let k = 1; k < table.length; k++) {
      const a = table[k - 1]!;
      const b = table[k]!;
      if (v <= b.v) return a.i + ((b.i - a.i) * (v - a.v)) / (b.v - a.v);
    }
    return table[table.length - 1]!.i;
  };
}

/**
 * Checks of the driver stage: collector voltage and current against the transistor ratings, base drive
 * margin, secondary winding voltage against the transformer insulation (and the hipot voltage to ask for),
 * cell drain against the chemistry's capability, battery life against a target. Verdict margins in percent.
 */
export function runDriverChecks(driver: DriverStage, input: DriverChecksInput = {}): DriverChecksResult {
  const loadA = input.ratedLoadCurrentA ?? 0;
  const estimate =
    input.atLimit ??
    estimateBlockingOscillator(
      driver,
      input.ladder?.secondaryLoad ? { secondaryLoad: input.ladder.secondaryLoad } : {},
    );
  const solved = input.ladder ? (input.ratedLoad ?? solveLoadPoint(driver, input.ladder, loadA)) : null;
  const atLoad = solved?.driver ?? estimate;
  const ratedLoad = solved;
  const q = driver.transistor;
  const verdicts: DriverCheckVerdict[] = [
    upperLimit(
      'driver.collector-voltage',
      'transistor',
      'Vce,pk ≤ Vce0,max, pass at ≤ 80 % (derating, common practice)',
      atLoad.collectorPeakV.value,
      q.vceoMaxV,
      'V',
      stressDerating,
    ),
    upperLimit(
      'driver.collector-current',
      'transistor',
      'Ic,pk ≤ Ic,max, pass at ≤ 80 % (derating, common practice)',
      atLoad.collectorPeakCurrentA.value,
      q.icMaxA,
      'A',
      stressDerating,
    ),
  ];

  if (input.loadCapacity) {
    const { loadCurrentA, maxLoadCurrentA } = input.loadCapacity;
    const rule =
      'external load ≤ the largest load the supply holds its output at, pass at ≤ 80 % (cell ageing and hFE spread, common practice, no source)';
    verdicts.push(
      maxLoadCurrentA > 0
        ? upperLimit('driver.load-capacity', 'driver stage', rule, loadCurrentA, maxLoadCurrentA, 'A', stressDerating)
        : {
            id: 'driver.load-capacity',
            subject: 'driver stage',
            rule,
            verdict: 'fail',
            marginPct: -100,
            value: loadCurrentA,
            limit: 0,
            unit: 'A',
          },
    );
  }

  // Base drive margin: the peak current the rated load needs. With the flyback at its limit P ∝ E·f ∝ Ipk
  // (on- and flyback times both ∝ Ipk), so I_needed = Ipk · P_needed / P_deliverable, P_needed = g·I_ladder·V₋.
  if (ratedLoad && ratedLoad.ladderCurrentA > 0) {
    const e = estimate;
    const neededW = ratedLoad.flybackChargeRatio * ratedLoad.ladderCurrentA * e.maxFlybackSecondaryPeakV;
    const neededA = e.peakPrimaryCurrentA.value * (neededW / e.deliverablePowerW.value);
    verdicts.push(
      lowerLimit(
        'driver.base-drive',
        'transistor',
        'hFE·I_B ≥ the peak current the rated load needs, pass at ≥ 1.5× (hFE spread, common practice)',
        e.baseLimitedCurrentA,
        neededA,
        'A',
        baseOverdrive,
      ),
    );
  }

  // Power balance at the rated load; without a ladder, the bare stage at its clamp limit (all flyback to the clamp).
  const energyPoint: LoadPoint = ratedLoad ?? {
    loadCurrentA: 0,
    outputV: 0,
    outputPowerW: 0,
    ladderCurrentA: 0,
    limitedBy: 'ladder',
    flybackSecondaryPeakV: estimate.flybackSecondaryPeakV.value,
    forwardSecondaryPeakV: estimate.forwardSecondaryPeakV.value,
    flybackChargeRatio: 0,
    frequencyHz: estimate.frequencyHz.value,
    dutyCycle: estimate.onTimeS.value * estimate.frequencyHz.value,
    supplyCurrentA: estimate.inputCurrentA.value,
    inputPowerW: estimate.emfPowerW,
    ladderTakesW: { forward: 0, flyback: 0 },
    efficiency: 0,
  };
  const energy = driverEnergy(
    driver,
    energyPoint,
    { losses: atLoad.losses, deliverableW: atLoad.deliverablePowerW.value },
    input.ladder?.network ?? { bleederOhm: null, seriesOutputResistanceOhm: 0 },
  );
  const thermal = energy.transistor;
  verdicts.push(
    upperLimit(
      'driver.transistor-dissipation',
      'transistor',
      `dissipation ≤ (Tj,max − T_ambient)/Rθ = (${thermal.maxJunctionTemperatureC} − ${thermal.ambientTemperatureC}) °C / ${thermal.thermalResistanceCPerW} °C/W${thermal.isDefaultThermal ? ' (common-practice defaults for a small leaded transistor in free air)' : ''}, junction at ${thermal.junctionTemperatureC.toFixed(0)} °C; pass at ≤ 80 % (derating, common practice)`,
      thermal.dissipationW,
      thermal.maxDissipationW,
      'W',
      stressDerating,
    ),
  );
  if (energy.clamp.ratedPowerW !== null) {
    verdicts.push(
      upperLimit(
        'driver.clamp-dissipation',
        'clamp',
        `leakage energy and the flyback the ladder does not take ≤ the clamp's rating${energy.clamp.isDefaultRating ? ` (${energy.clamp.ratedPowerW} W, common practice for a ${energy.clamp.kind === 'zener' ? 'small glass zener' : 'quarter-watt clamp resistor'})` : ''}; pass at ≤ 50 % (derating, common practice)`,
        energy.clamp.dissipationW,
        energy.clamp.ratedPowerW,
        'W',
        0.5,
      ),
    );
  }

  const tx = driver.transformer;
  const windingPeakV = Math.max(atLoad.forwardSecondaryPeakV.value, atLoad.flybackSecondaryPeakV.value);
  const hipotTestVoltageV: Estimated = { value: hipotTestVoltageOf(windingPeakV), method: HIPOT_METHOD };
  if (tx.insulation) {
    verdicts.push(
      upperLimit(
        'driver.winding-insulation',
        'transformer',
        'secondary peak ≤ rated insulation voltage, pass at ≤ 80 % (common practice)',
        windingPeakV,
        tx.insulation.ratedVoltageV,
        'V',
        stressDerating,
      ),
    );
  }

  let life: BatteryLifeResult | null = null;
  if (driver.supply.kind === 'cells') {
    const supply = driver.supply;
    const drainA = ratedLoad ? ratedLoad.supplyCurrentA : estimate.inputCurrentA.value;
    verdicts.push(
      upperLimit(
        'driver.cell-current',
        'battery',
        `cell drain ≤ the ${supply.chemistry} cell's continuous capability, pass at ≤ 50 % (common practice)`,
        drainA,
        cellMaxContinuousCurrentA(supply),
        'A',
        cellDrainDerating,
      ),
    );
    const highV = 1.05 * supply.cellsInSeries * Math.max(...cellCurveOf(supply).map((p) => p.voltageV));
    const lowV = 0.8 * supply.cellsInSeries * supply.endVoltagePerCellV;
    const currentAt = supplyCurrentTable(driver, input.ladder, loadA, lowV, highV);
    life = batteryLife(supply, currentAt);
    const targetS =
      input.batteryLifeTargetS ??
      (driver.batteryLifeTargetH !== undefined ? driver.batteryLifeTargetH * 3600 : undefined);
    if (targetS !== undefined) {
      verdicts.push(
        lowerLimit(
          'driver.battery-life',
          'battery',
          'life to the end voltage ≥ target, pass at ≥ 1.2× (cold and ageing, common practice)',
          life.lifeS.value,
          targetS,
          's',
          lifeReserve,
        ),
      );
    }
  }
  return { verdicts, estimate, ratedLoad, hipotTestVoltageV, batteryLife: life, energy };
}
