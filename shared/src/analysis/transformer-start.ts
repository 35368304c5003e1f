import type { Design } from '../designs/design.types';
import { formatQuantity } from '../units/format-quantity';
import { sizeTransformer } from '../transformer/size-transformer';
import type {
  CoreKind,
  TapeKind,
  TransformerSection,
  TransformerSizerCandidate,
  WireKind,
} from '../transformer/transformer.types';
import { analyzeDesign } from './analyze-design';
import { checksWorsenedBySection, type WorsenedCheck } from './section-on-design';
import { withGivenTransformer } from './transformer-report';
import { driverSizerFigures } from './transformer-sizer-inputs';

/** Current density (A/m²) the first primary wire is chosen for: 4 A/mm² (common practice, no source). */
const MAX_PRIMARY_CURRENT_DENSITY = 4e6;

/** The kinds a first section may be built from (the Parts shelf's, or the demo kinds on an empty shelf). */
export interface MagneticsKinds {
  cores: readonly CoreKind[];
  wires: readonly WireKind[];
  tapes: readonly TapeKind[];
}

/** The first designed transformer of a driver stage and why its core was taken. */
export interface StartingTransformer {
  section: TransformerSection;
  /** The Sizer's row of the chosen core. */
  candidate: TransformerSizerCandidate;
  /** How many cores fitted the driver, of how many offered. */
  fittingCores: number;
  offeredCores: number;
  /** The design's other Checks the section leaves worse than the given numbers (empty: none). */
  worsened: WorsenedCheck[];
  /** Why this core, in words, for the person who switched. */
  reason: string;
}

/**
 * The first transformer section of a design's driver when it switches to a designed transformer: the transformer
 * Sizer's best-ranked core (`sizeTransformer`) for the driver on its given numbers (`driverSizerFigures`: the
 * primary inductance, magnetizing peak and turns ratios it runs on), with the gap that gives that inductance; on
 * the primary and the feedback the thinnest wire that carries the primary's rms current at 4 A/mm² (the
 * thickest if none does), on the secondary the thinnest; the thinnest tape between layers and the thickest
 * (three wraps) between windings. Among the fitting cores, in the Sizer's
 * order (loss, then size), the first whose section leaves none of the design's other Checks failing where the
 * given numbers do not is taken (`checksWorsenedBySection`: one engine run per core tried); if every fitting core
 * does, the best-ranked. The given inductance and turns ratios are so kept; the turns are the fewest the core's
 * flux margin and shortest gap allow. Null without a driver stage, or when no core fits (the caller then starts
 * from the given turns).
 */
export function startingTransformer(design: Design, kinds: MagneticsKinds): StartingTransformer | null {
  if (design.drive.kind !== 'driver') return null;
  const onGiven = withGivenTransformer(design);
  const givenReport = analyzeDesign(onGiven);
  const figures = driverSizerFigures(onGiven, givenReport);
  const byDiameter = [...kinds.wires].sort((a, b) => a.copperDiameterM - b.copperDiameterM);
  const byThickness = [...kinds.tapes].sort((a, b) => a.thicknessM - b.thicknessM);
  const [thinnest, thickest] = [byDiameter[0], byDiameter[byDiameter.length - 1]];
  const [thinTape, thickTape] = [byThickness[0], byThickness[byThickness.length - 1]];
  if (!figures || !thinnest || !thickest || !thinTape || !thickTape) return null;
  // The primary's ramp, 0 to the peak over the on-time: rms Ipk·√(D/3).
  const primaryRmsA = figures.primaryPeakCurrentA * Math.sqrt(figures.dutyOnFraction / 3);
  const primaryWire =
    byDiameter.find((w) => primaryRmsA / ((Math.PI / 4) * w.copperDiameterM ** 2) <= MAX_PRIMARY_CURRENT_DENSITY) ??
    thickest;
  const ranked = sizeTransformer(
    kinds.cores,
    {
      ...figures,
      primaryWire,
      feedbackWire: primaryWire,
      secondaryWire: thinnest,
      windingTape: thickTape,
      windingTapeWraps: 3,
      layerTape: thinTape,
    },
    design.targets.spacing,
  );
  const fitting = ranked.filter((c) => c.refusal === null && c.section !== null);
  let chosen: { candidate: TransformerSizerCandidate; worsened: WorsenedCheck[] } | null = null;
  for (const candidate of fitting) {
    const worsened = checksWorsenedBySection(design, startedSection(candidate.section!), givenReport);
    chosen ??= { candidate, worsened };
    if (!worsened.some((w) => w.verdict === 'fail')) {
      chosen = { candidate, worsened };
      break;
    }
  }
  if (!chosen) return null;
  const { candidate, worsened } = chosen;
  return {
    section: startedSection(candidate.section!),
    candidate,
    fittingCores: fitting.length,
    offeredCores: kinds.cores.length,
    worsened,
    reason: startingReason(candidate, figures, fitting.length, kinds.cores.length, worsened),
  };
}

/** A Sizer's section as a first section: with the customary ±10 % on the primary inductance. */
function startedSection(section: TransformerSection): TransformerSection {
  return { ...section, inductanceTolerance: 0.1 };
}

/** A design Check id in words: "driver.base-drive" → "base drive", "driver-power" → "driver power". */
const checkInWords = (id: string) => id.replace(/^driver\./, '').replace(/[-.]/g, ' ');

function startingReason(
  candidate: TransformerSizerCandidate,
  figures: NonNullable<ReturnType<typeof driverSizerFigures>>,
  fitting: number,
  offered: number,
  worsened: readonly WorsenedCheck[],
): string {
  const ratio = (value: number) => Number(value.toPrecision(3)).toString();
  const rank =
    fitting === 1
      ? `the only core of ${offered} that fits`
      : `the lowest-loss core of the ${fitting} of ${offered} that fit`;
  const worse = worsened.filter((w) => w.verdict === 'fail').map((w) => checkInWords(w.id));
  const worseWords =
    worse.length > 1 ? `${worse.slice(0, -1).join(', ')} and ${worse.at(-1)} Checks` : `${worse[0]} Check`;
  return [
    `${candidate.core.code} is ${rank} the driver’s ${formatQuantity(figures.primaryInductanceH, 'H')}, ` +
      `${formatQuantity(figures.primaryPeakCurrentA, 'A')} magnetizing peak and turns ratios 1 : ` +
      `${ratio(figures.feedbackRatio)} : ${ratio(figures.turnsRatio)}.`,
    `Windings ${candidate.primaryTurns} : ${candidate.feedbackTurns} : ${candidate.secondaryTurns} turns, gap ` +
      `${(candidate.gap.gapM * 1e3).toFixed(3)} mm for that inductance, peak flux ` +
      `${Math.round(candidate.peakFluxDensityT * 1e3)} mT (${Math.round(candidate.saturationMarginPct)} % below ` +
      `saturation at 100 °C).`,
    worse.length > 0
      ? `Its windings leave the design’s ${worseWords} failing where the given numbers pass, as every fitting ` +
        `core’s do; the core Sizer on the Transformer tab ranks them all.`
      : '',
  ]
    .filter(Boolean)
    .join(' ');
}
