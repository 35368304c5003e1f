import type { CellChemistry, CellCurvePoint } from '../designs/driver-stage.types';

/**
 * Built-in per-cell open-circuit voltage curves vs state of charge, for light drains at room temperature.
 * Standing: common practice, no source; the alkaline curve also from memory of Linden & Reddy,
 * *Handbook of Batteries*, 4th ed. (REFERENCES.md §6: fresh 1.55–1.65 V, end 0.8–0.9 V).
 * Points run from full (chargeFraction 1) to empty (0).
 */
export const defaultCellCurves: Readonly<Record<Exclude<CellChemistry, 'custom'>, readonly CellCurvePoint[]>> = {
  alkaline: [
    { chargeFraction: 1, voltageV: 1.6 },
    { chargeFraction: 0.9, voltageV: 1.47 },
    { chargeFraction: 0.7, voltageV: 1.36 },
    { chargeFraction: 0.5, voltageV: 1.27 },
    { chargeFraction: 0.3, voltageV: 1.18 },
    { chargeFraction: 0.15, voltageV: 1.08 },
    { chargeFraction: 0.05, voltageV: 0.95 },
    { chargeFraction: 0, voltageV: 0.8 },
  ],
  nimh: [
    { chargeFraction: 1, voltageV: 1.42 },
    { chargeFraction: 0.9, voltageV: 1.32 },
    { chargeFraction: 0.7, voltageV: 1.27 },
    { chargeFraction: 0.5, voltageV: 1.25 },
    { chargeFraction: 0.3, voltageV: 1.22 },
    { chargeFraction: 0.15, voltageV: 1.18 },
    { chargeFraction: 0.05, voltageV: 1.08 },
    { chargeFraction: 0, voltageV: 0.9 },
  ],
  'li-ion': [
    { chargeFraction: 1, voltageV: 4.2 },
    { chargeFraction: 0.9, voltageV: 4.06 },
    { chargeFraction: 0.8, voltageV: 3.95 },
    { chargeFraction: 0.6, voltageV: 3.82 },
    { chargeFraction: 0.4, voltageV: 3.72 },
    { chargeFraction: 0.2, voltageV: 3.62 },
    { chargeFraction: 0.1, voltageV: 3.48 },
    { chargeFraction: 0.05, voltageV: 3.3 },
    { chargeFraction: 0, voltageV: 3.0 },
  ],
};

/**
 * Continuous drain one cell of each chemistry tolerates without gross capacity loss or heating
 * (AA/LR6-size alkaline and NiMH, 18650-size Li-ion). Standing: common practice, no source.
 */
export const defaultCellMaxContinuousCurrentA: Readonly<Record<Exclude<CellChemistry, 'custom'>, number>> = {
  alkaline: 1.0,
  nimh: 2.0,
  'li-ion': 2.5,
};
