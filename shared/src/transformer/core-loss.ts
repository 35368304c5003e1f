import { DomainError } from '../errors';
import type { MethodInfo } from '../methods';
import type { WaveformPoint } from './transformer.types';

export const CORE_LOSS_METHOD: MethodInfo = {
  methodId: 'transformer.core-loss-igse',
  summary:
    'Improved generalized Steinmetz equation: Pv = (1/T)·Σ ki·|ΔB/Δt|^α·(ΔBpp)^(β−α)·Δt over the linear pieces of the flux, ki = k/((2π)^(α−1)·∫|cos θ|^α·2^(β−α) dθ); equals k·f^α·B^β for a sine.',
  assumptions: [
    'Steinmetz coefficients of the material at the operating temperature',
    'one major loop per period (no minor loops); relaxation after a flat flux not counted',
  ],
  source:
    'K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca, "Accurate prediction of ferrite core loss with nonsinusoidal waveforms using only Steinmetz parameters", IEEE COMPEL 2002',
};

/** The integral below for the α of the last few materials (α is a material constant). */
const integralByAlpha = new Map<number, number>();

/** ∫₀^{2π} |cos θ|^α dθ by the composite Simpson rule (smooth enough for α ≥ 1 at 2000 intervals). */
function integralAbsCosPower(alpha: number): number {
  const known = integralByAlpha.get(alpha);
  if (known !== undefined) return known;
  const value = simpsonAbsCosPower(alpha);
  if (integralByAlpha.size >= 64) integralByAlpha.clear();
  integralByAlpha.set(alpha, value);
  return value;
}

function simpsonAbsCosPower(alpha: number): number {
  const n = 2000;
  const h = (2 * Math.PI) / n;
  let sum = 0;
  for (let i = 0; i <= n; i++) {
    const weight = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
    sum += weight * Math.abs(Math.cos(i * h)) ** alpha;
  }
  return (sum * h) / 3;
}

/** The iGSE coefficient ki (same units as k) from the Steinmetz k, α, β (Venkatachalam et al. 2002). */
export function igseCoefficient(k: number, alpha: number, beta: number): number {
  return k / ((2 * Math.PI) ** (alpha - 1) * integralAbsCosPower(alpha) * 2 ** (beta - alpha));
}

/**
 * Core loss density (W/m³) of a piecewise-linear flux density waveform over one period (first point at
 * t = 0, last at the period) by the iGSE for piecewise-linear waveforms (Venkatachalam et al. 2002):
 * Pv = (1/T)·Σ ki·|ΔBj/Δtj|^α·(ΔBpp)^(β−α)·Δtj. Steinmetz k in W/m³ with f in Hz and B in T.
 */
export function igseLossDensity(
  fluxT: readonly WaveformPoint[],
  steinmetz: { k: number; alpha: number; beta: number },
): number {
  if (fluxT.length < 2) throw new DomainError('invalid_argument', 'a flux waveform needs two points', 'fluxT');
  const periodS = fluxT[fluxT.length - 1]!.timeS - fluxT[0]!.timeS;
  if (!(periodS > 0)) throw new DomainError('invalid_argument', 'the flux waveform must span a period', 'fluxT');
  const values = fluxT.map((p) => p.value);
  const swingT = Math.max(...values) - Math.min(...values);
  if (swingT === 0) return 0;
  const ki = igseCoefficient(steinmetz.k, steinmetz.alpha, steinmetz.beta);
  let energy = 0;
  for (let j = 1; j < fluxT.length; j++) {
    const dt = fluxT[j]!.timeS - fluxT[j - 1]!.timeS;
    if (!(dt > 0)) continue;
    const slope = Math.abs(fluxT[j]!.value - fluxT[j - 1]!.value) / dt;
    energy += ki * slope ** steinmetz.alpha * swingT ** (steinmetz.beta - steinmetz.alpha) * dt;
  }
  return energy / periodS;
}

/** The Steinmetz equation Pv = k·f^α·B̂^β (W/m³), B̂ the peak (half the peak-to-peak) of a sinusoidal flux. */
export function steinmetzLossDensity(
  frequencyHz: number,
  peakFluxDensityT: number,
  steinmetz: { k: number; alpha: number; beta: number },
): number {
  return steinmetz.k * frequencyHz ** steinmetz.alpha * peakFluxDensityT ** steinmetz.beta;
}
