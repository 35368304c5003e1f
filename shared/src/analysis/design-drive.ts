import { DomainError } from '../errors';
import type { Design, PulseDrive, SineDrive } from '../designs/design.types';
import type { DriverStage } from '../designs/driver-stage.types';
import { blockingOscillatorNumbers } from '../driver/blocking-oscillator';
import { driverReport, type DriverReport } from '../driver/driver-report';
import { engineLadderLoadLine, pulseDriveOf, secondaryLoadOf, type LadderLoadLine } from '../driver/ladder-load-line';
import { isFlybackFed, solveLoadPoint } from '../driver/operating-point';
import { forwardShareOf } from '../driver/ring-back';
import { analyzeLadder } from '../multiplier/analyze-ladder';
import { bracketedRoot } from '../multiplier/bracketed-root';
import type { LadderInput } from '../multiplier/ladder.types';
import { withEffectiveTransformer } from '../transformer/given-numbers';

/** Resolves the drive of a design into the waveform the ladder model takes. */
export function resolveDrive(givenDesign: Design): {
  drive: SineDrive | PulseDrive;
  deliverablePowerW: number | null;
  currentLimitA: number | null;
} {
  const design = withEffectiveTransformer(givenDesign);
  const drive = design.drive;
  if (drive.kind !== 'driver') return { drive, deliverablePowerW: null, currentLimitA: null };
  const stage = drive.driver;
  // The stage's numbers alone: the report's driver section gives the estimate with its method notes.
  const limit = underDrive(() =>
    blockingOscillatorNumbers(stage, {
      secondaryLoad: secondaryLoadOf({
        capacitorsF: design.multiplier.capacitors.map((c) => c.valueF),
        diode: design.multiplier.diode,
        ...(design.multiplier.strayCapacitanceF ? { strayCapacitanceF: design.multiplier.strayCapacitanceF } : {}),
      }),
    }),
  );
  return {
    drive: pulseDriveOf(
      {
        forwardPeakV: limit.forwardSecV,
        flybackPeakV: limit.flybackSecV,
        frequencyHz: limit.frequencyHz,
        dutyCycle: forwardShareOf(limit),
        isFlybackFed: isFlybackFed(stage),
      },
      drive.driver.transformer.secondaryResistanceOhm,
    ),
    deliverablePowerW: limit.deliverableW,
    // The flyback current the secondary can carry is the collector peak reflected through the turns ratio.
    currentLimitA:
      (limit.collectorPeakA * drive.driver.transformer.primaryTurns) / drive.driver.transformer.secondaryTurns,
  };
}

/** A driver-stage error names its field from the stage; in a design it sits under `drive.`. */
export function underDrive<T>(compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof DomainError && error.field?.startsWith('driver')) {
      throw new DomainError(error.code, error.message, `drive.${error.field}`);
    }
    throw error;
  }
}

/** External load current (A) of the design at the driver's operating point: a resistance load by Brent's method on V(I) = I·R. */
function ratedLoadCurrentOf(design: Design, driver: DriverStage, ladder: LadderLoadLine): number {
  const load = design.load;
  if (!load) return 0;
  if (load.kind === 'current') return load.currentA;
  const r = load.resistanceOhm;
  const excessV = (currentA: number) => solveLoadPoint(driver, ladder, currentA).outputV - currentA * r;
  const excessAtZero = excessV(0);
  const hi = excessAtZero / r;
  // To the resolution of 40 halvings: 1e-12 of the no-load current, well below any figure the report shows.
  return bracketedRoot(excessV, 0, hi, excessAtZero, excessV(hi), hi * 2 ** -40);
}

/** The bare-ladder input of a design. */
export function ladderInputOf(
  design: Design,
  drive: SineDrive | PulseDrive,
  currentLimitA: number | null = null,
): LadderInput {
  const bleeder = design.outputNetwork.bleeder;
  return {
    ...(currentLimitA !== null ? { sourceCurrentLimitA: currentLimitA } : {}),
    ...(design.multiplier.strayCapacitanceF ? { strayCapacitanceF: design.multiplier.strayCapacitanceF } : {}),
    topology: design.multiplier.topology,
    capacitorsF: design.multiplier.capacitors.map((c) => c.valueF),
    drive,
    diode: design.multiplier.diode,
    polarity: design.targets.outputV < 0 ? -1 : 1,
    load: design.load,
    bleederOhm: bleeder ? bleeder.count * bleeder.valueOhm : null,
    seriesOutputResistanceOhm: design.outputNetwork.seriesOutputResistanceOhm,
  };
}

/** A design's drive resolved at its rated load: the ladder input the headline figures are computed from. */
export interface RatedPoint {
  /** The design with its transformer numbers taken from the section when it is designed. */
  design: Design;
  /** The secondary at the driver's limit (or the design's own sine or pulse drive). */
  limitDrive: SineDrive | PulseDrive;
  /** The ladder at `limitDrive` and the design's load; the other drives' inputs differ from it in the drive alone. */
  limitInput: LadderInput;
  deliverablePowerW: number | null;
  currentLimitA: number | null;
  /** The secondary at the rated load's operating point. */
  drive: SineDrive | PulseDrive;
  driver: DriverReport | null;
  /** The ladder at the rated load (at the largest load it holds when the load is beyond the supply). */
  input: LadderInput;
}

/** The drive of a design resolved at its rated load: the driver's operating point joined to the ladder. */
export function ratedPoint(givenDesign: Design): RatedPoint {
  const design = withEffectiveTransformer(givenDesign);
  if (design.multiplier.strayCapacitanceF !== undefined && !(design.multiplier.strayCapacitanceF >= 0)) {
    throw new DomainError('invalid_design', 'stray capacitance must not be negative', 'multiplier.strayCapacitanceF');
  }
  const { drive: limitDrive, deliverablePowerW, currentLimitA } = resolveDrive(design);
  let drive = limitDrive;
  let driver: DriverReport | null = null;
  const limitInput = ladderInputOf(design, limitDrive, currentLimitA);
  if (design.drive.kind === 'driver') {
    const stage = design.drive.driver;
    const ladder = engineLadderLoadLine(limitInput);
    driver = underDrive(() => driverReport(stage, ladder, ratedLoadCurrentOf(design, stage, ladder)));
    const rated = driver.operatingPoint.ratedLoad;
    drive = pulseDriveOf(
      {
        forwardPeakV: rated.forwardSecondaryPeakV,
        flybackPeakV: rated.flybackSecondaryPeakV,
        frequencyHz: rated.frequencyHz,
        dutyCycle: rated.dutyCycle,
        isFlybackFed: isFlybackFed(stage),
      },
      stage.transformer.secondaryResistanceOhm,
    );
  }
  const capacity = driver?.loadCapacity;
  // A load beyond what the supply delivers: the ladder at the largest load it holds (its output there near zero).
  const input = capacity?.isLoadBeyond
    ? { ...limitInput, drive, load: { kind: 'current' as const, currentA: capacity.maxLoadCurrentA } }
    : { ...limitInput, drive };
  return { design, limitDrive, limitInput, deliverablePowerW, currentLimitA, drive, driver, input };
}

/**
 * The driver report and the ladder's mean output at the rated load: what `analyzeDesign` reports as `driver`
 * and `outputMeanV`, without its curves, stress, discharge and Checks.
 */
export function driverAtRatedLoad(design: Design): { outputMeanV: number; driver: DriverReport | null } {
  const point = ratedPoint(design);
  return { outputMeanV: analyzeLadder(point.input).outputMeanV, driver: point.driver };
}
