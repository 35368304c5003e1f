import type { PulseDrive, SineDrive } from '../designs/design.types';

/** Resolved drive extremes and timing for one polarity. */
export interface DriveTiming {
  highV: number;
  lowV: number;
  periodS: number;
  /** Time from the H conduction to the L conduction. */
  afterHS: number;
  afterLS: number;
  isSine: boolean;
  sourceResistanceOhm: number;
  frequencyHz: number;
}

export function driveTiming(drive: SineDrive | PulseDrive, polarity: 1 | -1): DriveTiming {
  const periodS = 1 / drive.frequencyHz;
  if (drive.kind === 'sine') {
    return {
      highV: drive.peakV,
      lowV: drive.peakV,
      periodS,
      afterHS: periodS / 2,
      afterLS: periodS / 2,
      isSine: true,
      sourceResistanceOhm: drive.sourceResistanceOhm,
      frequencyHz: drive.frequencyHz,
    };
  }
  // A negative ladder is the mirror image: its H extreme is the flyback.
  const forwardIsHigh = polarity === 1;
  const forwardS = drive.dutyCycle * periodS;
  return {
    highV: forwardIsHigh ? drive.forwardPeakV : drive.flybackPeakV,
    lowV: forwardIsHigh ? drive.flybackPeakV : drive.forwardPeakV,
    periodS,
    // The H conduction happens at the start of the H phase, which lasts until the L phase begins.
    afterHS: forwardIsHigh ? forwardS : periodS - forwardS,
    afterLS: forwardIsHigh ? periodS - forwardS : forwardS,
    isSine: false,
    sourceResistanceOhm: drive.sourceResistanceOhm,
    frequencyHz: drive.frequencyHz,
  };
}
