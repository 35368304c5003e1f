import type { DriverStage } from './driver-stage.types';

/** Current version of the design document; a document of another version is refused (`unsupported_version`). */
export const DESIGN_SCHEMA_VERSION = 1;

/** A sinusoidal secondary: `peakV` is the PEAK (not rms) of the secondary voltage. */
export interface SineDrive {
  kind: 'sine';
  peakV: number;
  frequencyHz: number;
  /** Resistance in series with each driven end of the secondary (winding resistance plus any limiter). */
  sourceResistanceOhm: number;
}

/**
 * A rectangular-pulse secondary as a blocking oscillator gives it: `forwardPeakV` (magnitude) for
 * `dutyCycle` of the period, then the flyback at `flybackPeakV` (magnitude, opposite sign) for the rest.
 */
export interface PulseDrive {
  kind: 'pulse';
  forwardPeakV: number;
  flybackPeakV: number;
  frequencyHz: number;
  dutyCycle: number;
  sourceResistanceOhm: number;
}

/** The secondary follows from a driver stage (shared/src/driver) through its closed-form estimate. */
export interface DriverDrive {
  kind: 'driver';
  driver: DriverStage;
}

export type Drive = SineDrive | PulseDrive | DriverDrive;

export type Topology = 'half-wave' | 'full-wave' | 'bridge-doubler';

export interface CapacitorPart {
  valueF: number;
  /** Fractional tolerance, e.g. 0.1 for ±10 %. */
  tolerance: number;
  ratedVoltageV: number;
  partCode?: string;
}

/** Shockley diode with series resistance, plus the ratings the Checks compare against. */
export interface DiodePart {
  saturationCurrentA: number;
  emissionCoefficient: number;
  seriesResistanceOhm: number;
  ratedPivV: number;
  ratedAverageCurrentA: number;
  ratedSurgeCurrentA: number;
  junctionCapacitanceF?: number;
  partCode?: string;
}

/**
 * The ladder. Capacitor order, from the source upward in conduction order (capacitor i is charged
 * through diode i):
 * - half-wave, even cellCount: C1 oscillating stage 1, C2 smoothing stage 1, C3 oscillating stage 2 …
 * - half-wave, odd cellCount (tripler …): the ladder starts with a half-wave rectifier cell so that the
 *   top capacitor sits in the smoothing column: C1 smoothing, C2 oscillating, C3 smoothing …
 * - full-wave (symmetrical cascade, two antiphase windings): cellCount = stages; three capacitors per
 *   stage: oscillating column A, oscillating column B, smoothing column (3 × cellCount capacitors).
 * - bridge-doubler: cellCount 2; C1 the positive half (top to winding midpoint), C2 the negative half.
 */
export interface MultiplierSpec {
  topology: Topology;
  cellCount: number;
  capacitors: CapacitorPart[];
  diode: DiodePart;
  /** Stray capacitance of each ladder node to ground (first-order in the steady-state model; full in the simulator). */
  strayCapacitanceF?: number;
}

/** A bleeder string of `count` equal resistors across the ladder output. */
export interface BleederString {
  count: number;
  valueOhm: number;
  ratedPowerW: number;
  /** Limiting element voltage of one resistor (IEC 60115-1 term). */
  limitingVoltageV: number;
  partCode?: string;
}

export interface OutputNetwork {
  bleeder: BleederString | null;
  /** Resistor between the ladder top (where the bleeder sits) and the load terminal. */
  seriesOutputResistanceOhm: number;
}

export type Load = { kind: 'current'; currentA: number } | { kind: 'resistance'; resistanceOhm: number };

export type DischargeRule = '50V-1min' | '50V-5min' | '60V-5s' | { voltageV: number; timeS: number };

export interface SpacingEnvironment {
  pollutionDegree: 1 | 2 | 3;
  materialGroup: 'I' | 'II' | 'IIIa' | 'IIIb';
  pcb: boolean;
  altitudeM?: number;
  /** Creepage the layout provides between adjacent ladder nodes; enables the per-stage creepage verdicts. */
  providedCreepageMm?: number;
}

export interface DesignTargets {
  /** Signed: a negative value asks for a negative ladder (diodes reversed). */
  outputV: number;
  rippleMaxV: number;
  loadCurrentA: number;
  safeVoltageV: number;
  dischargeRule: DischargeRule;
  spacing: SpacingEnvironment;
}

export interface Design {
  schemaVersion: 1;
  name: string;
  notes: string;
  drive: Drive;
  multiplier: MultiplierSpec;
  outputNetwork: OutputNetwork;
  load: Load;
  targets: DesignTargets;
}
