import type { MethodInfo } from '../methods';
import { MU0 } from './gap';
import type { WaveformPoint } from './transformer.types';

export const COPPER_LOSS_METHOD: MethodInfo = {
  methodId: 'transformer.copper-loss-dowell',
  summary:
    'P = Rdc·(Idc² + Σh Fr(h)·Ih²) over the current’s harmonics, Fr = Δ·[(sinh 2Δ + sin 2Δ)/(cosh 2Δ − cos 2Δ) + (2(m²−1)/3)·(sinh Δ − sin Δ)/(cosh Δ + cos Δ)], round wire as an equivalent foil Δ = (π/4)^(3/4)·(d/δ)·√(d/p).',
  assumptions: [
    'each winding a layered winding of m layers in a one-dimensional field (Dowell)',
    'wire pitch p = diameter over enamel',
    'copper resistivity 1.7241e-8 Ω·m at 20 °C, temperature coefficient 0.00393 /K (IEC 60028), at ambient plus the estimated rise',
    'harmonics of the current up to the 40th; the rest of the rms current at the 40th harmonic’s factor',
  ],
  source:
    'P. L. Dowell, "Effects of eddy currents in transformer windings", Proc. IEE 113(8), 1387–1394, 1966; round-wire porosity as in J. A. Ferreira, Electromagnetic Modelling of Power Electronic Converters, 1989',
};

/** Resistivity of annealed copper at 20 °C (Ω·m), IEC 60028 (1/58 Ω·mm²/m). */
export const COPPER_RESISTIVITY_20C = 1.7241e-8;
/** Temperature coefficient of copper resistance at 20 °C (1/K), IEC 60028. */
export const COPPER_TEMPERATURE_COEFFICIENT = 0.00393;

/** Copper resistivity (Ω·m) at `temperatureC`. */
export function copperResistivity(temperatureC: number): number {
  return COPPER_RESISTIVITY_20C * (1 + COPPER_TEMPERATURE_COEFFICIENT * (temperatureC - 20));
}

/** DC resistance (Ω) of `turns` turns of mean length `meanTurnLengthM` of round wire of copper diameter d. */
export function dcResistanceOhm(turns: number, meanTurnLengthM: number, copperDiameterM: number, temperatureC = 20) {
  return (copperResistivity(temperatureC) * turns * meanTurnLengthM) / ((Math.PI * copperDiameterM ** 2) / 4);
}

/** Skin depth (m) in copper at `frequencyHz`: δ = √(ρ/(π·f·µ0)). */
export function skinDepthM(frequencyHz: number, temperatureC = 20): number {
  return Math.sqrt(copperResistivity(temperatureC) / (Math.PI * frequencyHz * MU0));
}

/**
 * Dowell's AC-to-DC resistance factor of an m-layer winding at the normalized thickness Δ = h/δ
 * (Dowell 1966): Fr = Δ·[M(Δ) + (2(m²−1)/3)·D(Δ)]. Series forms below Δ = 1e-3 avoid cancellation.
 */
export function dowellFactor(delta: number, layers: number): number {
  if (delta < 1e-3) return 1 + ((5 * layers ** 2 - 1) / 45) * delta ** 4;
  const m = (Math.sinh(2 * delta) + Math.sin(2 * delta)) / (Math.cosh(2 * delta) - Math.cos(2 * delta));
  const d = (Math.sinh(delta) - Math.sin(delta)) / (Math.cosh(delta) + Math.cos(delta));
  return delta * (m + ((2 * (layers ** 2 - 1)) / 3) * d);
}

/** Normalized thickness Δ of a layer of round wire (equivalent foil of the same area, scaled by porosity). */
export function roundWireDelta(copperDiameterM: number, pitchM: number, skinDepth: number): number {
  return (Math.PI / 4) ** 0.75 * (copperDiameterM / skinDepth) * Math.sqrt(copperDiameterM / pitchM);
}

/**
 * Mean and harmonic amplitudes (peak) of a piecewise-linear waveform over one period, exactly: the Fourier
 * integral of each linear piece in closed form, ∫v·e^(−jωt)dt = [(j/ω)·v·e^(−jωt) + (s/ω²)·e^(−jωt)] over the
 * piece (s its slope); a step (two points at one time) enters through the ends of the pieces either side.
 */
export function harmonics(waveform: readonly WaveformPoint[], count: number): { mean: number; amplitudes: number[] } {
  const t0 = waveform[0]!.timeS;
  const periodS = waveform[waveform.length - 1]!.timeS - t0;
  if (!(periodS > 0)) return { mean: 0, amplitudes: new Array<number>(count).fill(0) };
  let area = 0;
  for (let j = 1; j < waveform.length; j++) {
    const a = waveform[j - 1]!;
    const b = waveform[j]!;
    area += ((b.timeS - a.timeS) * (a.value + b.value)) / 2;
  }
  const amplitudes: number[] = [];
  for (let h = 1; h <= count; h++) {
    const w = (2 * Math.PI * h) / periodS;
    let re = 0;
    let im = 0;
    for (let j = 1; j < waveform.length; j++) {
      const a = waveform[j - 1]!;
      const b = waveform[j]!;
      const dt = b.timeS - a.timeS;
      if (!(dt > 0)) continue;
      const slope = (b.value - a.value) / dt;
      for (const [point, sign] of [
        [b, 1],
        [a, -1],
      ] as const) {
        const c = Math.cos(w * (point.timeS - t0));
        const s = Math.sin(w * (point.timeS - t0));
        re += sign * ((point.value * s) / w + (slope * c) / w ** 2);
        im += sign * ((point.value * c) / w - (slope * s) / w ** 2);
      }
    }
    amplitudes.push((2 / periodS) * Math.hypot(re, im));
  }
  return { mean: area / periodS, amplitudes };
}

/** Exact rms of a piecewise-linear waveform over its span. */
export function rmsOf(waveform: readonly WaveformPoint[]): number {
  let sum = 0;
  for (let j = 1; j < waveform.length; j++) {
    const a = waveform[j - 1]!;
    const b = waveform[j]!;
    sum += ((b.timeS - a.timeS) * (a.value ** 2 + a.value * b.value + b.value ** 2)) / 3;
  }
  const span = waveform[waveform.length - 1]!.timeS - waveform[0]!.timeS;
  return span > 0 ? Math.sqrt(sum / span) : 0;
}

/** Harmonics counted in the copper loss. */
export const COPPER_LOSS_HARMONICS = 40;

/**
 * Copper loss (W) of a winding carrying `currentA` (one period, piecewise linear) at fundamental
 * `frequencyHz`: Rdc·(Idc² + Σ Fr(h)·Ih,rms²) with Dowell's factor at each harmonic. Also returns the rms
 * current and the effective factor (loss over Rdc·Irms²).
 */
export function windingCopperLoss(input: {
  currentA: readonly WaveformPoint[];
  frequencyHz: number;
  dcResistanceOhm: number;
  copperDiameterM: number;
  pitchM: number;
  layers: number;
  temperatureC?: number;
  /** The current's `harmonics(currentA, COPPER_LOSS_HARMONICS)` when the caller has them already. */
  spectrum?: { mean: number; amplitudes: readonly number[] };
}): { lossW: number; rmsCurrentA: number; acResistanceFactor: number } {
  const { mean, amplitudes } = input.spectrum ?? harmonics(input.currentA, COPPER_LOSS_HARMONICS);
  const factorAt = (h: number) =>
    dowellFactor(
      roundWireDelta(input.copperDiameterM, input.pitchM, skinDepthM(h * input.frequencyHz, input.temperatureC ?? 20)),
      input.layers,
    );
  let counted = mean ** 2;
  let weighted = mean ** 2;
  amplitudes.forEach((amplitude, i) => {
    const rmsSquared = amplitude ** 2 / 2;
    counted += rmsSquared;
    weighted += factorAt(i + 1) * rmsSquared;
  });
  const rmsCurrentA = rmsOf(input.currentA);
  weighted += Math.max(0, rmsCurrentA ** 2 - counted) * factorAt(COPPER_LOSS_HARMONICS);
  return {
    lossW: input.dcResistanceOhm * weighted,
    rmsCurrentA,
    acResistanceFactor: rmsCurrentA > 0 ? weighted / rmsCurrentA ** 2 : 1,
  };
}
