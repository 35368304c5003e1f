import type { FittedParameter } from '../calibration/calibration.types';
import { formatQuantity, type QuantityUnit } from '../units';

const QUANTITY_UNITS: Record<string, QuantityUnit> = { Ω: 'Ohm', A: 'A', F: 'F' };

/** A fitted parameter's value in its unit with SI prefixes, or as a plain number to four figures (coupling, gain, a share). */
export function formatParameterValue(value: number, unit: string): string {
  const quantityUnit = QUANTITY_UNITS[unit];
  // A plain number to four figures without trailing zeros: "0.98", "100", "76.28", not "0.9800" or "100.0".
  return quantityUnit ? formatQuantity(value, quantityUnit) : String(Number(value.toPrecision(4)));
}

/** How an interval was found, in the words the Calibrate panel, the Sign-off and the spec sheet show. */
export const INTERVAL_METHOD_WORDS: Record<NonNullable<FittedParameter['intervalMethod']>, string> = {
  linearized: 'Jacobian, linearized',
  profile: 'profile likelihood',
};

/** The method of a parameter's interval; results stored before profiles were read had only the Jacobian's. */
export function intervalMethodWords(parameter: Pick<FittedParameter, 'intervalMethod'>): string {
  return INTERVAL_METHOD_WORDS[parameter.intervalMethod ?? 'linearized'];
}

/** "low to high" in the parameter's unit, or "not identifiable" when the fit gave no interval. */
export function intervalRangeText(parameter: Pick<FittedParameter, 'interval' | 'unit'>): string {
  if (!parameter.interval) return 'not identifiable';
  const { low, high } = parameter.interval;
  return `${formatParameterValue(low, parameter.unit)} to ${formatParameterValue(high, parameter.unit)}`;
}

/**
 * One fitted parameter as a line of a list: "label value (low to high, method)", or "(not identifiable)".
 * The Sign-off's Calibrations and the spec sheet write each parameter so.
 */
export function fittedParameterText(parameter: FittedParameter): string {
  const value = formatParameterValue(parameter.value, parameter.unit);
  const interval = parameter.interval
    ? `${intervalRangeText(parameter)}, ${intervalMethodWords(parameter)}`
    : 'not identifiable';
  return `${parameter.label} ${value} (${interval})`;
}
