import {
  MU0,
  demoCoreKinds,
  demoTapeKinds,
  demoWireKinds,
  sizeTransformer,
  type CoreKind,
} from '../../src/transformer';

/** Bsat(100 °C) of the books' ferrite (Pressman et al., 3rd ed., Fig. 7.22: about 0.35 T, median ferrite). */
export const BOOK_FERRITE_BSAT_T = 0.35;

/**
 * A ferrite core from a book's table, in the book's centimetres: Ae, winding window, magnetic path and mean turn.
 * Its own permeability is taken as 2000 (a gapped core's inductance hardly depends on it); the rest is the
 * first demo core's.
 */
export function bookCore(table: { aeCm2: number; windowCm2: number; pathCm: number; mltCm?: number }): CoreKind {
  const base = demoCoreKinds[0]!;
  return {
    ...base,
    effectiveAreaM2: table.aeCm2 * 1e-4,
    windowAreaM2: table.windowCm2 * 1e-4,
    pathLengthM: table.pathCm * 1e-2,
    meanTurnLengthM: table.mltCm !== undefined ? table.mltCm * 1e-2 : base.meanTurnLengthM,
    ungappedAlHPerTurn2: (MU0 * 2000 * table.aeCm2 * 1e-4) / (table.pathCm * 1e-2),
    saturationFluxDensity100T: BOOK_FERRITE_BSAT_T,
  };
}

/**
 * The transformer Sizer's primary and secondary turns on each core for an inductance and peak current held to
 * `maxFluxT` (the margin below the books' Bsat that leaves it). Wires and tapes are the demo's: the checks that
 * use this read the turns only.
 */
export function sizerTurns(
  cores: readonly CoreKind[],
  figures: {
    inductanceH: number;
    peakCurrentA: number;
    maxFluxT: number;
    turnsRatio: number;
    frequencyHz: number;
    dutyOnFraction: number;
  },
): { primaryTurns: number; secondaryTurns: number }[] {
  const candidates = sizeTransformer(
    cores,
    {
      primaryInductanceH: figures.inductanceH,
      primaryPeakCurrentA: figures.peakCurrentA,
      turnsRatio: figures.turnsRatio,
      feedbackRatio: 0.05,
      frequencyHz: figures.frequencyHz,
      dutyOnFraction: figures.dutyOnFraction,
      primaryWire: demoWireKinds[2]!,
      feedbackWire: demoWireKinds[2]!,
      secondaryWire: demoWireKinds[2]!,
      windingTape: demoTapeKinds[1]!,
      windingTapeWraps: 1,
      secondaryPeakV: 30,
      minSaturationMarginPct: (1 - figures.maxFluxT / BOOK_FERRITE_BSAT_T) * 100,
    },
    { pollutionDegree: 2, materialGroup: 'IIIa', pcb: false },
  );
  return cores.map((core) => {
    const candidate = candidates.find((c) => c.core === core)!;
    return { primaryTurns: candidate.primaryTurns, secondaryTurns: candidate.secondaryTurns };
  });
}
