import { DomainError } from '../errors';
import type { TransformerOperatingPoint, WaveformPoint } from './transformer.types';

/** The blocking oscillator's figures at one operating point (from its estimate or a simulation). */
export interface PulseStageFigures {
  frequencyHz: number;
  onTimeS: number;
  flybackTimeS: number;
  /** Primary current at the end of the on-time (A). */
  primaryPeakCurrentA: number;
  /**
   * Peak of the magnetizing current (A), at least the primary's: it keeps rising after the collector leaves
   * saturation while the collector node slews (driver/turn-off-overshoot.ts). The primary's peak if absent.
   */
  magnetizingPeakCurrentA?: number;
  /** Mean base current over the on-time (A): the feedback winding's current. */
  baseCurrentA: number;
  /** Primary winding voltage during the on-time (V). */
  primaryOnVoltageV: number;
  forwardSecondaryPeakV: number;
  flybackSecondaryPeakV: number;
  primaryTurns: number;
  feedbackTurns: number;
  secondaryTurns: number;
  ambientTemperatureC: number;
  /**
   * Power the load takes from the forward pulse (W), carried by the secondary during the on-time and
   * reflected into the primary; 0 if absent.
   */
  forwardLoadPowerW?: number;
}

/**
 * The transformer's operating point in a flyback-fed blocking oscillator: the magnetizing current ramps
 * from zero to the peak over the on-time (carried by the primary) and back to zero over the flyback
 * (carried by the secondary, Np/Ns of it), then rests at zero until the next on-time; the feedback winding
 * carries the base current during the on-time. With a load on the forward pulse, the secondary also carries
 * its mean current P/(f·V·t_on) during the on-time, and the primary that current in the turns ratio on top of
 * the magnetizing ramp. The magnetizing current peaks at `magnetizingPeakCurrentA` when given (the slew after
 * the collector leaves saturation, folded into the on-time ramp). Winding voltages: forward and flyback pulses in the turns ratio.
 */
export function pulseOperatingPoint(figures: PulseStageFigures): TransformerOperatingPoint {
  const { frequencyHz, onTimeS, primaryPeakCurrentA: ipk } = figures;
  const imPeak = Math.max(ipk, figures.magnetizingPeakCurrentA ?? ipk);
  if (!(frequencyHz > 0 && onTimeS > 0)) {
    throw new DomainError('invalid_argument', 'the stage must oscillate to load the transformer', 'frequencyHz');
  }
  const periodS = 1 / frequencyHz;
  const tOn = Math.min(onTimeS, periodS);
  const tFly = Math.max(0, Math.min(figures.flybackTimeS, periodS - tOn));
  const tEnd = tOn + tFly;
  const pulse = (onValue: [number, number], flyValue: [number, number]): WaveformPoint[] => {
    const points: WaveformPoint[] = [
      { timeS: 0, value: onValue[0] },
      { timeS: tOn, value: onValue[1] },
    ];
    if (tFly > 0) {
      points.push({ timeS: tOn, value: flyValue[0] }, { timeS: tEnd, value: flyValue[1] });
    } else points.push({ timeS: tOn, value: flyValue[1] });
    if (tEnd < periodS) points.push({ timeS: periodS, value: flyValue[1] });
    return points;
  };
  const ratio = figures.primaryTurns / figures.secondaryTurns;
  const forwardA =
    figures.forwardSecondaryPeakV > 0
      ? (figures.forwardLoadPowerW ?? 0) / (frequencyHz * figures.forwardSecondaryPeakV * tOn)
      : 0;
  const reflectedA = forwardA / ratio;
  const secondaryPeakV = Math.max(figures.forwardSecondaryPeakV, figures.flybackSecondaryPeakV);
  const toPrimary = figures.primaryTurns / figures.secondaryTurns;
  return {
    frequencyHz,
    magnetizingCurrentA: [
      { timeS: 0, value: 0 },
      { timeS: tOn, value: imPeak },
      ...(tFly > 0 ? [{ timeS: tEnd, value: 0 }] : [{ timeS: tOn, value: 0 }]),
      ...(tEnd < periodS ? [{ timeS: periodS, value: 0 }] : []),
    ],
    windingCurrentsA: {
      primary: pulse([reflectedA, ipk + reflectedA], [0, 0]),
      feedback: pulse([figures.baseCurrentA, figures.baseCurrentA], [0, 0]),
      secondary: pulse([forwardA, forwardA], [imPeak * ratio, 0]),
    },
    windingPeakVoltagesV: {
      primary: Math.max(figures.primaryOnVoltageV, figures.flybackSecondaryPeakV * toPrimary),
      feedback:
        (Math.max(figures.primaryOnVoltageV, figures.flybackSecondaryPeakV * toPrimary) * figures.feedbackTurns) /
        figures.primaryTurns,
      secondary: secondaryPeakV,
    },
    secondaryWorkingVoltageV: secondaryPeakV,
    ambientTemperatureC: figures.ambientTemperatureC,
  };
}
