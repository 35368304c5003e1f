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
} from './driver-stage.schema';

/**
 * Input types of the driver stage: a battery- or DC-fed blocking oscillator with a feedback winding,
 * driving the primary of a step-up transformer whose secondary feeds the ladder. Derived from the
 * definition in driver-stage.schema.ts (read the descriptions there). SI base units (V, A, Ω, H, s;
 * Ah for cell capacity as the trade states it).
 */
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
