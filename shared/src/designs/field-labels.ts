import { formatQuantity } from '../units/format-quantity';
import type { QuantityUnit } from '../units/quantity.types';

/**
 * How a field's stored number reads: a quantity in SI base units, a fraction shown in per cent, a value already
 * in per cent, millimetres, areas and volumes stored in m² and m³ shown in mm² and mm³, flux density stored in T,
 * field strength stored in V/m shown in kV/mm, a temperature (rise) in °C, hours or ampere-hours as the trade
 * states them, or a plain count or ratio.
 */
export type FieldDisplay =
  QuantityUnit | 'fraction' | 'percent' | 'mm' | 'mm2' | 'mm3' | 'T' | 'kVPerMm' | 'degC' | 'h' | 'Ah' | 'plain';

/** A human label for a document path or a report key, and how its value reads. */
export interface FieldLabel {
  label: string;
  display: FieldDisplay;
}

/**
 * Every field of the design document, by its path with array indices removed (`multiplier.capacitors[].valueF`).
 * `{n}` in a label is the 1-based index of the first array on the path (C3 for `capacitors[2]`).
 */
const DOCUMENT_FIELDS: Readonly<Record<string, FieldLabel>> = {
  schemaVersion: { label: 'Document version', display: 'plain' },
  name: { label: 'Design name', display: 'plain' },
  notes: { label: 'Notes', display: 'plain' },
  drive: { label: 'Drive', display: 'plain' },
  'drive.kind': { label: 'Drive kind', display: 'plain' },
  'drive.peakV': { label: 'Secondary peak', display: 'V' },
  'drive.forwardPeakV': { label: 'Forward peak', display: 'V' },
  'drive.flybackPeakV': { label: 'Flyback peak', display: 'V' },
  'drive.frequencyHz': { label: 'Drive frequency', display: 'Hz' },
  'drive.dutyCycle': { label: 'Duty cycle', display: 'fraction' },
  'drive.sourceResistanceOhm': { label: 'Source resistance', display: 'Ohm' },
  'drive.driver': { label: 'Driver stage', display: 'plain' },
  'drive.driver.supply': { label: 'Supply', display: 'plain' },
  'drive.driver.supply.kind': { label: 'Supply kind', display: 'plain' },
  'drive.driver.supply.chemistry': { label: 'Cell chemistry', display: 'plain' },
  'drive.driver.supply.cellsInSeries': { label: 'Cells in series', display: 'plain' },
  'drive.driver.supply.capacityAh': { label: 'Cell capacity', display: 'Ah' },
  'drive.driver.supply.internalResistanceOhm': { label: 'Internal resistance per cell', display: 'Ohm' },
  'drive.driver.supply.endVoltagePerCellV': { label: 'End voltage per cell', display: 'V' },
  'drive.driver.supply.curve': { label: 'Cell curve', display: 'plain' },
  'drive.driver.supply.curve[].chargeFraction': { label: 'Cell curve point {n}: state of charge', display: 'fraction' },
  'drive.driver.supply.curve[].voltageV': { label: 'Cell curve point {n}: voltage', display: 'V' },
  'drive.driver.supply.maxContinuousCurrentA': { label: 'Continuous cell current', display: 'A' },
  'drive.driver.supply.voltageV': { label: 'Supply voltage', display: 'V' },
  'drive.driver.supply.sourceResistanceOhm': { label: 'Supply source resistance', display: 'Ohm' },
  'drive.driver.transformer': { label: 'Transformer', display: 'plain' },
  'drive.driver.transformer.primaryTurns': { label: 'Primary turns', display: 'plain' },
  'drive.driver.transformer.feedbackTurns': { label: 'Feedback turns', display: 'plain' },
  'drive.driver.transformer.secondaryTurns': { label: 'Secondary turns', display: 'plain' },
  'drive.driver.transformer.primaryInductanceH': { label: 'Primary inductance', display: 'H' },
  'drive.driver.transformer.couplingCoefficient': { label: 'Coupling coefficient k', display: 'plain' },
  'drive.driver.transformer.primaryResistanceOhm': { label: 'Primary resistance', display: 'Ohm' },
  'drive.driver.transformer.feedbackResistanceOhm': { label: 'Feedback resistance', display: 'Ohm' },
  'drive.driver.transformer.secondaryResistanceOhm': { label: 'Secondary resistance', display: 'Ohm' },
  'drive.driver.transformer.saturationCurrentA': { label: 'Core saturation current', display: 'A' },
  'drive.driver.transformer.saturatedInductanceH': { label: 'Saturated primary inductance', display: 'H' },
  'drive.driver.transformer.windingCouplings': { label: 'Coupling by winding pair', display: 'plain' },
  'drive.driver.transformer.windingCouplings.primaryFeedback': { label: 'Coupling primary–feedback', display: 'plain' },
  'drive.driver.transformer.windingCouplings.primarySecondary': {
    label: 'Coupling primary–secondary',
    display: 'plain',
  },
  'drive.driver.transformer.windingCouplings.feedbackSecondary': {
    label: 'Coupling feedback–secondary',
    display: 'plain',
  },
  'drive.driver.transformer.secondaryPhasing': { label: 'Ladder fed by', display: 'plain' },
  'drive.driver.transformer.insulation': { label: 'Secondary insulation', display: 'plain' },
  'drive.driver.transformer.insulation.ratedVoltageV': { label: 'Secondary insulation rating', display: 'V' },
  'drive.driver.transformerChoice': { label: 'Transformer from', display: 'plain' },
  'drive.driver.transformerDesign': { label: 'Designed transformer', display: 'plain' },
  'drive.driver.transformerDesign.core': { label: 'Core', display: 'plain' },
  'drive.driver.transformerDesign.core.code': { label: 'Core part code', display: 'plain' },
  'drive.driver.transformerDesign.core.effectiveAreaM2': { label: 'Core effective area Ae', display: 'mm2' },
  'drive.driver.transformerDesign.core.pathLengthM': { label: 'Core path length le', display: 'm' },
  'drive.driver.transformerDesign.core.volumeM3': { label: 'Core volume Ve', display: 'mm3' },
  'drive.driver.transformerDesign.core.windowAreaM2': { label: 'Core winding area', display: 'mm2' },
  'drive.driver.transformerDesign.core.bobbinBreadthM': { label: 'Bobbin winding breadth', display: 'm' },
  'drive.driver.transformerDesign.core.bobbinHeightM': { label: 'Bobbin winding height', display: 'm' },
  'drive.driver.transformerDesign.core.meanTurnLengthM': { label: 'Mean length per turn', display: 'm' },
  'drive.driver.transformerDesign.core.ungappedAlHPerTurn2': { label: 'AL of the ungapped core', display: 'H' },
  'drive.driver.transformerDesign.core.saturationFluxDensity25T': { label: 'Bsat at 25 °C', display: 'T' },
  'drive.driver.transformerDesign.core.saturationFluxDensity100T': { label: 'Bsat at 100 °C', display: 'T' },
  'drive.driver.transformerDesign.core.steinmetzK': { label: 'Steinmetz k', display: 'plain' },
  'drive.driver.transformerDesign.core.steinmetzAlpha': { label: 'Steinmetz α', display: 'plain' },
  'drive.driver.transformerDesign.core.steinmetzBeta': { label: 'Steinmetz β', display: 'plain' },
  'drive.driver.transformerDesign.core.surfaceAreaM2': { label: 'Core surface area', display: 'mm2' },
  'drive.driver.transformerDesign.gap': { label: 'Gap', display: 'plain' },
  'drive.driver.transformerDesign.gap.kind': { label: 'Gap set by', display: 'plain' },
  'drive.driver.transformerDesign.gap.gapM': { label: 'Gap length', display: 'm' },
  'drive.driver.transformerDesign.gap.alHPerTurn2': { label: 'Target AL', display: 'H' },
  'drive.driver.transformerDesign.gap.primaryInductanceH': { label: 'Target primary inductance', display: 'H' },
  'drive.driver.transformerDesign.windings': { label: 'Windings', display: 'plain' },
  'drive.driver.transformerDesign.windings[]': { label: 'Winding {n}', display: 'plain' },
  'drive.driver.transformerDesign.windings[].role': { label: 'Winding {n} role', display: 'plain' },
  'drive.driver.transformerDesign.windings[].name': { label: 'Winding {n} name', display: 'plain' },
  'drive.driver.transformerDesign.windings[].turns': { label: 'Winding {n} turns', display: 'plain' },
  'drive.driver.transformerDesign.windings[].wire': { label: 'Winding {n} wire', display: 'plain' },
  'drive.driver.transformerDesign.windings[].wire.code': { label: 'Winding {n} wire code', display: 'plain' },
  'drive.driver.transformerDesign.windings[].wire.copperDiameterM': {
    label: 'Winding {n} copper diameter',
    display: 'm',
  },
  'drive.driver.transformerDesign.windings[].wire.overallDiameterM': {
    label: 'Winding {n} diameter over enamel',
    display: 'm',
  },
  'drive.driver.transformerDesign.windings[].wire.grade': { label: 'Winding {n} enamel grade', display: 'plain' },
  'drive.driver.transformerDesign.windings[].wire.breakdownVoltageV': {
    label: 'Winding {n} wire breakdown voltage',
    display: 'V',
  },
  'drive.driver.transformerDesign.windings[].layers': { label: 'Winding {n} layers', display: 'plain' },
  'drive.driver.transformerDesign.windings[].layerTapeWraps': {
    label: 'Winding {n} tape wraps between layers',
    display: 'plain',
  },
  'drive.driver.transformerDesign.windings[].startPin': { label: 'Winding {n} start pin (dot)', display: 'plain' },
  'drive.driver.transformerDesign.windings[].endPin': { label: 'Winding {n} finish pin', display: 'plain' },
  'drive.driver.transformerDesign.layerTape': { label: 'Layer tape', display: 'plain' },
  'drive.driver.transformerDesign.layerTape.code': { label: 'Layer tape code', display: 'plain' },
  'drive.driver.transformerDesign.layerTape.thicknessM': { label: 'Layer tape thickness', display: 'm' },
  'drive.driver.transformerDesign.layerTape.dielectricStrengthVPerM': {
    label: 'Layer tape dielectric strength',
    display: 'kVPerMm',
  },
  'drive.driver.transformerDesign.windingTape': { label: 'Winding tape', display: 'plain' },
  'drive.driver.transformerDesign.windingTape.code': { label: 'Winding tape code', display: 'plain' },
  'drive.driver.transformerDesign.windingTape.thicknessM': { label: 'Winding tape thickness', display: 'm' },
  'drive.driver.transformerDesign.windingTape.dielectricStrengthVPerM': {
    label: 'Winding tape dielectric strength',
    display: 'kVPerMm',
  },
  'drive.driver.transformerDesign.windingTapeWraps': { label: 'Winding tape wraps', display: 'plain' },
  'drive.driver.transformerDesign.endMarginM': { label: 'End margin', display: 'm' },
  'drive.driver.transformerDesign.flangeCreepageM': { label: 'Creepage along the flange', display: 'm' },
  'drive.driver.transformerDesign.inductanceTolerance': { label: 'Inductance tolerance', display: 'fraction' },
  'drive.driver.transistor': { label: 'Transistor', display: 'plain' },
  'drive.driver.transistor.forwardBeta': { label: 'Forward β', display: 'plain' },
  'drive.driver.transistor.reverseBeta': { label: 'Reverse β', display: 'plain' },
  'drive.driver.transistor.vbeOnV': { label: 'Vbe (on)', display: 'V' },
  'drive.driver.transistor.vceSatV': { label: 'Vce (sat)', display: 'V' },
  'drive.driver.transistor.vceoMaxV': { label: 'Vceo max', display: 'V' },
  'drive.driver.transistor.icMaxA': { label: 'Ic max', display: 'A' },
  'drive.driver.transistor.saturationCurrentA': { label: 'Transistor saturation current (IS)', display: 'A' },
  'drive.driver.transistor.baseEmitterCapacitanceF': { label: 'B–E junction capacitance (CJE)', display: 'F' },
  'drive.driver.transistor.baseCollectorCapacitanceF': { label: 'B–C junction capacitance (CJC)', display: 'F' },
  'drive.driver.transistor.baseEmitterPotentialV': { label: 'B–E junction potential (VJE)', display: 'V' },
  'drive.driver.transistor.baseEmitterGrading': { label: 'B–E grading coefficient (MJE)', display: 'plain' },
  'drive.driver.transistor.baseCollectorPotentialV': { label: 'B–C junction potential (VJC)', display: 'V' },
  'drive.driver.transistor.baseCollectorGrading': { label: 'B–C grading coefficient (MJC)', display: 'plain' },
  'drive.driver.transistor.earlyVoltageV': { label: 'Early voltage (VAF)', display: 'V' },
  'drive.driver.transistor.forwardTransitTimeS': { label: 'Forward transit time (TF)', display: 's' },
  'drive.driver.transistor.reverseTransitTimeS': { label: 'Reverse transit time (TR)', display: 's' },
  'drive.driver.transistor.baseResistanceOhm': { label: 'Base resistance (RB)', display: 'Ohm' },
  'drive.driver.transistor.collectorResistanceOhm': { label: 'Collector resistance (RC)', display: 'Ohm' },
  'drive.driver.transistor.emitterResistanceOhm': { label: 'Emitter resistance (RE)', display: 'Ohm' },
  'drive.driver.baseResistorOhm': { label: 'Base resistor', display: 'Ohm' },
  'drive.driver.snubber': { label: 'Collector snubber', display: 'plain' },
  'drive.driver.snubber.resistorOhm': { label: 'Snubber resistor', display: 'Ohm' },
  'drive.driver.snubber.capacitorF': { label: 'Snubber capacitor', display: 'F' },
  'drive.driver.supplyBypassCapacitanceF': { label: 'Supply bypass capacitor', display: 'F' },
  'drive.driver.collectorStrayCapacitanceF': { label: 'Collector stray capacitance', display: 'F' },
  'drive.driver.collectorResistorOhm': { label: 'Collector resistor', display: 'Ohm' },
  'drive.driver.clamp': { label: 'Collector clamp', display: 'plain' },
  'drive.driver.clamp.kind': { label: 'Clamp kind', display: 'plain' },
  'drive.driver.clamp.clampVoltageV': { label: 'Zener voltage', display: 'V' },
  'drive.driver.clamp.resistorOhm': { label: 'Clamp resistor', display: 'Ohm' },
  'drive.driver.clamp.capacitorF': { label: 'Clamp capacitor', display: 'F' },
  'drive.driver.clamp.ratedPowerW': { label: 'Clamp power rating', display: 'W' },
  'drive.driver.clamp.junctionCapacitanceF': { label: 'Clamp diode junction capacitance (CJO)', display: 'F' },
  'drive.driver.clamp.junctionPotentialV': { label: 'Clamp diode junction potential (VJ)', display: 'V' },
  'drive.driver.clamp.gradingCoefficient': { label: 'Clamp diode grading coefficient (M)', display: 'plain' },
  'drive.driver.clamp.breakdownVoltageV': { label: 'Clamp diode breakdown voltage (BV)', display: 'V' },
  'drive.driver.clamp.breakdownCurrentA': { label: 'Clamp diode breakdown current (IBV)', display: 'A' },
  'drive.driver.indicatorLamp': { label: 'Indicator lamp', display: 'plain' },
  'drive.driver.indicatorLamp.currentA': { label: 'Indicator lamp current', display: 'A' },
  'drive.driver.switchOnTimeS': { label: 'Push-button hold time', display: 's' },
  'drive.driver.batteryLifeTargetH': { label: 'Battery-life target', display: 'h' },
  multiplier: { label: 'Ladder', display: 'plain' },
  'multiplier.topology': { label: 'Topology', display: 'plain' },
  'multiplier.cellCount': { label: 'Cell count', display: 'plain' },
  'multiplier.capacitors': { label: 'Ladder capacitors', display: 'plain' },
  'multiplier.capacitors[]': { label: 'C{n}', display: 'plain' },
  'multiplier.capacitors[].valueF': { label: 'C{n} capacitance', display: 'F' },
  'multiplier.capacitors[].tolerance': { label: 'C{n} tolerance', display: 'fraction' },
  'multiplier.capacitors[].ratedVoltageV': { label: 'C{n} rated voltage', display: 'V' },
  'multiplier.capacitors[].partCode': { label: 'C{n} part code', display: 'plain' },
  'multiplier.diode': { label: 'Diodes', display: 'plain' },
  'multiplier.diode.saturationCurrentA': { label: 'Diode saturation current', display: 'A' },
  'multiplier.diode.emissionCoefficient': { label: 'Diode emission coefficient', display: 'plain' },
  'multiplier.diode.seriesResistanceOhm': { label: 'Diode series resistance', display: 'Ohm' },
  'multiplier.diode.ratedPivV': { label: 'Diode rated PIV', display: 'V' },
  'multiplier.diode.ratedAverageCurrentA': { label: 'Diode rated average current', display: 'A' },
  'multiplier.diode.ratedSurgeCurrentA': { label: 'Diode rated surge current', display: 'A' },
  'multiplier.diode.junctionCapacitanceF': { label: 'Diode junction capacitance (CJO)', display: 'F' },
  'multiplier.diode.junctionPotentialV': { label: 'Diode junction potential (VJ)', display: 'V' },
  'multiplier.diode.gradingCoefficient': { label: 'Diode grading coefficient (M)', display: 'plain' },
  'multiplier.diode.breakdownVoltageV': { label: 'Diode model breakdown voltage (BV)', display: 'V' },
  'multiplier.diode.breakdownCurrentA': { label: 'Diode breakdown current (IBV)', display: 'A' },
  'multiplier.diode.partCode': { label: 'Diode part code', display: 'plain' },
  'multiplier.strayCapacitanceF': { label: 'Stray capacitance per node', display: 'F' },
  outputNetwork: { label: 'Output network', display: 'plain' },
  'outputNetwork.bleeder': { label: 'Bleeder string', display: 'plain' },
  'outputNetwork.bleeder.count': { label: 'Bleeder resistors in the string', display: 'plain' },
  'outputNetwork.bleeder.valueOhm': { label: 'Bleeder resistor (each)', display: 'Ohm' },
  'outputNetwork.bleeder.ratedPowerW': { label: 'Bleeder rated power (each)', display: 'W' },
  'outputNetwork.bleeder.limitingVoltageV': { label: 'Bleeder limiting element voltage', display: 'V' },
  'outputNetwork.bleeder.partCode': { label: 'Bleeder part code', display: 'plain' },
  'outputNetwork.seriesOutputResistanceOhm': { label: 'Series output resistor', display: 'Ohm' },
  load: { label: 'Load', display: 'plain' },
  'load.kind': { label: 'Load kind', display: 'plain' },
  'load.currentA': { label: 'Load current', display: 'A' },
  'load.resistanceOhm': { label: 'Load resistance', display: 'Ohm' },
  targets: { label: 'Targets', display: 'plain' },
  'targets.outputV': { label: 'Target output', display: 'V' },
  'targets.rippleMaxV': { label: 'Ripple limit', display: 'V' },
  'targets.loadCurrentA': { label: 'Rated load current', display: 'A' },
  'targets.safeVoltageV': { label: 'Safe touch level', display: 'V' },
  'targets.dischargeRule': { label: 'Discharge rule', display: 'plain' },
  'targets.dischargeRule.voltageV': { label: 'Discharge rule voltage', display: 'V' },
  'targets.dischargeRule.timeS': { label: 'Discharge rule time', display: 's' },
  'targets.spacing': { label: 'Spacing environment', display: 'plain' },
  'targets.spacing.pollutionDegree': { label: 'Pollution degree', display: 'plain' },
  'targets.spacing.materialGroup': { label: 'Material group', display: 'plain' },
  'targets.spacing.pcb': { label: 'Ladder on a printed board', display: 'plain' },
  'targets.spacing.altitudeM': { label: 'Altitude', display: 'm' },
  'targets.spacing.providedCreepageMm': { label: 'Provided creepage per stage', display: 'mm' },
};

/** The report's scalar results (the figures compared between revisions and anchored by comments). */
const RESULT_FIELDS: Readonly<Record<string, FieldLabel>> = {
  noLoadOutputV: { label: 'No-load output', display: 'V' },
  outputMeanV: { label: 'Output at load (mean)', display: 'V' },
  outputMinV: { label: 'Output at load (min)', display: 'V' },
  outputMaxV: { label: 'Output at load (max)', display: 'V' },
  ripplePeakToPeakV: { label: 'Ripple (peak-to-peak)', display: 'V' },
  droopV: { label: 'Droop', display: 'V' },
  outputImpedanceOhm: { label: 'Output impedance', display: 'Ohm' },
  optimumStages: { label: 'Optimum stage count', display: 'plain' },
  textbookRippleV: { label: 'Ripple, closed form', display: 'V' },
  textbookDropV: { label: 'Drop, closed form', display: 'V' },
  'analysis.ladderCurrentA': { label: 'Ladder current (load plus bleeder)', display: 'A' },
  'analysis.bleederCurrentA': { label: 'Bleeder current', display: 'A' },
  'analysis.outputPowerW': { label: 'Output power', display: 'W' },
  storedEnergyJ: { label: 'Stored energy', display: 'J' },
  storedChargeC: { label: 'Stored charge', display: 'C' },
  dischargeTimeS: { label: 'Discharge time to the safe level', display: 's' },
  dischargeTimeToRuleS: { label: 'Discharge time to the rule’s level', display: 's' },
  'driver.figures.efficiency': { label: 'Driver efficiency', display: 'fraction' },
  'driver.batteryLife.lifeS.value': { label: 'Battery life', display: 's' },
  'transformer.primaryInductanceH': { label: 'Primary inductance (designed)', display: 'H' },
  'transformer.gap.gapM': { label: 'Gap length', display: 'm' },
  'transformer.gap.alHPerTurn2': { label: 'AL with the gap', display: 'H' },
  'transformer.peakFluxDensityT': { label: 'Peak flux density', display: 'T' },
  'transformer.fluxSwingT': { label: 'Flux swing (peak-to-peak)', display: 'T' },
  'transformer.saturationFluxDensityT': { label: 'Bsat at 100 °C', display: 'T' },
  'transformer.saturationMarginPct': { label: 'Margin to saturation at 100 °C', display: 'percent' },
  'transformer.saturationCurrentA': { label: 'Primary current at saturation', display: 'A' },
  'transformer.saturatedInductanceH': { label: 'Saturated primary inductance', display: 'H' },
  'transformer.coreLossW': { label: 'Core loss', display: 'W' },
  'transformer.copperLossW': { label: 'Copper loss', display: 'W' },
  'transformer.temperatureRiseC': { label: 'Temperature rise', display: 'degC' },
  'transformer.windowFill': { label: 'Window fill (copper)', display: 'fraction' },
  'transformer.buildFill': { label: 'Build fill (bobbin height)', display: 'fraction' },
  'transformer.leakagePrimarySecondaryH': { label: 'Leakage inductance, primary to secondary', display: 'H' },
  'transformer.secondaryCapacitanceF': { label: 'Secondary self-capacitance', display: 'F' },
  'transformer.hipotTestVoltageV': { label: 'Hipot test voltage', display: 'V' },
  'transformer.windingInsulationV': { label: 'Insulation between windings', display: 'V' },
  'transformer.flangeCreepageM': { label: 'Creepage along the flange', display: 'm' },
  'transformer.requiredCreepageM': { label: 'Creepage required', display: 'm' },
  'transformer.couplings.primarySecondary': { label: 'Coupling primary–secondary', display: 'plain' },
  'transformer.couplings.primaryFeedback': { label: 'Coupling primary–feedback', display: 'plain' },
  'transformer.couplings.feedbackSecondary': { label: 'Coupling feedback–secondary', display: 'plain' },
};

/** `multiplier.capacitors[2].valueF` → `multiplier.capacitors[].valueF` and the first index (2), if any. */
function splitIndices(path: string): { pattern: string; firstIndex: number | null } {
  let firstIndex: number | null = null;
  const pattern = path.replace(/\[(\d+)\]/g, (_, index: string) => {
    firstIndex ??= Number(index);
    return '[]';
  });
  return { pattern, firstIndex };
}

function fromMap(map: Readonly<Record<string, FieldLabel>>, path: string): FieldLabel | null {
  const { pattern, firstIndex } = splitIndices(path);
  const entry = map[pattern];
  if (!entry) return null;
  return { ...entry, label: entry.label.replace('{n}', String((firstIndex ?? 0) + 1)) };
}

/** The last name on a path split into words (`ratedPowerW` → `rated power w`): the fallback for unknown paths. */
function wordsOf(path: string): string {
  const last =
    path
      .replace(/\[\d+\]/g, '')
      .split('.')
      .pop() ?? path;
  const words = last.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

/** The label and display of a design-document path; an unknown path gets its last name in words. */
export function documentFieldLabel(path: string): FieldLabel {
  return fromMap(DOCUMENT_FIELDS, path) ?? { label: wordsOf(path), display: 'plain' };
}

/** The label and display of a report result key (`ripplePeakToPeakV`, `analysis.outputPowerW`). */
export function resultFieldLabel(key: string): FieldLabel {
  return fromMap(RESULT_FIELDS, key) ?? { label: wordsOf(key), display: 'plain' };
}

/** Every document path pattern the map knows (indices as `[]`): for tests and for listing anchors. */
export const DOCUMENT_FIELD_PATTERNS: readonly string[] = Object.keys(DOCUMENT_FIELDS);

function plainNumber(value: number): string {
  return Number(value.toPrecision(5)).toString();
}

/** Three significant figures, for figures whose fourth is below what the method can tell. */
function roundNumber(value: number): string {
  return Number(value.toPrecision(3)).toString();
}

function magnitudeText(magnitude: number, display: FieldDisplay): string {
  switch (display) {
    case 'plain':
      return plainNumber(magnitude);
    case 'fraction':
      return `${plainNumber(magnitude * 100)} %`;
    case 'percent':
      return `${roundNumber(magnitude)} %`;
    case 'mm2':
      return `${plainNumber(magnitude * 1e6)} mm²`;
    case 'mm3':
      return `${plainNumber(magnitude * 1e9)} mm³`;
    case 'T':
      return magnitude < 1 ? `${roundNumber(magnitude * 1e3)} mT` : `${roundNumber(magnitude)} T`;
    case 'kVPerMm':
      return `${roundNumber(magnitude / 1e6)} kV/mm`;
    case 'degC':
      return `${roundNumber(magnitude)} °C`;
    case 'mm':
      return `${plainNumber(magnitude)} mm`;
    case 'h':
      return `${plainNumber(magnitude)} h`;
    case 'Ah':
      return `${plainNumber(magnitude)} Ah`;
    default:
      return formatQuantity(magnitude, display, 4);
  }
}

/** A field's value as an engineer reads it: `1.5 nF`, `10 %` for a tolerance of 0.1; strings as they are. */
export function formatFieldValue(value: unknown, display: FieldDisplay): string {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) return String(value);
    return value < 0 ? `−${magnitudeText(-value, display)}` : magnitudeText(value, display);
  }
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  return JSON.stringify(value);
}

/** A difference b − a with its sign: `+220 pF`, `−5 %`, `0`; `—` when there is none. */
export function formatFieldDelta(delta: number | null | undefined, display: FieldDisplay): string {
  if (delta === null || delta === undefined || !Number.isFinite(delta)) return '—';
  if (delta === 0) return '0';
  return `${delta > 0 ? '+' : '−'}${magnitudeText(Math.abs(delta), display)}`;
}
