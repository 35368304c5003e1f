import type { Estimated } from '../methods';
import type { SecondaryLoad } from './ring-back';

/** What ended the on-time: the base drive (hFE·I_B) or the core saturation current. */
export type OnTimeLimit = 'base' | 'saturation';

export interface BlockingOscillatorOptions {
  /**
   * Secondary flyback peak (V) held by the load (the ladder). Default: the largest the circuit allows,
   * set by the clamp, or without a clamp by the collector breakdown.
   */
  flybackSecondaryPeakV?: number;
  /** Power (W) the load takes from the forward pulse during the on-time, drawn straight from the supply. */
  forwardLoadPowerW?: number;
  /**
   * Capacitance (F) at the collector node, for the leakage spike of an unclamped stage and the switching loss.
   * Default 100 pF plus the secondary's self-capacitance reflected by (Ns/Np)².
   */
  collectorNodeCapacitanceF?: number;
  /** State of charge of a cells supply (1 = full). Default 1. */
  chargeFraction?: number;
  /** Supply bypass capacitor at the stage (F). Default 100 µF, the simulated circuit's. */
  bypassCapacitanceF?: number;
  /** The ladder's capacitance on the secondary for the ring-back between pulses; none for a bare stage. */
  secondaryLoad?: SecondaryLoad;
  /** Starting guess of the loaded supply voltage (V) for the supply solve (a warm start); default the open-circuit voltage. */
  supplyVoltageGuessV?: number;
  /**
   * Slope of h(V) = V − Voc + R_s·I_in(V) near the guess (dimensionless), from a nearby solve: Newton's first
   * step takes it instead of a forward difference (a warm start); default the forward difference.
   */
  supplySlopeGuess?: number;
}

/**
 * Where the stage's power goes per second (W), by element kind, at one operating condition. Together with
 * what the load takes (the deliverable flyback power and the forward-pulse power) they add up to the power
 * drawn from the supply's EMF.
 */
export interface StageLosses {
  /** Vce,sat·i over the on-time. */
  transistorConductionW: number;
  /** The collector node capacitance discharged through the transistor at each turn-on, ½·C·Vin²·f. */
  transistorSwitchingW: number;
  /** Base drive in the base-emitter junction, V_BE·I_B over the on-time (part of the transistor's dissipation). */
  baseEmitterW: number;
  /** Base drive in R_B and the feedback winding, (V_B − V_BE)·I_B over the on-time. */
  baseResistorW: number;
  /** i²R of the primary winding over the on-time. */
  primaryCopperW: number;
  /** i²R of the collector resistor over the on-time. */
  collectorResistorW: number;
  /** i²R of the secondary winding with the flyback current. */
  secondaryCopperW: number;
  /** Leakage energy ½·(1 − k²)·Lp·Ipk² per cycle, taken by the clamp or the ringing of the collector. */
  leakageW: number;
  /** The core's loss (the design's figure, at most what the flyback carries), taken from the stored energy. */
  coreW: number;
  /** The indicator lamp. */
  lampW: number;
  /** I²·R in the supply's own resistance (cells' internal resistance or the bench supply's). */
  supplyResistanceW: number;
}

/** The estimate as plain numbers (SI units), for solvers that call it many times. */
export interface OscillatorNumbers {
  openCircuitV: number;
  supplyResistanceOhm: number;
  /** Loaded supply terminal voltage. */
  vin: number;
  vPrimary: number;
  /** Base current at the start of the on-time. */
  ib: number;
  /** Mean base current over the on-time (it falls as the winding voltage falls with i·R). */
  ibMean: number;
  vBase: number;
  /** hFE·I_B at the start of the on-time (the base-limited current with no series resistance). */
  baseLimitedA: number;
  /** Collector current at which the regenerative turn-off happens: i = hFE·I_B(i). */
  turnOffA: number;
  limit: OnTimeLimit;
  /** Primary current at the end of the stored-energy ramp. */
  ipk: number;
  tOn: number;
  tFly: number;
  /** The collector's resonant fall after the flyback (s). */
  tSwing: number;
  /** The magnetizing current's return to zero before the next on-time (s). */
  tRecovery: number;
  frequencyHz: number;
  energyJ: number;
  deliverableW: number;
  /**
   * What a load on the secondary gets of it at this flyback (W): the deliverable power less what an RCD clamp's
   * resistor takes beside the load beyond the leakage energy (rcd-clamp.ts); the same without one.
   */
  loadDeliverableW: number;
  flybackSecV: number;
  maxFlybackSecV: number;
  reflectedV: number;
  /** Power into the stage at its terminals (W). */
  inputW: number;
  /** Power from the supply's EMF (W): terminal power plus the loss in the supply's own resistance. */
  emfW: number;
  inputA: number;
  collectorPeakV: number;
  /** Secondary forward level in the on-time, k·(Vin − Vce,sat)·Ns/Np (V). */
  forwardSecV: number;
  /** Secondary forward level while the ring-back recovers, k·(Vin + V_BE)·Ns/Np (V). */
  recoveryForwardSecV: number;
  /** Charge (C) the secondary can pass at the recovery level in one cycle, ½·I0·t_recovery·Np/Ns. */
  recoveryChargeC: number;
  flybackEfficiency: number;
  collectorPeakA: number;
  losses: StageLosses;
  /** Slope of h(V) of the supply solve at its last step (absent without supply resistance), to warm-start a nearby solve. */
  supplySlope?: number;
}

export interface BlockingOscillatorEstimate {
  supplyVoltageV: Estimated;
  baseCurrentA: Estimated;
  onTimeLimit: OnTimeLimit;
  /** Primary current at the end of the on-time, the current whose energy is stored. */
  peakPrimaryCurrentA: Estimated;
  /** Collector peak current for the stress checks (above the stored-energy peak when the core saturates). */
  collectorPeakCurrentA: Estimated;
  /** Collector current the base drive can hold in saturation at the start of the on-time, hFE·I_B. */
  baseLimitedCurrentA: number;
  onTimeS: Estimated;
  flybackTimeS: Estimated;
  /** The collector's fall after the flyback and the magnetizing current's return to zero (s; see frequencyHz). */
  ringBack: { swingS: number; recoveryS: number };
  frequencyHz: Estimated;
  energyPerCycleJ: Estimated;
  deliverablePowerW: Estimated;
  forwardSecondaryPeakV: Estimated;
  flybackSecondaryPeakV: Estimated;
  /** The largest flyback the circuit allows (clamp- or breakdown-limited), V at the secondary. */
  maxFlybackSecondaryPeakV: number;
  reflectedVoltageV: Estimated;
  collectorPeakV: Estimated;
  inputCurrentA: Estimated;
  inputPowerW: Estimated;
  /** The stage's own transfer efficiency: (deliverable flyback + forward-pulse power) over terminal input power. */
  efficiency: Estimated;
  /** Where the stage's power goes (W), without what the load takes. */
  losses: StageLosses;
  /** Power from the supply's EMF (W), terminal power plus the supply's own I²R. */
  emfPowerW: number;
}
