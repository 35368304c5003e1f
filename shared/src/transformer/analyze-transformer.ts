import type { SpacingEnvironment } from '../designs/design.types';
import { DomainError } from '../errors';
import { HIPOT_METHOD, hipotTestVoltageV } from '../safety/hipot';
import { CORE_LOSS_METHOD, igseLossDensity } from './core-loss';
import {
  COPPER_LOSS_HARMONICS,
  COPPER_LOSS_METHOD,
  dcResistanceOhm,
  harmonics,
  windingCopperLoss,
} from './copper-loss';
import { FLUX_METHOD, fluxDensityT, saturationCurrentA, saturationMarginPct } from './flux';
import { GAP_METHOD, resolveGap, saturatedInductanceH } from './gap';
import { LAYER_VOLTAGE_METHOD, layerInsulationV, layerVoltages, tapeBreakdownV } from './insulation';
import { LEAKAGE_METHOD, couplingFromLeakage, leakageInductanceH } from './leakage';
import { TEMPERATURE_RISE_METHOD, temperatureRiseC, woundSurfaceAreaM2 } from './temperature';
import { transformerChecks } from './transformer-checks';
import type {
  TransformerOperatingPoint,
  TransformerReport,
  TransformerSection,
  WindingResult,
  WindingRole,
} from './transformer.types';
import { SELF_CAPACITANCE_METHOD, layerCapacitanceF, multilayerCapacitanceF } from './winding-capacitance';
import { LAYOUT_METHOD, layoutSection, type SectionLayout, type WindingLayout } from './winding-layout';

const SECTION_PATH = 'drive.driver.transformerDesign';

/** The layout of the winding of a role; the section's validation guarantees each role once. */
export function windingOf(layout: SectionLayout, role: WindingRole): WindingLayout {
  const found = layout.windings.find((w) => w.winding.role === role);
  if (!found)
    throw new DomainError('invalid_design', `the transformer has no ${role} winding`, `${SECTION_PATH}.windings`);
  return found;
}

/** Magnetic and electrical figures that do not depend on the operating point. */
export function transformerCircuitFigures(section: TransformerSection) {
  const layout = layoutSection(section);
  const primary = windingOf(layout, 'primary');
  const gap = resolveGap(section.core, section.gap, primary.winding.turns);
  const inductanceOf = (w: WindingLayout) => gap.alHPerTurn2 * w.winding.turns ** 2;
  const leakage = (a: WindingLayout, b: WindingLayout) => {
    const [inner, outer] = a.innerRadiusOffsetM <= b.innerRadiusOffsetM ? [a, b] : [b, a];
    return leakageInductanceH({
      turns: a.winding.turns,
      meanTurnLengthM: (inner.meanTurnLengthM + outer.meanTurnLengthM) / 2,
      breadthM: Math.max(layout.usableBreadthM, 1e-6),
      innerBuildM: inner.buildM,
      outerBuildM: outer.buildM,
      separationM: outer.innerRadiusOffsetM - (inner.innerRadiusOffsetM + inner.buildM),
    });
  };
  const feedback = windingOf(layout, 'feedback');
  const secondary = windingOf(layout, 'secondary');
  const leakagePrimarySecondaryH = leakage(primary, secondary);
  const couplings = {
    primaryFeedback: couplingFromLeakage(leakage(primary, feedback), inductanceOf(primary)),
    primarySecondary: couplingFromLeakage(leakagePrimarySecondaryH, inductanceOf(primary)),
    feedbackSecondary: couplingFromLeakage(leakage(feedback, secondary), inductanceOf(feedback)),
  };
  const layerTapeM = (w: WindingLayout) => (w.winding.layerTapeWraps ?? 0) * (section.layerTape?.thicknessM ?? 0);
  const layerC = layerCapacitanceF({
    meanTurnLengthM: secondary.meanTurnLengthM,
    breadthM: Math.min(layout.usableBreadthM, secondary.turnsPerLayer * secondary.winding.wire.overallDiameterM),
    copperDiameterM: secondary.winding.wire.copperDiameterM,
    overallDiameterM: secondary.winding.wire.overallDiameterM,
    tapeM: layerTapeM(secondary),
  });
  const saturationT = section.core.saturationFluxDensity100T;
  const primaryInductanceH = inductanceOf(primary);
  return {
    layout,
    gap,
    primaryInductanceH,
    inductanceOf,
    couplings,
    leakagePrimarySecondaryH,
    secondaryCapacitanceF: multilayerCapacitanceF(layerC, secondary.layers),
    saturationFluxDensityT: saturationT,
    saturationCurrentA: saturationCurrentA(
      saturationT,
      primaryInductanceH,
      primary.winding.turns,
      section.core.effectiveAreaM2,
    ),
    saturatedInductanceH: saturatedInductanceH(section.core, gap, primary.winding.turns),
    dcResistanceOf: (w: WindingLayout, temperatureC = 20) =>
      dcResistanceOhm(w.winding.turns, w.meanTurnLengthM, w.winding.wire.copperDiameterM, temperatureC),
    layerTapeM,
  };
}

/**
 * Everything the engine says of a transformer section at an operating point: gap and inductances, peak flux
 * and its margin to saturation at 100 °C, core loss (iGSE), copper loss (Dowell), fills and layers, layer
 * voltages, leakage and couplings, the secondary's self-capacitance, hipot voltage, temperature rise and
 * the Checks. SI units; methods and sources in `methods`.
 */
export function analyzeTransformer(
  section: TransformerSection,
  point: TransformerOperatingPoint,
  spacing: SpacingEnvironment,
): TransformerReport {
  const figures = transformerCircuitFigures(section);
  const { layout, gap, primaryInductanceH } = figures;
  const core = section.core;
  const primaryTurns = windingOf(layout, 'primary').winding.turns;
  const toFlux = (currentA: number) => fluxDensityT(primaryInductanceH, currentA, primaryTurns, core.effectiveAreaM2);
  const fluxT = point.magnetizingCurrentA.map((p) => ({ timeS: p.timeS, value: toFlux(p.value) }));
  const fluxValues = fluxT.map((p) => p.value);
  const peakFluxDensityT = Math.max(...fluxValues.map(Math.abs));
  const coreLossW =
    igseLossDensity(fluxT, { k: core.steinmetzK, alpha: core.steinmetzAlpha, beta: core.steinmetzBeta }) *
    core.volumeM3;
  const surfaceM2 = core.surfaceAreaM2 ?? woundSurfaceAreaM2(core.windowAreaM2, core.effectiveAreaM2);
  // The currents' harmonics once per winding: the copper loss is taken at two temperatures below.
  const spectra = new Map(
    layout.windings.map((w) => [
      w.winding.role,
      harmonics(point.windingCurrentsA[w.winding.role], COPPER_LOSS_HARMONICS),
    ]),
  );
  // Copper loss at the winding temperature: first at ambient, then once more at ambient + the rise it gives.
  const windingsAt = (temperatureC: number): WindingResult[] =>
    layout.windings.map((w) => {
      const role = w.winding.role;
      const copper = windingCopperLoss({
        currentA: point.windingCurrentsA[role],
        frequencyHz: point.frequencyHz,
        dcResistanceOhm: figures.dcResistanceOf(w, temperatureC),
        copperDiameterM: w.winding.wire.copperDiameterM,
        pitchM: w.winding.wire.overallDiameterM,
        layers: w.layers,
        temperatureC,
        spectrum: spectra.get(role),
      });
      const voltages = layerVoltages(point.windingPeakVoltagesV[role], w.winding.turns, w.turnsPerLayer, w.layers);
      return {
        role,
        name: w.winding.name ?? role,
        turns: w.winding.turns,
        inductanceH: figures.inductanceOf(w),
        turnsPerLayer: w.turnsPerLayer,
        layers: w.layers,
        buildM: w.buildM,
        meanTurnLengthM: w.meanTurnLengthM,
        dcResistanceOhm: figures.dcResistanceOf(w),
        acResistanceFactor: copper.acResistanceFactor,
        rmsCurrentA: copper.rmsCurrentA,
        copperLossW: copper.lossW,
        ...voltages,
        layerInsulationV: layerInsulationV(w.winding.wire, section.layerTape, w.winding.layerTapeWraps ?? 0),
      };
    });
  const totalCopperW = (list: readonly WindingResult[]) => list.reduce((sum, w) => sum + w.copperLossW, 0);
  const firstRise = temperatureRiseC(coreLossW + totalCopperW(windingsAt(point.ambientTemperatureC)), surfaceM2);
  const windings = windingsAt(point.ambientTemperatureC + firstRise);
  const copperLossW = totalCopperW(windings);
  const rise = temperatureRiseC(coreLossW + copperLossW, surfaceM2);
  const hipotV = hipotTestVoltageV(point.secondaryWorkingVoltageV);
  const windingInsulationV = tapeBreakdownV(section.windingTape, section.windingTapeWraps);
  const flangeCreepageM = section.flangeCreepageM ?? 2 * (section.endMarginM ?? 0);
  const checks = transformerChecks(
    {
      peakFluxDensityT,
      saturationFluxDensityT: figures.saturationFluxDensityT,
      temperatureRiseC: rise,
      ambientTemperatureC: point.ambientTemperatureC,
      windowFill: layout.windowFill,
      buildFill: layout.buildFill,
      windings,
      hipotTestVoltageV: hipotV,
      windingInsulationV,
      secondaryWorkingVoltageV: point.secondaryWorkingVoltageV,
      flangeCreepageM,
      gapM: gap.gapM,
      ...(section.gap.kind === 'gap'
        ? {}
        : {
            inductanceTarget: {
              targetH:
                section.gap.kind === 'al'
                  ? section.gap.alHPerTurn2 * primaryTurns ** 2
                  : section.gap.primaryInductanceH,
              reachedH: primaryInductanceH,
            },
          }),
    },
    spacing,
  );
  return {
    gap,
    windings,
    primaryInductanceH,
    couplings: figures.couplings,
    leakagePrimarySecondaryH: figures.leakagePrimarySecondaryH,
    peakFluxDensityT,
    fluxSwingT: Math.max(...fluxValues) - Math.min(...fluxValues),
    saturationFluxDensityT: figures.saturationFluxDensityT,
    saturationMarginPct: saturationMarginPct(peakFluxDensityT, figures.saturationFluxDensityT),
    saturationCurrentA: figures.saturationCurrentA,
    saturatedInductanceH: figures.saturatedInductanceH,
    coreLossW,
    copperLossW,
    temperatureRiseC: rise,
    windowFill: layout.windowFill,
    buildFill: layout.buildFill,
    secondaryCapacitanceF: figures.secondaryCapacitanceF,
    hipotTestVoltageV: hipotV,
    windingInsulationV,
    flangeCreepageM,
    requiredCreepageM: (checks.find((c) => c.id === 'transformer.flange-creepage')?.limit ?? 0) / 1000,
    checks,
    methods: {
      gap: GAP_METHOD,
      peakFluxDensity: FLUX_METHOD,
      coreLoss: CORE_LOSS_METHOD,
      copperLoss: COPPER_LOSS_METHOD,
      layout: LAYOUT_METHOD,
      layerVoltage: LAYER_VOLTAGE_METHOD,
      leakage: LEAKAGE_METHOD,
      secondaryCapacitance: SELF_CAPACITANCE_METHOD,
      temperatureRise: TEMPERATURE_RISE_METHOD,
      hipot: HIPOT_METHOD,
    },
  };
}
