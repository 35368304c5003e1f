import type { Design } from '../designs/design.types';
import type { DriverStage, DriverTransformer } from '../designs/driver-stage.types';
import { transformerCircuitFigures, windingOf } from './analyze-transformer';
import type { DerivedTransformerNumbers, TransformerSection } from './transformer.types';

/**
 * The numbers a "given transformer" states, derived from a transformer section: turns, primary inductance
 * (AL with fringing), couplings from the geometric leakage, DC winding resistances at 20 °C, the saturation
 * current at Bsat(100 °C) and the saturated inductance of the gap alone, the secondary's self-capacitance.
 */
export function derivedTransformerNumbers(section: TransformerSection): DerivedTransformerNumbers {
  const figures = transformerCircuitFigures(section);
  const primary = windingOf(figures.layout, 'primary');
  const feedback = windingOf(figures.layout, 'feedback');
  const secondary = windingOf(figures.layout, 'secondary');
  return {
    primaryTurns: primary.winding.turns,
    feedbackTurns: feedback.winding.turns,
    secondaryTurns: secondary.winding.turns,
    primaryInductanceH: figures.primaryInductanceH,
    couplingCoefficient: figures.couplings.primarySecondary,
    windingCouplings: figures.couplings,
    primaryResistanceOhm: figures.dcResistanceOf(primary),
    feedbackResistanceOhm: figures.dcResistanceOf(feedback),
    secondaryResistanceOhm: figures.dcResistanceOf(secondary),
    saturationCurrentA: figures.saturationCurrentA,
    saturatedInductanceH: figures.saturatedInductanceH,
    secondaryCapacitanceF: figures.secondaryCapacitanceF,
  };
}

/**
 * The driver stage as the engine reads it: unchanged with a given transformer (the default), and with
 * `transformerChoice: 'designed'` its `transformer` numbers replaced by those derived from the section
 * (phasing, insulation rating and core loss stay the stage's own unless derived).
 */
export function effectiveDriverStage(driver: DriverStage): DriverStage {
  if (driver.transformerChoice !== 'designed' || !driver.transformerDesign) return driver;
  const derived = derivedTransformerNumbers(driver.transformerDesign);
  const transformer: DriverTransformer = {
    ...driver.transformer,
    primaryTurns: derived.primaryTurns,
    feedbackTurns: derived.feedbackTurns,
    secondaryTurns: derived.secondaryTurns,
    primaryInductanceH: derived.primaryInductanceH,
    couplingCoefficient: derived.couplingCoefficient,
    windingCouplings: derived.windingCouplings,
    primaryResistanceOhm: derived.primaryResistanceOhm,
    feedbackResistanceOhm: derived.feedbackResistanceOhm,
    secondaryResistanceOhm: derived.secondaryResistanceOhm,
    saturationCurrentA: derived.saturationCurrentA,
    saturatedInductanceH: derived.saturatedInductanceH,
    secondaryCapacitanceF: derived.secondaryCapacitanceF,
  };
  return { ...driver, transformer };
}

/**
 * The design as the engine reads it: with a designed transformer, the driver stage's transformer numbers
 * derived from its section (`effectiveDriverStage`); otherwise the design itself. Every engine entry that
 * reads a driver design (analysis, circuits, runs) reads it through this.
 */
export function withEffectiveTransformer(design: Design): Design {
  if (design.drive.kind !== 'driver' || design.drive.driver.transformerChoice !== 'designed') return design;
  return { ...design, drive: { ...design.drive, driver: effectiveDriverStage(design.drive.driver) } };
}
