import { describe, expect, it } from 'vitest';
import { demoTransformerSection } from '../transformer/demo-kinds';
import { designExamples } from './design-examples';
import type { Design } from './design.types';
import {
  DOCUMENT_FIELD_PATTERNS,
  documentFieldLabel,
  formatFieldDelta,
  formatFieldValue,
  resultFieldLabel,
} from './field-labels';

/** Every leaf path of a value, arrays stepped into: the paths a diff or a comment anchor can name. */
function leafPaths(value: unknown, prefix = ''): string[] {
  if (Array.isArray(value)) return value.flatMap((item, i) => leafPaths(item, `${prefix}[${i}]`));
  if (value !== null && typeof value === 'object')
    return Object.entries(value).flatMap(([key, child]) => leafPaths(child, prefix ? `${prefix}.${key}` : key));
  return [prefix];
}

const pattern = (path: string) => path.replace(/\[\d+\]/g, '[]');

/** A design with every optional field filled, so each path the schema allows appears once. */
function everyField(): Design {
  const base = structuredClone(designExamples.surfaceChargeTester);
  if (base.drive.kind !== 'driver') throw new Error('the surface-charge tester has a driver stage');
  const driver = base.drive.driver;
  driver.collectorResistorOhm = 1;
  driver.indicatorLamp = { currentA: 1e-3 };
  driver.switchOnTimeS = 0.5;
  driver.batteryLifeTargetH = 100;
  driver.clamp = {
    kind: 'rcd',
    resistorOhm: 10e3,
    capacitorF: 10e-9,
    ratedPowerW: 0.5,
    junctionCapacitanceF: 20e-12,
    junctionPotentialV: 0.7,
    gradingCoefficient: 0.45,
    breakdownVoltageV: 200,
    breakdownCurrentA: 1e-5,
  };
  driver.transistor.saturationCurrentA = 1e-14;
  driver.transformer.insulation = { ratedVoltageV: 3000 };
  driver.transformer.saturatedInductanceH = 1e-5;
  driver.transformer.windingCouplings = { primaryFeedback: 0.99, primarySecondary: 0.97, feedbackSecondary: 0.96 };
  driver.transformer.secondaryPhasing = 'forward';
  driver.transistor.baseEmitterCapacitanceF = 10e-12;
  driver.transistor.baseCollectorCapacitanceF = 5e-12;
  Object.assign(driver.transistor, {
    baseEmitterPotentialV: 0.8,
    baseEmitterGrading: 0.4,
    baseCollectorPotentialV: 0.6,
    baseCollectorGrading: 0.3,
    earlyVoltageV: 80,
    forwardTransitTimeS: 1e-9,
    reverseTransitTimeS: 1e-7,
    baseResistanceOhm: 10,
    collectorResistanceOhm: 0.5,
    emitterResistanceOhm: 0.2,
  });
  driver.snubber = { resistorOhm: 100, capacitorF: 1e-9 };
  driver.supplyBypassCapacitanceF = 100e-6;
  driver.collectorStrayCapacitanceF = 100e-12;
  driver.transformerChoice = 'designed';
  driver.transformerDesign = {
    ...structuredClone(demoTransformerSection),
    core: { ...demoTransformerSection.core, surfaceAreaM2: 2e-3 },
    windings: demoTransformerSection.windings.map((winding) => ({ ...winding, layers: 2, layerTapeWraps: 1 })),
    flangeCreepageM: 3e-3,
  };
  if (driver.supply.kind === 'cells') {
    driver.supply.curve = [{ chargeFraction: 1, voltageV: 1.5 }];
    driver.supply.maxContinuousCurrentA = 1;
  }
  Object.assign(base.multiplier.diode, {
    junctionCapacitanceF: 10e-12,
    junctionPotentialV: 0.6,
    gradingCoefficient: 0.4,
    breakdownVoltageV: 12e3,
    breakdownCurrentA: 1e-6,
  });
  base.multiplier.strayCapacitanceF = 1e-12;
  base.targets.spacing.altitudeM = 2000;
  base.targets.spacing.providedCreepageMm = 6;
  return base;
}

describe('transformer labels', () => {
  it('labels the designed transformer by winding and reads its units as datasheets write them', () => {
    expect(documentFieldLabel('drive.driver.transformerDesign.windings[2].turns').label).toBe('Winding 3 turns');
    const area = documentFieldLabel('drive.driver.transformerDesign.core.effectiveAreaM2');
    // 32 mm² = 32e-6 m² (SI definition).
    expect(formatFieldValue(32e-6, area.display)).toBe('32 mm²');
    expect(formatFieldValue(0.39, resultFieldLabel('transformer.saturationFluxDensityT').display)).toBe('390 mT');
    expect(formatFieldValue(1e8, 'kVPerMm')).toBe('100 kV/mm');
    expect(formatFieldValue(23.5, resultFieldLabel('transformer.saturationMarginPct').display)).toBe('23.5 %');
  });
});

describe('document field labels', () => {
  it('has its own label for every path of every demo design, with every optional field filled', () => {
    const documents: unknown[] = [...Object.values(designExamples), everyField()];
    const paths = documents.flatMap((document) => leafPaths(document));
    const unknown = paths.filter((path) => !DOCUMENT_FIELD_PATTERNS.includes(pattern(path)));
    expect(unknown).toEqual([]);
  });

  it('names a capacitor by its place in the list, counted from 1', () => {
    expect(documentFieldLabel('multiplier.capacitors[2].valueF')).toEqual({ label: 'C3 capacitance', display: 'F' });
    expect(documentFieldLabel('multiplier.capacitors[0].tolerance')).toEqual({
      label: 'C1 tolerance',
      display: 'fraction',
    });
  });

  it('gives an unknown path its last name in words rather than the raw path', () => {
    expect(documentFieldLabel('targets.spacing.someNewFieldMm').label).toBe('Some new field mm');
  });

  it('labels report keys', () => {
    expect(resultFieldLabel('ripplePeakToPeakV')).toEqual({ label: 'Ripple (peak-to-peak)', display: 'V' });
    expect(resultFieldLabel('analysis.outputPowerW').label).toBe('Output power');
  });
});

describe('field values as read', () => {
  it('shows a fractional tolerance in per cent and quantities with prefixes', () => {
    expect(formatFieldValue(0.1, 'fraction')).toBe('10 %');
    expect(formatFieldValue(1.5e-9, 'F')).toBe('1.5 nF');
    expect(formatFieldValue(6, 'mm')).toBe('6 mm');
    expect(formatFieldValue(true, 'plain')).toBe('yes');
    expect(formatFieldValue(undefined, 'V')).toBe('—');
  });

  it('signs differences', () => {
    expect(formatFieldDelta(-0.05, 'fraction')).toBe('−5 %');
    expect(formatFieldDelta(220e-12, 'F')).toBe('+220 pF');
    expect(formatFieldDelta(0, 'V')).toBe('0');
    expect(formatFieldDelta(null, 'V')).toBe('—');
  });
});
