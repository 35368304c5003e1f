import type { Static } from '@sinclair/typebox';
import type {
  bleederStringSchema,
  capacitorPartSchema,
  designSchema,
  designTargetsSchema,
  diodePartSchema,
  dischargeRuleSchema,
  driveSchema,
  driverDriveSchema,
  loadSchema,
  multiplierSpecSchema,
  outputNetworkSchema,
  pulseDriveSchema,
  sineDriveSchema,
  spacingEnvironmentSchema,
  topologySchema,
} from './design.schema';

/**
 * Types of the design document, derived from its one definition in design.schema.ts (read the
 * descriptions there). Capacitor order, from the source upward in conduction order (capacitor i is
 * charged through diode i):
 * - half-wave, even cellCount: C1 oscillating stage 1, C2 smoothing stage 1, C3 oscillating stage 2 …
 * - half-wave, odd cellCount (tripler …): the ladder starts with a half-wave rectifier cell so that the
 *   top capacitor sits in the smoothing column: C1 smoothing, C2 oscillating, C3 smoothing …
 * - full-wave (symmetrical cascade, two antiphase windings): cellCount = stages; three capacitors per
 *   stage: oscillating column A, oscillating column B, smoothing column (3 × cellCount capacitors).
 * - bridge-doubler: cellCount 2; C1 the positive half (top to winding midpoint), C2 the negative half.
 */
export type Design = Static<typeof designSchema>;
/** A sinusoidal secondary: `peakV` is the PEAK (not rms) of the secondary voltage. */
export type SineDrive = Static<typeof sineDriveSchema>;
/** Rectangular pulses as a blocking oscillator gives them: forward peak for `dutyCycle`, then the flyback. */
export type PulseDrive = Static<typeof pulseDriveSchema>;
/** The secondary follows from a driver stage (shared/src/driver) through its closed-form estimate. */
export type DriverDrive = Static<typeof driverDriveSchema>;
export type Drive = Static<typeof driveSchema>;
export type Topology = Static<typeof topologySchema>;
export type CapacitorPart = Static<typeof capacitorPartSchema>;
export type DiodePart = Static<typeof diodePartSchema>;
export type MultiplierSpec = Static<typeof multiplierSpecSchema>;
export type BleederString = Static<typeof bleederStringSchema>;
export type OutputNetwork = Static<typeof outputNetworkSchema>;
export type Load = Static<typeof loadSchema>;
export type DischargeRule = Static<typeof dischargeRuleSchema>;
export type SpacingEnvironment = Static<typeof spacingEnvironmentSchema>;
export type DesignTargets = Static<typeof designTargetsSchema>;

export { DESIGN_SCHEMA_VERSION } from './design.schema';
