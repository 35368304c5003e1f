export type {
  CoreKind,
  WireKind,
  TapeKind,
  WindingRole,
  TransformerWinding,
  TransformerGap,
  TransformerSection,
  TransformerChoice,
  WaveformPoint,
  TransformerOperatingPoint,
  GapResult,
  WindingResult,
  TransformerReport,
  TransformerDriverEffect,
  DerivedTransformerNumbers,
  TransformerSizerCandidate,
  TransformerSizerRequest,
} from './transformer.types';
export {
  coreKindSchema,
  wireKindSchema,
  tapeKindSchema,
  transformerSectionSchema,
  transformerWindingSchema,
  transformerGapSchema,
} from '../designs/transformer-section.schema';
export {
  MU0,
  MIN_MANUFACTURABLE_GAP_M,
  gapManufacturable,
  fringingFactor,
  alFromGap,
  gapFromAl,
  resolveGap,
  saturatedInductanceH,
  GAP_METHOD,
} from './gap';
export { fluxDensityT, saturationFluxDensityAtT, saturationMarginPct, saturationCurrentA, FLUX_METHOD } from './flux';
export { igseCoefficient, igseLossDensity, steinmetzLossDensity, CORE_LOSS_METHOD } from './core-loss';
export {
  COPPER_RESISTIVITY_20C,
  COPPER_TEMPERATURE_COEFFICIENT,
  copperResistivity,
  dcResistanceOhm,
  skinDepthM,
  dowellFactor,
  roundWireDelta,
  harmonics,
  rmsOf,
  windingCopperLoss,
  COPPER_LOSS_METHOD,
} from './copper-loss';
export { layoutSection, WINDOW_UTILIZATION_LIMIT, LAYOUT_METHOD } from './winding-layout';
export type { SectionLayout, WindingLayout } from './winding-layout';
export { layerVoltages, tapeBreakdownV, layerInsulationV, LAYER_VOLTAGE_METHOD } from './insulation';
export { leakageInductanceH, couplingFromLeakage, LEAKAGE_METHOD } from './leakage';
export { EPSILON0, layerCapacitanceF, multilayerCapacitanceF, SELF_CAPACITANCE_METHOD } from './winding-capacitance';
export { temperatureRiseC, woundSurfaceAreaM2, SURFACE_AREA_KT, TEMPERATURE_RISE_METHOD } from './temperature';
export { areaProductM4, coreGeometryM5 } from './core-size';
export { transformerChecks, CORE_TEMPERATURE_LIMIT_C } from './transformer-checks';
export { pulseOperatingPoint } from './operating-point';
export type { PulseStageFigures } from './operating-point';
export { analyzeTransformer, transformerCircuitFigures } from './analyze-transformer';
export { derivedTransformerNumbers, effectiveDriverStage, withEffectiveTransformer } from './given-numbers';
export { demoCoreKinds, demoWireKinds, demoTapeKinds, demoTransformerSection } from './demo-kinds';
export { sizeTransformer, endMarginForCreepageM } from './size-transformer';
