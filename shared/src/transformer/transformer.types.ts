import type { Static } from '@sinclair/typebox';
import type {
  coreKindSchema,
  tapeKindSchema,
  transformerChoiceSchema,
  transformerGapSchema,
  transformerSectionSchema,
  transformerWindingSchema,
  wireKindSchema,
  windingRoleSchema,
} from '../designs/transformer-section.schema';
import type { CheckVerdict } from '../safety/check.types';
import type { MethodInfo } from '../methods';

/**
 * Types of the designed transformer. The inputs derive from their one definition in
 * designs/transformer-section.schema.ts (read the descriptions there); the results are computed by the
 * functions of this folder. SI base units throughout: m, m², m³, H, T, A, V, Ω, W, F, Hz, s; temperatures
 * in °C and margins in per cent, as elsewhere in shared/.
 */

/** A core pair with its bobbin (Parts shelf kind `core`). */
export type CoreKind = Static<typeof coreKindSchema>;
/** An enamelled round copper wire (Parts shelf kind `wire`). */
export type WireKind = Static<typeof wireKindSchema>;
/** An insulating tape (Parts shelf kind `tape`). */
export type TapeKind = Static<typeof tapeKindSchema>;
export type WindingRole = Static<typeof windingRoleSchema>;
/** One winding of the section; the section lists them from the core outward. */
export type TransformerWinding = Static<typeof transformerWindingSchema>;
/** A gap length, a target AL or a target primary inductance. */
export type TransformerGap = Static<typeof transformerGapSchema>;
/** The transformer section of a driver stage (`drive.driver.transformerDesign`). */
export type TransformerSection = Static<typeof transformerSectionSchema>;
/** `drive.driver.transformerChoice`: 'given' (default) or 'designed'. */
export type TransformerChoice = Static<typeof transformerChoiceSchema>;

/** One point of a piecewise-linear waveform over one period, starting at t = 0. */
export interface WaveformPoint {
  timeS: number;
  value: number;
}

/**
 * The driver's operating point the transformer is judged at: one period of each winding's current and
 * of the primary's magnetizing current as piecewise-linear waveforms (first point at t = 0, last at the
 * period, equal values there), and the peak winding voltages.
 */
export interface TransformerOperatingPoint {
  frequencyHz: number;
  /** Magnetizing current referred to the primary (A) over one period; it sets the flux. */
  magnetizingCurrentA: WaveformPoint[];
  /** Current of each winding (A) over one period. */
  windingCurrentsA: Record<WindingRole, WaveformPoint[]>;
  /** Largest magnitude of each winding's voltage over the period (V). */
  windingPeakVoltagesV: Record<WindingRole, number>;
  /** Largest voltage from the secondary to the low-voltage windings (V): its working voltage. */
  secondaryWorkingVoltageV: number;
  /** Air around the transformer (°C). */
  ambientTemperatureC: number;
}

/** Gap and inductance factor of the gapped core. */
export interface GapResult {
  gapM: number;
  /** Inductance factor of the gapped core with fringing (H per turn²). */
  alHPerTurn2: number;
  /** McLyman's fringing factor F ≥ 1 (1 when ungapped). */
  fringingFactor: number;
}

/** Figures of one winding. */
export interface WindingResult {
  role: WindingRole;
  name: string;
  turns: number;
  /** Self-inductance (H). */
  inductanceH: number;
  turnsPerLayer: number;
  layers: number;
  /** Radial build of the winding with its layer tape (m). */
  buildM: number;
  /** Mean length of one turn of this winding (m). */
  meanTurnLengthM: number;
  dcResistanceOhm: number;
  /** Dowell's AC-to-DC resistance factor weighted over the current's harmonics (≥ 1). */
  acResistanceFactor: number;
  rmsCurrentA: number;
  copperLossW: number;
  /** Voltage per turn at the winding's peak voltage (V): between adjacent turns of a layer. */
  turnToTurnV: number;
  /** Largest voltage between adjacent layers (V): two layers' worth at the layer ends in a U-wound winding. */
  layerToLayerV: number;
  /** Voltage across one layer end to end (V). */
  layerEndToEndV: number;
  /** Breakdown strength between adjacent layers: two enamels plus the layer tape (V). */
  layerInsulationV: number;
}

/** Everything computed from a transformer section at an operating point. */
export interface TransformerReport {
  gap: GapResult;
  windings: WindingResult[];
  /** Primary magnetizing inductance (H). */
  primaryInductanceH: number;
  /** Coupling coefficient of each winding pair, from the leakage estimate. */
  couplings: { primaryFeedback: number; primarySecondary: number; feedbackSecondary: number };
  /** Leakage inductance between primary and secondary, referred to the primary (H). */
  leakagePrimarySecondaryH: number;
  /** Peak flux density at the operating point's peak magnetizing current (T). */
  peakFluxDensityT: number;
  /** Flux density swing peak to peak over the period (T). */
  fluxSwingT: number;
  /** Saturation flux density at 100 °C (T) and the margin to it in per cent. */
  saturationFluxDensityT: number;
  saturationMarginPct: number;
  /** Primary current at which the flux reaches saturation at 100 °C (A). */
  saturationCurrentA: number;
  /** Primary inductance in deep saturation (gap only, relative permeability 1 in the core) (H). */
  saturatedInductanceH: number;
  coreLossW: number;
  copperLossW: number;
  /** Core temperature rise above ambient (°C) by McLyman's surface-area rule. */
  temperatureRiseC: number;
  /** Copper area of all windings over the window area. */
  windowFill: number;
  /** Radial build of all windings and tapes over the bobbin height. */
  buildFill: number;
  /** Self-capacitance of the secondary (F), multilayer formula. */
  secondaryCapacitanceF: number;
  /** Hipot voltage to ask for between the secondary and the other windings (V). */
  hipotTestVoltageV: number;
  /** Breakdown of the insulation between adjacent windings (V). */
  windingInsulationV: number;
  /** Creepage along the bobbin flange: provided and required (m). */
  flangeCreepageM: number;
  requiredCreepageM: number;
  checks: CheckVerdict[];
  /** How each figure was computed, by figure name. */
  methods: Record<string, MethodInfo>;
  /** What the section does to the driver beside the given numbers (set by the design's analysis). */
  driverEffect?: TransformerDriverEffect | null;
}

/**
 * The numbers the driver reads from a transformer ("given transformer"), derived from a section
 * (see `givenTransformerFromSection`).
 */
export interface DerivedTransformerNumbers {
  primaryTurns: number;
  feedbackTurns: number;
  secondaryTurns: number;
  primaryInductanceH: number;
  couplingCoefficient: number;
  windingCouplings: { primaryFeedback: number; primarySecondary: number; feedbackSecondary: number };
  primaryResistanceOhm: number;
  feedbackResistanceOhm: number;
  secondaryResistanceOhm: number;
  saturationCurrentA: number;
  saturatedInductanceH: number;
  secondaryCapacitanceF: number;
}

/** One ranked core of the transformer Sizer. */
export interface TransformerSizerCandidate {
  core: CoreKind;
  gap: GapResult;
  primaryTurns: number;
  secondaryTurns: number;
  feedbackTurns: number;
  peakFluxDensityT: number;
  saturationMarginPct: number;
  coreLossW: number;
  copperLossW: number;
  windowFill: number;
  temperatureRiseC: number;
  /** The section the Sizer built for the core (null when no turns count fits). */
  section: TransformerSection | null;
  /** Why the core is refused, or null when it fits. */
  refusal: string | null;
}

/** What the transformer Sizer needs from the driver. */
export interface TransformerSizerRequest {
  primaryInductanceH: number;
  primaryPeakCurrentA: number;
  /** Secondary turns over primary turns. */
  turnsRatio: number;
  /** Feedback turns over primary turns. */
  feedbackRatio: number;
  frequencyHz: number;
  /** Fraction of the period the primary conducts. */
  dutyOnFraction: number;
  primaryWire: WireKind;
  feedbackWire: WireKind;
  secondaryWire: WireKind;
  /** Tape between windings and its wraps, and between the secondary's layers (one wrap) if given. */
  windingTape: TapeKind;
  windingTapeWraps: number;
  layerTape?: TapeKind;
  /** Peak secondary voltage (V), for the layer and winding insulation. */
  secondaryPeakV: number;
  /** Margin below Bsat(100 °C) the flux must keep, in per cent (default 20). */
  minSaturationMarginPct?: number;
}

/**
 * What the designed transformer does to the driver, beside the same design on the stage's given numbers:
 * output against the target, efficiency against the given numbers', and the plain findings (empty when the
 * section leaves the driver as the given numbers do).
 */
export interface TransformerDriverEffect {
  /** Mean output at the rated load with the section (V, signed) and the target (V). */
  outputV: number;
  targetOutputV: number;
  /** The same with the stage's given transformer numbers (V). */
  givenOutputV: number;
  /** Driver efficiency at the rated load (0–1) with the section and with the given numbers. */
  efficiency: number;
  givenEfficiency: number;
  /** Secondary over primary turns, of the section and of the given numbers. */
  turnsRatio: number;
  givenTurnsRatio: number;
  /** True when the output falls short of the target or the efficiency collapses against the given numbers. */
  spoilsDriver: boolean;
  /** One plain sentence per finding, the worst first. */
  findings: string[];
}
