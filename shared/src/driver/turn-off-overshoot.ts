import type { DriverStage } from '../designs/driver-stage.types';
import type { MethodInfo } from '../methods';
import { collectorNodeCapacitanceOf } from './oscillator-stage';

export const TURN_OFF_OVERSHOOT_METHOD: MethodInfo = {
  methodId: 'driver.turn-off-magnetizing-peak-v1',
  summary:
    'The magnetizing current keeps rising after the collector leaves saturation, while the collector node (stray plus the secondary’s self-capacitance reflected by (Ns/Np)²) slews and the primary voltage is still positive: C·dv/dt = iC(v) − im, Lm·dim/dt = v, the transistor a transconductance β·(Nf/Np)/(Rb + Rfb) from the primary voltage until it cuts off. The peak is where the primary voltage crosses zero.',
  assumptions: [
    'the transistor leaves saturation at the on-time’s peak current and follows its base drive linearly until cut-off',
    'the magnetizing inductance is k·Lp and linear over the slew; winding resistances and the base-emitter capacitance are neglected',
  ],
  source: 'KCL and Faraday’s law at the collector node, integrated numerically (common practice, no source)',
};

/** What the turn-off slew needs. SI units. */
export interface TurnOffSlew {
  /** Magnetizing current when the collector leaves saturation (A). */
  startCurrentA: number;
  /** Primary voltage then (V), positive while the core charges. */
  primaryVoltageV: number;
  magnetizingInductanceH: number;
  collectorNodeCapacitanceF: number;
  /** Collector current change per volt of primary voltage through the base drive (A/V). */
  transconductanceS: number;
}

/**
 * Peak magnetizing current of the turn-off slew: the collector node's two-state system (primary voltage and
 * magnetizing current) integrated by classical Runge–Kutta from the saturation exit until the primary voltage
 * crosses zero; the collector current is held at or above zero (cut-off).
 */
export function turnOffMagnetizingPeakA(slew: TurnOffSlew): number {
  const { startCurrentA: i0, primaryVoltageV: v0, magnetizingInductanceH: lm, collectorNodeCapacitanceF: c } = slew;
  const g = slew.transconductanceS;
  if (!(v0 > 0 && lm > 0 && c > 0 && i0 >= 0)) return i0;
  const collectorA = (v: number) => Math.max(0, i0 + g * (v - v0));
  // v' = (iC(v) − im)/C, im' = v/Lm.
  const dv = (v: number, im: number) => (collectorA(v) - im) / c;
  const di = (v: number) => v / lm;
  // Steps of 1/2000 of the tank's period; while the collector still conducts, also at most a tenth of the
  // regenerative time constant C/g, so a fast cut-off is followed rather than stepped over.
  const maxStepS = (2 * Math.PI * Math.sqrt(lm * c)) / 2000;
  const regenerativeS = g > 0 ? (0.1 * c) / g : maxStepS;
  let v = v0;
  let im = i0;
  for (let n = 0; n < 1_000_000 && v > 0; n += 1) {
    const stepS = collectorA(v) > 0 ? Math.min(maxStepS, regenerativeS) : maxStepS;
    const k1v = dv(v, im);
    const k1i = di(v);
    const k2v = dv(v + (stepS / 2) * k1v, im + (stepS / 2) * k1i);
    const k2i = di(v + (stepS / 2) * k1v);
    const k3v = dv(v + (stepS / 2) * k2v, im + (stepS / 2) * k2i);
    const k3i = di(v + (stepS / 2) * k2v);
    const k4v = dv(v + stepS * k3v, im + stepS * k3i);
    const k4i = di(v + stepS * k3v);
    const nextV = v + (stepS / 6) * (k1v + 2 * k2v + 2 * k3v + k4v);
    const nextI = im + (stepS / 6) * (k1i + 2 * k2i + 2 * k3i + k4i);
    if (nextV <= 0) {
      // The current peaks where v crosses zero: interpolate the current over the last step.
      return im + ((nextI - im) * v) / (v - nextV);
    }
    v = nextV;
    im = nextI;
  }
  return im;
}

/** The turn-off slew of a driver stage from its estimate's peak current and on-time primary voltage. */
export function stageTurnOffSlew(stage: DriverStage, peakCurrentA: number, primaryVoltageV: number): TurnOffSlew {
  const tx = stage.transformer;
  return {
    startCurrentA: peakCurrentA,
    primaryVoltageV,
    magnetizingInductanceH: tx.couplingCoefficient * tx.primaryInductanceH,
    collectorNodeCapacitanceF: collectorNodeCapacitanceOf(stage),
    transconductanceS:
      (stage.transistor.forwardBeta * (tx.feedbackTurns / tx.primaryTurns)) /
      (stage.baseResistorOhm + tx.feedbackResistanceOhm),
  };
}
