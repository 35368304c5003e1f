import type { PulseDrive } from '../designs/design.types';
import { DomainError } from '../errors';
import { prepareLadder, terminalMeanAt, terminalMeanNear, type PreparedLadder } from '../multiplier/analyze-ladder';
import type { CurrentWarmStart } from '../multiplier/charge-transfer-model';
import { withDriveTiming } from '../multiplier/with-drive';
import { peakSlopes } from '../multiplier/peak-slopes';
import type { LadderInput } from '../multiplier/ladder.types';
import type { SecondaryLoad } from './ring-back';

/** The secondary drive a ladder sees from a blocking oscillator: unequal forward and flyback peaks. */
export interface LadderDrive {
  forwardPeakV: number;
  flybackPeakV: number;
  frequencyHz: number;
  /** Share of the period spent in the forward pulse (the on-time); 0.5 if not given. */
  dutyCycle?: number;
  /** The secondary's dot at ground (flyback phasing): the ladder sees the flyback as its positive pulse. */
  isFlybackFed?: boolean;
}

/** What the ladder does at one drive and one external load current. */
export interface LadderState {
  /** Mean load-terminal output, magnitude (V). */
  outputV: number;
  /** Current the ladder delivers at its top: external load plus bleeder (A). */
  ladderCurrentA: number;
}

/**
 * The ladder as the driver sees it: its output at a drive and an external load current, and the charge each
 * drive pulse pushes per unit of ladder output charge (∂V_top/∂V₋ and ∂V_top/∂V₊ at a fixed ladder current,
 * equal to the charge ratio for a lossless ladder by reciprocity). `engineLadderLoadLine` is the product's.
 */
export interface LadderLoadLine {
  at(drive: LadderDrive, loadCurrentA: number): LadderState;
  chargeRatios(drive: LadderDrive, ladderCurrentA: number): { flyback: number; forward: number };
  /** The output network, for the power balance (bleeder Ω or null, series output resistor Ω); none when absent. */
  network?: { bleederOhm: number | null; seriesOutputResistanceOhm: number };
  /** The ladder's capacitance on the secondary for the driver's ring-back between pulses; none when absent. */
  secondaryLoad?: SecondaryLoad;
  /**
   * Text of every input the answers depend on (equal keys, equal answers), for callers that remember results
   * per ladder; none where the load line cannot state it.
   */
  readonly key?: string;
}

/**
 * The half-wave ladder's load on the secondary between pulses: one diode per cell, each swinging by the
 * secondary's peak-to-peak, and the strays of the oscillating column's nodes (every other node).
 */
export function secondaryLoadOf(
  input: Pick<LadderInput, 'capacitorsF' | 'diode' | 'strayCapacitanceF'>,
): SecondaryLoad {
  const cells = input.capacitorsF.length;
  return {
    diodeCount: cells,
    diodeJunctionCapacitanceF: input.diode.junctionCapacitanceF ?? 0,
    swingingStrayCapacitanceF: Math.ceil(cells / 2) * (input.strayCapacitanceF ?? 0),
  };
}

/** The pulse drive of the ladder model for a LadderDrive behind the secondary winding resistance (Ω). */
export function pulseDriveOf(drive: LadderDrive, sourceResistanceOhm: number): PulseDrive {
  const duty = drive.dutyCycle ?? 0.5;
  // Flyback phasing turns the secondary over: the flyback is the pulse on the positive side, for the rest of the period.
  return drive.isFlybackFed
    ? {
        kind: 'pulse',
        forwardPeakV: drive.flybackPeakV,
        flybackPeakV: drive.forwardPeakV,
        frequencyHz: drive.frequencyHz,
        dutyCycle: 1 - duty,
        sourceResistanceOhm,
      }
    : {
        kind: 'pulse',
        forwardPeakV: drive.forwardPeakV,
        flybackPeakV: drive.flybackPeakV,
        frequencyHz: drive.frequencyHz,
        dutyCycle: duty,
        sourceResistanceOhm,
      };
}

/**
 * The engine's ladder (charge-transfer model, `analyzeLadder`'s steady state) as a load line: the actual
 * topology, cell count, per-capacitor values, diodes, stray capacitance, bleeder and series output resistor
 * of `input`; its drive is replaced by each call's, behind `input`'s drive source resistance, and its load by
 * the call's external current.
 */
export function engineLadderLoadLine(input: LadderInput): LadderLoadLine {
  const sourceOhm = input.drive.sourceResistanceOhm;
  const seriesOhm = input.seriesOutputResistanceOhm;
  // One prepared network each for the loaded and the bare ladder, redriven per call (prepared on first use,
  // so that a ladder error surfaces where the per-call preparation raised it).
  let loaded: PreparedLadder | null = null;
  let bare: PreparedLadder | null = null;
  let lastLoaded: CurrentWarmStart | null = null;
  const topAt = (drive: LadderDrive, ladderCurrentA: number) => {
    const pulse = pulseDriveOf(drive, sourceOhm);
    bare = bare
      ? withDriveTiming(bare, pulse)
      : prepareLadder({ ...input, load: null, bleederOhm: null, seriesOutputResistanceOhm: 0, drive: pulse });
    return terminalMeanAt(bare, ladderCurrentA);
  };
  let key: string | undefined;
  return {
    // The input but its load, which each call replaces (made on first use: the Sizer's load lines never ask).
    get key() {
      key ??= JSON.stringify({ ...input, load: null });
      return key;
    },
    network: { bleederOhm: input.bleederOhm, seriesOutputResistanceOhm: seriesOhm },
    secondaryLoad: secondaryLoadOf(input),
    at(drive, loadCurrentA) {
      const pulse = pulseDriveOf(drive, sourceOhm);
      loaded = loaded ? withDriveTiming(loaded, pulse) : prepareLadder({ ...input, load: null, drive: pulse });
      // Each solve starts from the last one's current (the driver's solves move the drive a little at a time).
      const solved = terminalMeanNear(loaded, loadCurrentA, lastLoaded);
      lastLoaded = solved.near;
      const outputV = solved.outputV;
      const topV = Math.max(0, outputV + loadCurrentA * seriesOhm);
      const bleederA = input.bleederOhm ? topV / input.bleederOhm : 0;
      return { outputV: Math.max(0, outputV), ladderCurrentA: loadCurrentA + bleederA };
    },
    chargeRatios(drive, ladderCurrentA) {
      // A flat-top drive's slopes in closed form (the solve is affine in the peaks at a fixed current).
      const pulse = pulseDriveOf(drive, sourceOhm);
      bare = bare
        ? withDriveTiming(bare, pulse)
        : prepareLadder({ ...input, load: null, bleederOhm: null, seriesOutputResistanceOhm: 0, drive: pulse });
      const slopes = peakSlopes(bare.workspace, ladderCurrentA);
      if (slopes) {
        // The pulse's forward peak is the H extreme of a positive ladder; flyback phasing swaps the pulses.
        const pulseForward = input.polarity === 1 ? slopes.high : slopes.low;
        const pulseFlyback = input.polarity === 1 ? slopes.low : slopes.high;
        return drive.isFlybackFed
          ? { flyback: pulseForward, forward: pulseFlyback }
          : { flyback: pulseFlyback, forward: pulseForward };
      }
      // Otherwise central differences, step 1e-4 of each peak: the model is smooth (log diode drops) and near linear in the peaks.
      const slope = (key: 'flybackPeakV' | 'forwardPeakV') => {
        const dv = Math.max(1e-4 * drive[key], 1e-6);
        return (
          (topAt({ ...drive, [key]: drive[key] + dv }, ladderCurrentA) -
            topAt({ ...drive, [key]: drive[key] - dv }, ladderCurrentA)) /
          (2 * dv)
        );
      };
      return { flyback: slope('flybackPeakV'), forward: slope('forwardPeakV') };
    },
  };
}

/**
 * Textbook load line of an n-stage half-wave cascade with equal capacitors C (F) driven by asymmetric pulses,
 * kept as a reference for tests: V0 = n·(V₊ + V₋) (REFERENCES.md §1, derived row for blocking-oscillator drive),
 * Zout = ΔV0/I = (2n³/3 + n²/2 − n/6)/(f·C) (read: J. Lux, "Cockcroft Walton Voltage Multipliers"; memory:
 * Kuffel, Zaengl & Kuffel §2.2.2), each pulse pushing n charges per output charge. Ideal diodes, no bleeder.
 */
export function halfWaveCascadeLoadLine(stages: number, capacitanceF: number): LadderLoadLine {
  if (!(Number.isInteger(stages) && stages >= 1))
    throw new DomainError('invalid_argument', 'stages must be a positive integer', 'stages');
  if (!(capacitanceF > 0)) throw new DomainError('invalid_argument', 'capacitance must be positive', 'capacitanceF');
  const n = stages;
  return {
    at: (d, loadCurrentA) => ({
      outputV: Math.max(
        0,
        n * (d.forwardPeakV + d.flybackPeakV) -
          (((2 * n ** 3) / 3 + n ** 2 / 2 - n / 6) / (d.frequencyHz * capacitanceF)) * loadCurrentA,
      ),
      ladderCurrentA: loadCurrentA,
    }),
    chargeRatios: () => ({ flyback: n, forward: n }),
  };
}
