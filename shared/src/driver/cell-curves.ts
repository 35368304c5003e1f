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

/**
 * How a cell's capacity falls with the discharge rate and its internal resistance rises as it empties:
 * capacity by Peukert's law, t = H·(C/(I·H))^k (W. Peukert, 1897; the form of Linden & Reddy, *Handbook of
 * Batteries*, from memory), taken only above the rated current C/H (below it the rated capacity holds);
 * resistance R(σ) = R_full·(1 + m·(1 − σ)^p) with σ the state of charge.
 */
export interface CellRateModel {
  /** Peukert exponent k (1 = no rate dependence). */
  peukertExponent: number;
  /** Discharge time H (h) at which the rated capacity is stated. */
  ratedDischargeH: number;
  /** m: the resistance at empty is (1 + m) times the full cell's. */
  resistanceRiseAtEmpty: number;
  /** p: how late in the discharge the resistance rises. */
  resistanceRisePower: number;
  source: string;
}

/**
 * Built-in rate models per chemistry. Alkaline, from the LR6 figures of REFERENCES.md §6 (2.5–3 Ah at tens
 * of mA, 1–1.5 Ah at 1 A; internal resistance 0.1–0.3 Ω fresh rising past 1 Ω near the end): those capacities
 * put k between 1.15 and 1.3; k = 1.15 with the resistance rising sevenfold (m = 6, mostly in the last third,
 * p = 4) lands a 2.5 Ah cell at 1.0 Ah for 1 A to 0.8 V; capacity stated at a light drain (~100 h). NiMH: k ≈ 1.1, rated at 0.2 It (5 h, IEC 61951-2),
 * resistance doubling towards empty. Li-ion: k ≈ 1.05, rated at 0.2 It (5 h, IEC 61960), resistance doubling
 * towards empty. Standing: from memory (Linden & Reddy, 4th ed.; the IEC rates), not checked against the text.
 */
export const defaultCellRateModels: Readonly<Record<Exclude<CellChemistry, 'custom'>, CellRateModel>> = {
  alkaline: {
    peukertExponent: 1.15,
    ratedDischargeH: 100,
    resistanceRiseAtEmpty: 6,
    resistanceRisePower: 4,
    source: 'from memory: Linden & Reddy, Handbook of Batteries, 4th ed. (LR6 figures, REFERENCES.md §6)',
  },
  nimh: {
    peukertExponent: 1.1,
    ratedDischargeH: 5,
    resistanceRiseAtEmpty: 1,
    resistanceRisePower: 3,
    source: 'from memory: Linden & Reddy, Handbook of Batteries, 4th ed.; rated at 0.2 It (IEC 61951-2)',
  },
  'li-ion': {
    peukertExponent: 1.05,
    ratedDischargeH: 5,
    resistanceRiseAtEmpty: 1,
    resistanceRisePower: 3,
    source: 'from memory: Linden & Reddy, Handbook of Batteries, 4th ed.; rated at 0.2 It (IEC 61960)',
  },
};

/** A custom cell without its own figures: no rate dependence, constant resistance. */
export const customCellRateModel: CellRateModel = {
  peukertExponent: 1,
  ratedDischargeH: 20,
  resistanceRiseAtEmpty: 0,
  resistanceRisePower: 3,
  source: 'no rate model: capacity and resistance as entered',
};
