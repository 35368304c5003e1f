import { driverExamples } from './driver-examples';
import type { CapacitorPart, Design, DiodePart } from './design.types';

/*
 * Demo designs of the invented Northfold Instruments scenario (NAMING.md). Values are invented and chosen
 * to be plausible for each product line; part codes are Northfold's own (no vendor parts).
 */

function capacitors(count: number, part: CapacitorPart): CapacitorPart[] {
  return Array.from({ length: count }, () => ({ ...part }));
}

const stackedHvDiode: DiodePart = {
  saturationCurrentA: 2e-9,
  emissionCoefficient: 8,
  seriesResistanceOhm: 40,
  ratedPivV: 2000,
  ratedAverageCurrentA: 0.05,
  ratedSurgeCurrentA: 10,
  junctionCapacitanceF: 1.5e-12,
  partCode: 'NF-D2K-50M',
};

const fastSmallSignalHvDiode: DiodePart = {
  saturationCurrentA: 5e-10,
  emissionCoefficient: 4,
  seriesResistanceOhm: 20,
  ratedPivV: 1000,
  ratedAverageCurrentA: 0.1,
  ratedSurgeCurrentA: 3,
  junctionCapacitanceF: 2e-12,
  partCode: 'NF-D1K-100M',
};

const ionizerBar: Design = {
  schemaVersion: 1,
  name: 'Cleanroom ionizer bar, -6 kV',
  notes:
    'Negative 14-cell half-wave ladder on a resonant 25 kHz secondary; emitter pins fed through a series resistor.',
  drive: { kind: 'sine', peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 },
  multiplier: {
    topology: 'half-wave',
    cellCount: 14,
    capacitors: capacitors(14, { valueF: 2.2e-9, tolerance: 0.1, ratedVoltageV: 2000, partCode: 'NF-C222-2K' }),
    diode: stackedHvDiode,
    strayCapacitanceF: 0.5e-12,
  },
  outputNetwork: {
    bleeder: { count: 5, valueOhm: 200e6, ratedPowerW: 0.5, limitingVoltageV: 2500, partCode: 'NF-R200M-HV' },
    seriesOutputResistanceOhm: 10e6,
  },
  load: { kind: 'current', currentA: 30e-6 },
  targets: {
    outputV: -6000,
    rippleMaxV: 30,
    loadCurrentA: 30e-6,
    safeVoltageV: 50,
    dischargeRule: '50V-1min',
    spacing: { pollutionDegree: 2, materialGroup: 'IIIa', pcb: true, providedCreepageMm: 6 },
  },
};

const detectorBias: Design = {
  schemaVersion: 1,
  name: 'Detector tube bias, 900 V',
  notes: 'Tripler on a 30 kHz secondary from one lithium-ion cell; large smoothing capacitors for very low ripple.',
  drive: { kind: 'sine', peakV: 320, frequencyHz: 30e3, sourceResistanceOhm: 400 },
  multiplier: {
    topology: 'half-wave',
    cellCount: 3,
    capacitors: [
      { valueF: 22e-9, tolerance: 0.1, ratedVoltageV: 630, partCode: 'NF-C223-630' },
      { valueF: 10e-9, tolerance: 0.1, ratedVoltageV: 1000, partCode: 'NF-C103-1K' },
      { valueF: 22e-9, tolerance: 0.1, ratedVoltageV: 1000, partCode: 'NF-C223-1K' },
    ],
    diode: fastSmallSignalHvDiode,
  },
  outputNetwork: {
    bleeder: { count: 2, valueOhm: 100e6, ratedPowerW: 0.25, limitingVoltageV: 1000, partCode: 'NF-R100M-1K' },
    seriesOutputResistanceOhm: 1e6,
  },
  load: { kind: 'current', currentA: 5e-6 },
  targets: {
    outputV: 900,
    rippleMaxV: 0.5,
    loadCurrentA: 5e-6,
    safeVoltageV: 50,
    dischargeRule: '60V-5s',
    spacing: { pollutionDegree: 2, materialGroup: 'IIIa', pcb: true, providedCreepageMm: 4 },
  },
};

const precipitatorCell: Design = {
  schemaVersion: 1,
  name: 'Range-hood precipitator cell, 4 kV',
  notes:
    'Two-stage full-wave cascade on a centre-tapped 20 kHz secondary; a few hundred microamps into the collector plates.',
  drive: { kind: 'sine', peakV: 1100, frequencyHz: 20e3, sourceResistanceOhm: 200 },
  multiplier: {
    topology: 'full-wave',
    cellCount: 2,
    capacitors: capacitors(6, { valueF: 4.7e-9, tolerance: 0.2, ratedVoltageV: 3000, partCode: 'NF-C472-3K' }),
    diode: { ...stackedHvDiode, ratedPivV: 3000, partCode: 'NF-D3K-50M' },
  },
  outputNetwork: {
    bleeder: { count: 4, valueOhm: 47e6, ratedPowerW: 0.5, limitingVoltageV: 1600, partCode: 'NF-R47M-HV' },
    seriesOutputResistanceOhm: 100e3,
  },
  load: { kind: 'current', currentA: 300e-6 },
  targets: {
    outputV: 4000,
    rippleMaxV: 20,
    loadCurrentA: 300e-6,
    safeVoltageV: 50,
    dischargeRule: '50V-1min',
    // Potted ladder: pollution degree 1 inside the compound.
    spacing: { pollutionDegree: 1, materialGroup: 'IIIa', pcb: true, providedCreepageMm: 14 },
  },
};

const surfaceChargeTester: Design = {
  schemaVersion: 1,
  name: 'Handheld surface-charge tester',
  notes: 'Two alkaline cells, blocking oscillator with a feedback winding, four-cell ladder and a bleeder string.',
  drive: { kind: 'driver', driver: driverExamples.surfaceChargeTester },
  multiplier: {
    topology: 'half-wave',
    cellCount: 4,
    capacitors: capacitors(4, { valueF: 4.7e-9, tolerance: 0.1, ratedVoltageV: 3000, partCode: 'NF-C472-3K' }),
    diode: { ...stackedHvDiode, ratedPivV: 4000, partCode: 'NF-D4K-50M' },
  },
  outputNetwork: {
    bleeder: { count: 5, valueOhm: 82e6, ratedPowerW: 0.25, limitingVoltageV: 1000, partCode: 'NF-R82M-1K' },
    seriesOutputResistanceOhm: 22e6,
  },
  load: { kind: 'current', currentA: 2e-6 },
  targets: {
    outputV: 3000,
    rippleMaxV: 20,
    loadCurrentA: 2e-6,
    safeVoltageV: 50,
    dischargeRule: '60V-5s',
    // Potted ladder: pollution degree 1 inside the compound.
    spacing: { pollutionDegree: 1, materialGroup: 'IIIa', pcb: true, providedCreepageMm: 11 },
  },
};

/** The four demo products, keyed by a stable id. */
export const designExamples: Readonly<
  Record<'ionizerBar' | 'detectorBias' | 'precipitatorCell' | 'surfaceChargeTester', Design>
> = {
  ionizerBar,
  detectorBias,
  precipitatorCell,
  surfaceChargeTester,
};
