import type { SpacingEnvironment } from '../designs/design.types';
import { DomainError } from '../errors';
import { creepageColumn, requiredCreepageMm } from '../safety/creepage';
import { SAFETY_MARGINAL_BELOW_PCT } from '../safety/hazard-limits';
import { analyzeTransformer } from './analyze-transformer';
import { MIN_MANUFACTURABLE_GAP_M, alFromGap, gapFromAl, gapManufacturable } from './gap';
import { pulseOperatingPoint } from './operating-point';
import type {
  CoreKind,
  TransformerSection,
  TransformerSizerCandidate,
  TransformerSizerRequest,
} from './transformer.types';

const DEFAULT_MIN_SATURATION_MARGIN_PCT = 20;

/**
 * Fewest primary turns on `core` that keep the flux margin and need no more AL than the core has with the
 * shortest gap that can be made (`MIN_MANUFACTURABLE_GAP_M`): more turns only lower the AL asked, so the gap
 * for the inductance comes out at least that long. An energy-storing core is always gapped, never left to the
 * ungapped AL's wide tolerance.
 */
function primaryTurnsFor(core: CoreKind, request: TransformerSizerRequest): number {
  const margin = (request.minSaturationMarginPct ?? DEFAULT_MIN_SATURATION_MARGIN_PCT) / 100;
  const maxFluxT = (1 - margin) * core.saturationFluxDensity100T;
  const forFlux = (request.primaryInductanceH * request.primaryPeakCurrentA) / (maxFluxT * core.effectiveAreaM2);
  const forGap = Math.sqrt(request.primaryInductanceH / alFromGap(core, MIN_MANUFACTURABLE_GAP_M));
  return Math.max(1, Math.ceil(Math.max(forFlux, forGap) - 1e-9));
}

/**
 * End margin on each side of the bobbin (m) whose two margins give the flange creepage IEC 60664-1 asks at the
 * secondary's peak with the pass margin of the creepage Check, rounded up to 0.1 mm.
 */
export function endMarginForCreepageM(secondaryPeakV: number, spacing: SpacingEnvironment): number {
  const workingV = Math.max(1, secondaryPeakV);
  const requiredMm = requiredCreepageMm(workingV, creepageColumn({ ...spacing, pcb: false }, workingV));
  // 5 % more for the working voltage the applied section itself sets (its own couplings and resistances).
  const perSideMm = (requiredMm * (1 + SAFETY_MARGINAL_BELOW_PCT / 100) * 1.05) / 2;
  return Math.ceil(perSideMm * 10 - 1e-9) / 1e4;
}

function sectionFor(
  core: CoreKind,
  primaryTurns: number,
  request: TransformerSizerRequest,
  spacing: SpacingEnvironment,
): TransformerSection {
  const turns = (ratio: number) => Math.max(1, Math.round(primaryTurns * ratio));
  return {
    core,
    gap: { kind: 'primary-inductance', primaryInductanceH: request.primaryInductanceH },
    windings: [
      { role: 'primary', turns: primaryTurns, wire: request.primaryWire, startPin: 1, endPin: 2 },
      { role: 'feedback', turns: turns(request.feedbackRatio), wire: request.feedbackWire, startPin: 3, endPin: 4 },
      {
        role: 'secondary',
        turns: turns(request.turnsRatio),
        wire: request.secondaryWire,
        ...(request.layerTape ? { layerTapeWraps: 1 } : {}),
        startPin: 5,
        endPin: 6,
      },
    ],
    ...(request.layerTape ? { layerTape: request.layerTape } : {}),
    windingTape: request.windingTape,
    windingTapeWraps: request.windingTapeWraps,
    endMarginM: endMarginForCreepageM(request.secondaryPeakV, spacing),
  };
}

/**
 * Transformer Sizer: for each core, the fewest primary turns that keep the peak flux at the driver's peak
 * primary current below Bsat(100 °C) by the margin asked and give a gap no shorter than can be made,
 * the other windings in the driver's turns ratios, the gap for the required primary inductance; then the
 * section's losses, fills and Checks at the driver's operating point, with end margins wide enough for the
 * flange creepage at the secondary's peak (`endMarginForCreepageM`). Cores that fit (no failing Check,
 * gap shorter than the bobbin) come first, ranked by total loss, then by core volume; refused cores follow
 * with their reason.
 */
export function sizeTransformer(
  cores: readonly CoreKind[],
  request: TransformerSizerRequest,
  spacing: SpacingEnvironment,
  ambientTemperatureC = 25,
): TransformerSizerCandidate[] {
  if (!(request.primaryInductanceH > 0 && request.primaryPeakCurrentA > 0 && request.frequencyHz > 0)) {
    throw new DomainError('invalid_argument', 'inductance, peak current and frequency must be positive', 'request');
  }
  const periodS = 1 / request.frequencyHz;
  const onTimeS = request.dutyOnFraction * periodS;
  const candidates = cores.map((core): TransformerSizerCandidate => {
    const primaryTurns = primaryTurnsFor(core, request);
    const refused = (refusal: string): TransformerSizerCandidate => ({
      core,
      gap: { gapM: 0, alHPerTurn2: core.ungappedAlHPerTurn2, fringingFactor: 1 },
      primaryTurns,
      secondaryTurns: Math.round(primaryTurns * request.turnsRatio),
      feedbackTurns: Math.round(primaryTurns * request.feedbackRatio),
      peakFluxDensityT: 0,
      saturationMarginPct: 0,
      coreLossW: 0,
      copperLossW: 0,
      windowFill: 0,
      temperatureRiseC: 0,
      section: null,
      refusal,
    });
    try {
      const gapM = gapFromAl(core, request.primaryInductanceH / primaryTurns ** 2);
      // Cannot happen with the turns above; kept so that no candidate ever carries a gap that cannot be made.
      if (!gapManufacturable(gapM) || gapM === 0) return refused('the gap for the inductance is too short to make');
    } catch {
      return refused('the gap for the inductance is longer than the bobbin breadth');
    }
    const section = sectionFor(core, primaryTurns, request, spacing);
    const turnsOf = (role: string) => section.windings.find((w) => w.role === role)?.turns ?? 1;
    const primary = { turns: turnsOf('primary') };
    const feedback = { turns: turnsOf('feedback') };
    const secondary = { turns: turnsOf('secondary') };
    const point = pulseOperatingPoint({
      frequencyHz: request.frequencyHz,
      onTimeS,
      flybackTimeS: periodS - onTimeS,
      primaryPeakCurrentA: request.primaryPeakCurrentA,
      baseCurrentA: 0,
      primaryOnVoltageV: (request.primaryInductanceH * request.primaryPeakCurrentA) / onTimeS,
      forwardSecondaryPeakV: 0,
      flybackSecondaryPeakV: request.secondaryPeakV,
      primaryTurns: primary.turns,
      feedbackTurns: feedback.turns,
      secondaryTurns: secondary.turns,
      ambientTemperatureC,
    });
    const report = analyzeTransformer(section, point, spacing);
    const failing = report.checks.filter((c) => c.verdict === 'fail');
    return {
      core,
      gap: report.gap,
      primaryTurns: primary.turns,
      feedbackTurns: feedback.turns,
      secondaryTurns: secondary.turns,
      peakFluxDensityT: report.peakFluxDensityT,
      saturationMarginPct: report.saturationMarginPct,
      coreLossW: report.coreLossW,
      copperLossW: report.copperLossW,
      windowFill: report.windowFill,
      temperatureRiseC: report.temperatureRiseC,
      section,
      refusal: failing.length > 0 ? `fails ${failing.map((c) => c.id).join(', ')}` : null,
    };
  });
  const loss = (c: TransformerSizerCandidate) => c.coreLossW + c.copperLossW;
  return candidates.sort(
    (a, b) =>
      Number(a.refusal !== null) - Number(b.refusal !== null) || loss(a) - loss(b) || a.core.volumeM3 - b.core.volumeM3,
  );
}
