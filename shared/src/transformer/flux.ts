import type { MethodInfo } from '../methods';
import type { CoreKind } from './transformer.types';

export const FLUX_METHOD: MethodInfo = {
  methodId: 'transformer.peak-flux',
  summary: 'B = L·i/(N·Ae): flux density from the magnetizing current through the primary inductance (with fringing).',
  assumptions: ['flux uniform over Ae', 'saturation judged at 100 °C, the material figure the core maker gives'],
  source:
    'Faraday’s law with L = N·Φ/i; the same B = µ0·N·F·I/(lg + le/µr) as C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed., ch. 8',
};

/** Flux density (T) in the core at magnetizing current `currentA` through `turns` turns of inductance `inductanceH`. */
export function fluxDensityT(inductanceH: number, currentA: number, turns: number, effectiveAreaM2: number): number {
  return (inductanceH * currentA) / (turns * effectiveAreaM2);
}

/**
 * Saturation flux density (T) at a core temperature, linear through the material's 25 °C and 100 °C figures
 * (ferrite Bsat falls roughly linearly with temperature over this range: common practice, no source).
 */
export function saturationFluxDensityAtT(core: CoreKind, temperatureC: number): number {
  const slope = (core.saturationFluxDensity100T - core.saturationFluxDensity25T) / 75;
  return Math.max(0, core.saturationFluxDensity25T + slope * (temperatureC - 25));
}

/** Margin (%) of a peak flux density below saturation: (Bsat − B)/Bsat·100. */
export function saturationMarginPct(peakFluxDensityT: number, saturationT: number): number {
  return ((saturationT - peakFluxDensityT) / saturationT) * 100;
}

/** Primary current (A) at which the flux reaches `saturationT`: I = Bsat·N·Ae/L. */
export function saturationCurrentA(saturationT: number, inductanceH: number, turns: number, effectiveAreaM2: number) {
  return (saturationT * turns * effectiveAreaM2) / inductanceH;
}
