import type { ShelfPart } from './fill-part-ratings';

/** A capacitor the Sizer may place: capacitance (F), rated voltage (V), tolerance (fraction), cost. */
export interface SizerCapacitorOption {
  partCode: string;
  valueF: number;
  ratedVoltageV: number;
  tolerance: number;
  unitCost: number;
}

/** A diode the Sizer may place: PIV (V), average and surge current (A), cost. */
export interface SizerDiodeOption {
  partCode: string;
  ratedPivV: number;
  ratedAverageCurrentA: number;
  ratedSurgeCurrentA: number | null;
  unitCost: number;
}

export interface SizerPartsList {
  capacitors: SizerCapacitorOption[];
  diodes: SizerDiodeOption[];
}

/**
 * The shelf as the Sizer's parts list: capacitors and diodes with the ratings it chooses by, in the
 * design document's field names. Capacitors without a tolerance on the shelf are taken as ±20 %
 * (common practice for film and ceramic HV capacitors, no source). Sorted by value, then cost.
 */
export function shelfForSizer(parts: readonly ShelfPart[]): SizerPartsList {
  const capacitors = parts
    .filter((part) => part.kind === 'capacitor' && part.valueSi !== null && part.ratedVoltageV !== null)
    .map((part) => ({
      partCode: part.code,
      valueF: part.valueSi as number,
      ratedVoltageV: part.ratedVoltageV as number,
      tolerance: part.tolerance ?? 0.2,
      unitCost: part.unitCost,
    }))
    .sort((a, b) => a.valueF - b.valueF || a.unitCost - b.unitCost);
  const diodes = parts
    .filter((part) => part.kind === 'diode' && part.ratedVoltageV !== null && part.ratedCurrentA !== null)
    .map((part) => ({
      partCode: part.code,
      ratedPivV: part.ratedVoltageV as number,
      ratedAverageCurrentA: part.ratedCurrentA as number,
      ratedSurgeCurrentA: part.ratedSurgeCurrentA,
      unitCost: part.unitCost,
    }))
    .sort((a, b) => a.ratedPivV - b.ratedPivV || a.unitCost - b.unitCost);
  return { capacitors, diodes };
}
