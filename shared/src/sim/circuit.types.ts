/**
 * A circuit for the Ladderwright simulator: named nodes ('0' is ground), SI units throughout.
 * Source waveforms follow the usual SPICE conventions (sine, pulse, piecewise-linear) so an exported
 * netlist means the same thing in any SPICE-compatible tool. Values of a waveform are volts for a
 * voltage source and amperes for a current source.
 */
export const GROUND_NODE = '0';

export type SourceWaveform =
  | { kind: 'dc'; value: number }
  | { kind: 'sine'; offset: number; amplitude: number; frequencyHz: number; delayS?: number; phaseDeg?: number }
  | {
      kind: 'pulse';
      initial: number;
      pulsed: number;
      delayS: number;
      riseS: number;
      fallS: number;
      widthS: number;
      periodS: number;
    }
  | { kind: 'pwl'; points: ReadonlyArray<{ timeS: number; value: number }> };

export interface DiodeModel {
  saturationCurrentA: number;
  emissionCoefficient: number;
  seriesResistanceOhm: number;
  /** Reverse breakdown voltage (positive number); absent means no breakdown. */
  breakdownVoltageV?: number;
  /** Current at the breakdown knee; default 1 mA. */
  breakdownCurrentA?: number;
  /** Zero-bias depletion capacitance; absent or 0 means none. */
  junctionCapacitanceF?: number;
  junctionPotentialV?: number;
  gradingCoefficient?: number;
  transitTimeS?: number;
}

/**
 * An NPN transistor: the Gummel–Poon model of SPICE reduced to the parameters named here (no high-level
 * injection, no base-width modulation in reverse, no substrate). Each optional field is absent or zero for
 * SPICE's own default (no capacitance, no transit time, no resistance, no Early effect); the SPICE name of
 * each is in its comment.
 */
export interface NpnModel {
  /** IS */
  saturationCurrentA: number;
  /** BF */
  forwardBeta: number;
  /** BR */
  reverseBeta: number;
  /** CJE: zero-bias base-emitter depletion capacitance. */
  baseEmitterCapacitanceF?: number;
  /** CJC: zero-bias base-collector depletion capacitance. */
  baseCollectorCapacitanceF?: number;
  /** VJE; default 0.75 V. */
  baseEmitterPotentialV?: number;
  /** MJE; default 0.33. */
  baseEmitterGrading?: number;
  /** VJC; default 0.75 V. */
  baseCollectorPotentialV?: number;
  /** MJC; default 0.33. */
  baseCollectorGrading?: number;
  /** VAF: forward Early voltage; absent for none (infinite). */
  earlyVoltageV?: number;
  /** TF: forward transit time. */
  forwardTransitTimeS?: number;
  /** TR: reverse transit time. */
  reverseTransitTimeS?: number;
  /** RB: base resistance (constant, RBM = RB). */
  baseResistanceOhm?: number;
  /** RC: collector resistance. */
  collectorResistanceOhm?: number;
  /** RE: emitter resistance. */
  emitterResistanceOhm?: number;
}

export interface Winding {
  name: string;
  /** Dot end. */
  nodeA: string;
  nodeB: string;
  inductanceH: number;
  resistanceOhm: number;
  initialCurrentA?: number;
}

/** Coupling coefficient of one pair of windings, by winding name. */
export interface WindingCoupling {
  windingA: string;
  windingB: string;
  coefficient: number;
}

/**
 * A saturating core, referred to the first winding: its magnetizing inductance at zero current (the
 * linear model's k·L1), its saturation current, and its inductance in deep saturation (about the air-core
 * value). The magnetizing current is Σ n_j·i_j with the turns ratios n_j = √(L_j/L_1).
 */
export interface SaturableCore {
  magnetizingInductanceH: number;
  saturationCurrentA: number;
  saturatedInductanceH: number;
}

export type CircuitElement =
  | { kind: 'resistor'; name: string; nodeA: string; nodeB: string; resistanceOhm: number }
  | { kind: 'capacitor'; name: string; nodeA: string; nodeB: string; capacitanceF: number; initialVoltageV?: number }
  | {
      kind: 'inductor';
      name: string;
      nodeA: string;
      nodeB: string;
      inductanceH: number;
      resistanceOhm?: number;
      initialCurrentA?: number;
    }
  /**
   * Windings on one core, every pair coupled with `couplingCoefficient` (0 < k ≤ 1, < 1 in practice) unless
   * `couplings` names the pair; with `core` the core saturates (devices/saturable-core.ts).
   */
  | {
      kind: 'coupled-inductors';
      name: string;
      windings: ReadonlyArray<Winding>;
      couplingCoefficient: number;
      couplings?: ReadonlyArray<WindingCoupling>;
      core?: SaturableCore;
    }
  | { kind: 'voltage-source'; name: string; nodePlus: string; nodeMinus: string; waveform: SourceWaveform }
  /** Current flows from nodePlus through the source to nodeMinus (SPICE convention). */
  | { kind: 'current-source'; name: string; nodePlus: string; nodeMinus: string; waveform: SourceWaveform }
  /** Time-controlled switch: closed or open from each event time on. */
  | {
      kind: 'switch';
      name: string;
      nodeA: string;
      nodeB: string;
      onResistanceOhm: number;
      offResistanceOhm: number;
      isInitiallyClosed: boolean;
      events: ReadonlyArray<{ timeS: number; isClosed: boolean }>;
    }
  | { kind: 'diode'; name: string; anode: string; cathode: string; model: DiodeModel }
  | { kind: 'npn'; name: string; collector: string; base: string; emitter: string; model: NpnModel };

export interface Circuit {
  title: string;
  elements: ReadonlyArray<CircuitElement>;
}

export type IntegrationMethod = 'trapezoidal' | 'gear2';

export interface SimulationTolerances {
  relative: number;
  voltageAbsoluteV: number;
  currentAbsoluteA: number;
  chargeAbsoluteC: number;
  truncationErrorFactor: number;
  maxNewtonIterations: number;
}

export interface TransientOptions {
  stopTimeS: number;
  maxStepS: number;
  method?: IntegrationMethod;
  /** 'element-initial-conditions': start from each capacitor's and inductor's initial value (0 if absent). */
  startFrom?: 'element-initial-conditions' | 'operating-point';
  /** Node names whose voltages are recorded; 'I(name)' records a voltage source's or inductor's current. */
  probes?: ReadonlyArray<string>;
  /** Nothing is recorded before this time. */
  recordFromS?: number;
  tolerances?: Partial<SimulationTolerances>;
}

export interface TransientResult {
  timeS: Float64Array;
  /** One array per probe, same length as timeS. */
  signals: Record<string, Float64Array>;
  acceptedSteps: number;
  rejectedSteps: number;
  newtonIterations: number;
}
