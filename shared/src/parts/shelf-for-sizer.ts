import type { DiodePart } from '../designs/design.types';
import type { CapacitorOption, DiodeOption, ResistorOption } from '../sizing/size-ladder';
import type { ShelfPart } from './fill-part-ratings';

/** The Sizer's `parts` list (`SizerRequest.parts` of shared/src/sizing). */
export interface SizerPartsList {
  capacitors: CapacitorOption[];
  diodes: DiodeOption[];
  resistors: ResistorOption[];
}

/** The diode model the shelf does not hold: the Shockley parameters (e.g. those of the design's diode). */
export type DiodeModelParameters = Pick<
  DiodePart,
  'saturationCurrentA' | 'emissionCoefficient' | 'seriesResistanceOhm' | 'junctionCapacitanceF'
>;

/**
 * The shelf as the Sizer's parts list (`sizeLadder`'s `parts`): capacitors by value and rated voltage,
 * diodes with the shelf ratings (PIV, average and surge current) on `diodeModel`'s Shockley parameters,
 * bleeder resistors by value, power and limiting voltage (a resistor without a voltage rating is left out).
 * Every option carries its `partCode` and unit cost. A diode without a surge rating takes its average
 * rating × 20 (common practice for small HV rectifiers, no source). Sorted by value or PIV, then cost.
 */
export function shelfForSizer(parts: readonly ShelfPart[], diodeModel: DiodeModelParameters): SizerPartsList {
  const capacitors: CapacitorOption[] = parts
    .filter((part) => part.kind === 'capacitor' && part.valueSi !== null && part.ratedVoltageV !== null)
    .map((part) => ({
      valueF: part.valueSi as number,
      ratedVoltageV: part.ratedVoltageV as number,
      costEach: part.unitCost,
      partCode: part.code,
    }))
    .sort((a, b) => a.valueF - b.valueF || (a.costEach ?? 0) - (b.costEach ?? 0));
  const diodes: DiodeOption[] = parts
    .filter((part) => part.kind === 'diode' && part.ratedVoltageV !== null && part.ratedCurrentA !== null)
    .map((part) => ({
      ...diodeModel,
      ratedPivV: part.ratedVoltageV as number,
      ratedAverageCurrentA: part.ratedCurrentA as number,
      ratedSurgeCurrentA: part.ratedSurgeCurrentA ?? (part.ratedCurrentA as number) * 20,
      costEach: part.unitCost,
      partCode: part.code,
    }))
    .sort((a, b) => a.ratedPivV - b.ratedPivV || (a.costEach ?? 0) - (b.costEach ?? 0));
  const resistors: ResistorOption[] = parts
    .filter(
      (part) =>
        part.kind === 'resistor' && part.valueSi !== null && part.ratedPowerW !== null && part.ratedVoltageV !== null,
    )
    .map((part) => ({
      valueOhm: part.valueSi as number,
      ratedPowerW: part.ratedPowerW as number,
      limitingVoltageV: part.ratedVoltageV as number,
      costEach: part.unitCost,
      partCode: part.code,
    }))
    .sort((a, b) => a.valueOhm - b.valueOhm || (a.costEach ?? 0) - (b.costEach ?? 0));
  return { capacitors, diodes, resistors };
}
