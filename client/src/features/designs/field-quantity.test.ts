import { describe, expect, it } from 'vitest';
import { formatFieldDelta, formatFieldValue, formatPercentDelta, quantityOfField } from './field-quantity';

describe('quantityOfField', () => {
  it.each([
    ['multiplier.capacitors[0].valueF', 'F', 1],
    ['multiplier.diode.ratedPivV', 'V', 1],
    ['drive.frequencyHz', 'Hz', 1],
    ['outputNetwork.bleeder.valueOhm', 'Ohm', 1],
    ['analysis.outputPowerW', 'W', 1],
    ['storedEnergyJ', 'J', 1],
    ['storedChargeC', 'C', 1],
    ['dischargeTimeS', 's', 1],
    ['drive.driver.transformer.primaryInductanceH', 'H', 1],
    ['targets.spacing.providedCreepageMm', 'm', 1e-3],
    ['analysis.ladderCurrentA', 'A', 1],
  ])('reads %s as %s', (path, unit, toSi) => {
    expect(quantityOfField(path)).toEqual({ unit, toSi });
  });

  it.each(['multiplier.cellCount', 'outputNetwork.bleeder.count', 'drive.dutyCycle', 'targets.spacing.pcb', 'V'])(
    'gives no unit to %s',
    (path) => {
      expect(quantityOfField(path)).toBeNull();
    },
  );
});

describe('formatFieldValue', () => {
  it('formats SI numbers with the unit of their name', () => {
    expect(formatFieldValue('multiplier.capacitors[0].valueF', 1.5e-9)).toBe('1.5 nF');
    expect(formatFieldValue('outputNetwork.bleeder.valueOhm', 100e6)).toBe('100 MΩ');
    expect(formatFieldValue('targets.spacing.providedCreepageMm', 2.5)).toBe('2.5 mm');
  });

  it('keeps counts, strings and missing values readable', () => {
    expect(formatFieldValue('multiplier.cellCount', 4)).toBe('4');
    expect(formatFieldValue('multiplier.topology', 'half-wave')).toBe('half-wave');
    expect(formatFieldValue('outputNetwork.bleeder', null)).toBe('—');
    expect(formatFieldValue('targets.spacing', { pcb: true })).toBe('{"pcb":true}');
  });
});

describe('formatFieldDelta', () => {
  it('signs the difference and gives it the unit', () => {
    expect(formatFieldDelta('multiplier.capacitors[0].valueF', -5e-10)).toBe('−500 pF');
    expect(formatFieldDelta('outputMeanV', 1234.5)).toBe('+1.235 kV');
    expect(formatFieldDelta('multiplier.cellCount', 2)).toBe('+2');
    expect(formatFieldDelta('outputMeanV', 0)).toBe('0');
    expect(formatFieldDelta('outputMeanV', null)).toBe('—');
  });
});

describe('formatPercentDelta', () => {
  it('keeps three significant figures and the sign', () => {
    expect(formatPercentDelta(-0.0241763)).toBe('−0.0242 %');
    expect(formatPercentDelta(910.857)).toBe('+911 %');
    expect(formatPercentDelta(4.378)).toBe('+4.38 %');
    expect(formatPercentDelta(0)).toBe('0 %');
    expect(formatPercentDelta(null)).toBe('—');
  });
});
