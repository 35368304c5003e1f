import type { MethodInfo } from '../methods';
import { areaProductM4 } from './core-size';

export const TEMPERATURE_RISE_METHOD: MethodInfo = {
  methodId: 'transformer.temperature-rise-mclyman',
  summary:
    'ΔT = 450·ψ^0.826 °C, ψ = total loss / surface area in W/cm²; surface area of the wound core At = 41.3·√Ap cm² (Ap = Wa·Ae in cm⁴) unless the core states its own.',
  assumptions: ['natural convection in still air, sea level', 'loss spread evenly over the surface'],
  source:
    'C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed., ch. 6 (temperature rise from surface dissipation; Kt = 41.3 for E-I shapes from memory)',
};

/** McLyman's surface-area coefficient Kt for E-I shapes (At = Kt·√Ap, cm², Ap in cm⁴): from memory. */
export const SURFACE_AREA_KT = 41.3;

/** Surface area (m²) of a wound core of window area Wa and effective area Ae, by At = Kt·√Ap. */
export function woundSurfaceAreaM2(windowAreaM2: number, effectiveAreaM2: number): number {
  const apCm4 = areaProductM4(windowAreaM2, effectiveAreaM2) * 1e8;
  return (SURFACE_AREA_KT * Math.sqrt(apCm4)) / 1e4;
}

/** Temperature rise (°C) of a wound core dissipating `lossW` over `surfaceAreaM2`: 450·(P/At)^0.826, At in cm². */
export function temperatureRiseC(lossW: number, surfaceAreaM2: number): number {
  if (!(lossW > 0)) return 0;
  return 450 * (lossW / (surfaceAreaM2 * 1e4)) ** 0.826;
}
