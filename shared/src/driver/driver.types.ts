/**
 * Input and result types of the driver stage: a battery- or DC-fed blocking oscillator with a feedback
 * winding, driving the primary of a step-up transformer whose secondary feeds the ladder.
 * All quantities in SI base units (V, A, Ω, H, s, Ah for cell capacity as the trade states it).
 */

import type { Static } from '@sinclair/typebox';
import type {
  cellChemistrySchema,
  cellCurvePointSchema,
  cellsSupplySchema,
  dcSupplySchema,
  driverClampSchema,
  driverStageSchema,
  driverSupplySchema,
  driverTransformerSchema,
  driverTransistorSchema,
} from '../designs/driver-stage.schema';

/** Input types, derived from the driver stage's definition in shared/src/designs/driver-stage.schema.ts. */
export type CellChemistry = Static<typeof cellChemistrySchema>;
/** One point of a per-cell open-circuit voltage curve; `chargeFraction` 1 = full, 0 = empty. */
export type CellCurvePoint = Static<typeof cellCurvePointSchema>;
/** A string of identical cells in series. */
export type CellsSupply = Static<typeof cellsSupplySchema>;
/** A bench or mains-derived DC supply with a series source resistance. */
export type DcSupply = Static<typeof dcSupplySchema>;
export type DriverSupply = Static<typeof driverSupplySchema>;
/** Three-winding transformer: primary (collector), feedback (base), secondary (to the ladder). */
export type DriverTransformer = Static<typeof driverTransformerSchema>;
/** The switching BJT (NPN, common emitter). */
export type DriverTransistor = Static<typeof driverTransistorSchema>;
/** Collector clamp that limits the flyback voltage. */
export type DriverClamp = Static<typeof driverClampSchema>;
export type DriverStage = Static<typeof driverStageSchema>;

/** How a figure was computed, so the Workbench can say so beside it. */
export interface MethodInfo {
  methodId: string;
  summary: string;
  assumptions: string[];
  source: string;
}

/** A number with the method that produced it. */
export interface Estimated<T = number> {
  value: T;
  method: MethodInfo;
}

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
