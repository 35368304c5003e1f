/**
 * Input types of the driver stage: a battery- or DC-fed blocking oscillator with a feedback
 * winding, driving the primary of a step-up transformer whose secondary feeds the ladder.
 * All quantities in SI base units (V, A, Ω, H, s, Ah for cell capacity as the trade states it).
 */

export type CellChemistry = 'alkaline' | 'nimh' | 'li-ion' | 'custom';

/** One point of a per-cell open-circuit voltage curve; `chargeFraction` 1 = full, 0 = empty. */
export interface CellCurvePoint {
  chargeFraction: number;
  voltageV: number;
}

/** A string of identical cells in series. */
export interface CellsSupply {
  kind: 'cells';
  chemistry: CellChemistry;
  cellsInSeries: number;
  /** Rated capacity of one cell at a light drain. */
  capacityAh: number;
  /** Internal resistance of one cell. */
  internalResistanceOhm: number;
  /** Per-cell loaded terminal voltage at which the equipment is taken as dead. */
  endVoltagePerCellV: number;
  /** Per-cell open-circuit voltage vs state of charge; defaults to the chemistry's built-in curve. */
  curve?: CellCurvePoint[];
  /** Continuous drain one cell tolerates; defaults to the chemistry's figure (required for 'custom'). */
  maxContinuousCurrentA?: number;
}

/** A bench or mains-derived DC supply with a series source resistance. */
export interface DcSupply {
  kind: 'dc';
  voltageV: number;
  sourceResistanceOhm: number;
}

export type DriverSupply = CellsSupply | DcSupply;

/** Three-winding transformer: primary (collector), feedback (base), secondary (to the ladder). */
export interface DriverTransformer {
  primaryTurns: number;
  feedbackTurns: number;
  secondaryTurns: number;
  /** Magnetizing inductance seen at the primary. */
  primaryInductanceH: number;
  /** Coupling coefficient k between primary and the other windings (0 < k ≤ 1). */
  couplingCoefficient: number;
  primaryResistanceOhm: number;
  feedbackResistanceOhm: number;
  secondaryResistanceOhm: number;
  /** Primary current at which the core saturates. */
  saturationCurrentA: number;
  /** Insulation between secondary and the low-voltage windings, as rated by its supplier. */
  insulation?: { ratedVoltageV: number };
}

/** The switching BJT (NPN, common emitter). */
export interface DriverTransistor {
  forwardBeta: number;
  reverseBeta: number;
  vbeOnV: number;
  vceSatV: number;
  vceoMaxV: number;
  icMaxA: number;
  /** Ebers-Moll saturation current for the full simulation; a small-signal default is used if absent. */
  saturationCurrentA?: number;
}

/** Collector clamp that limits the flyback voltage. */
export type DriverClamp =
  | { kind: 'rcd'; clampVoltageV: number; resistorOhm?: number; capacitorF?: number }
  | { kind: 'zener'; clampVoltageV: number };

export interface DriverStage {
  supply: DriverSupply;
  transformer: DriverTransformer;
  transistor: DriverTransistor;
  baseResistorOhm: number;
  /** Optional series resistor in the collector (current sensing or limiting). */
  collectorResistorOhm?: number;
  clamp?: DriverClamp;
  /** A neon or LED power indicator drawing a steady current from the supply. */
  indicatorLamp?: { currentA: number };
  /** Time the push-button is held for a cold start (used by the start-up simulation). */
  switchOnTimeS?: number;
  /** Battery life the equipment must reach on a cells supply, in hours as the trade states it (checked when given). */
  batteryLifeTargetH?: number;
}
