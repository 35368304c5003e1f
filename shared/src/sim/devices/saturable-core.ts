import type { SaturableCore } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import type { AddReactive } from './junction-stamp';

/**
 * Fraction of its unsaturated value to which the incremental inductance has fallen at the saturation
 * current: 70 %, a 30 % drop (the usual rating of an inductor's saturation current; common practice, no
 * source).
 */
export const INDUCTANCE_AT_SATURATION_FRACTION = 0.7;

/** Knee scale c: at i = Isat, (1 + (c·Isat/Is·…)⁴)^(−5/4) = INDUCTANCE_AT_SATURATION_FRACTION, i.e. x = c at Isat. */
const KNEE = (INDUCTANCE_AT_SATURATION_FRACTION ** -0.8 - 1) ** 0.25;

/**
 * Flux linkage of a saturating core against its magnetizing current (referred to the first winding), a
 * smooth-knee saturation law of the algebraic-sigmoid family x/(1 + |x|ⁿ)^(1/n) with n = 4:
 * Λ(i) = Ls·i + (Lm − Ls)·Ik·x/(1 + x⁴)^(1/4), x = i/Ik, Ik = Is/c. Its incremental inductance
 * L(i) = Ls + (Lm − Ls)·(1 + x⁴)^(−5/4) stays within 2.5 % of Lm up to half the saturation current, falls to
 * 70 % of it at Is (with Ls small) and to Ls in deep saturation, where the core's flux stops growing
 * (single-valued, no hysteresis; the family and n = 4 are common practice for a ferrite's knee, no single
 * source). Returns the correction to the linear model, Φc(i) = Λ(i) − Lm·i, and its derivative, so a
 * linear inductance matrix carrying Lm keeps its meaning below saturation. Wb, A, H.
 */
export function coreFluxCorrection(
  core: SaturableCore,
  currentA: number,
  out: { fluxWb: number; inductanceH: number },
): void {
  const ik = core.saturationCurrentA / KNEE;
  const drop = core.magnetizingInductanceH - core.saturatedInductanceH;
  const x = currentA / ik;
  const x4 = x * x * x * x;
  const root = Math.sqrt(Math.sqrt(1 + x4));
  out.fluxWb = drop * (ik * (x / root) - currentA);
  out.inductanceH = drop * (1 / (root * (1 + x4)) - 1);
}

/**
 * Magnetic energy of the correction at magnetizing current i: ∫ i dΦc = i·Φc(i) − ∫₀ⁱ Φc (J), the integral
 * by Simpson's rule over 64 intervals (the integrand is smooth; error far below the energy account's);
 * added to ½·iᵀMi of the linear windings.
 */
export function coreCorrectionEnergyJ(core: SaturableCore, currentA: number): number {
  const out = { fluxWb: 0, inductanceH: 0 };
  const steps = 64;
  const h = currentA / steps;
  let integral = 0;
  for (let k = 0; k <= steps; k++) {
    coreFluxCorrection(core, k * h, out);
    integral += out.fluxWb * (k === 0 || k === steps ? 1 : k % 2 === 1 ? 4 : 2);
  }
  integral *= h / 3;
  coreFluxCorrection(core, currentA, out);
  return currentA * out.fluxWb - integral;
}

/** The ngspice expression of Φc(i) for a magnetizing-current expression `im` (same law as coreFluxCorrection). */
export function coreFluxCorrectionSpice(core: SaturableCore, im: string, num: (v: number) => string): string {
  const ik = core.saturationCurrentA / KNEE;
  const drop = core.magnetizingInductanceH - core.saturatedInductanceH;
  const x = `(${im})*${num(1 / ik)}`;
  return `${num(drop)}*(${num(ik)}*${x}/sqrt(sqrt(1+${x}*${x}*${x}*${x}))-(${im}))`;
}

/**
 * The saturation of a coupled-inductors element's core as a device: one nonlinear flux per winding,
 * n_i·Φc(i_m) with i_m = Σ n_j·i_j, on the winding's branch row beside its linear flux (the stamp of a
 * nonlinear reactive quantity: a0·∂q/∂x in the matrix and a0·(q − ∂q/∂x·x) on the right). Load and
 * convergence test as the junction devices have them.
 */
export class SaturableCoreInstance {
  private readonly reactives: Int32Array;
  private readonly offsets: Int32Array;
  private readonly out = { fluxWb: 0, inductanceH: 0 };
  private lastCurrentA = 0;
  private lastFluxWb = 0;
  private lastInductanceH = 0;

  constructor(
    name: string,
    windingNames: ReadonlyArray<string>,
    readonly core: SaturableCore,
    readonly branches: Int32Array,
    readonly turns: Float64Array,
    size: number,
    lu: BandedLu,
    addReactive: AddReactive,
  ) {
    const n = branches.length;
    this.offsets = new Int32Array(n * n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j < n; j++) this.offsets[i * n + j] = lu.offsetOf(branches[i]!, branches[j]!);
    this.reactives = Int32Array.from(windingNames, (w, i) =>
      addReactive(
        `${name}.${w}.core`,
        size,
        branches[i]!,
        Array.from(branches, (b) => [b, 0] as [number, number]),
        0,
      ),
    );
  }

  /** Magnetizing current at x, referred to the first winding. */
  magnetizingCurrentA(x: Float64Array): number {
    let im = 0;
    for (let j = 0; j < this.branches.length; j++) im += this.turns[j]! * x[this.branches[j]!]!;
    return im;
  }

  load(
    x: Float64Array,
    band: Float64Array,
    rhs: Float64Array,
    a0: number,
    charge: Float64Array,
    gradient: Float64Array,
    gradientStart: Int32Array,
  ): void {
    const im = this.magnetizingCurrentA(x);
    coreFluxCorrection(this.core, im, this.out);
    this.lastCurrentA = im;
    this.lastFluxWb = this.out.fluxWb;
    this.lastInductanceH = this.out.inductanceH;
    const n = this.branches.length;
    for (let i = 0; i < n; i++) {
      const ni = this.turns[i]!;
      const k = this.reactives[i]!;
      const q = ni * this.out.fluxWb;
      charge[k] = q;
      const p = gradientStart[k]!;
      let gx = 0;
      for (let j = 0; j < n; j++) {
        const g = ni * this.turns[j]! * this.out.inductanceH;
        gradient[p + j] = g;
        gx += g * x[this.branches[j]!]!;
        band[this.offsets[i * n + j]!]! -= a0 * g;
      }
      rhs[this.branches[i]!]! += a0 * (q - gx);
    }
  }

  /** The flux, linearized at the last load, is within tolerance of the law at solution x. */
  isConverged(x: Float64Array, relative: number, absoluteWb: number): boolean {
    const im = this.magnetizingCurrentA(x);
    coreFluxCorrection(this.core, im, this.out);
    const predicted = this.lastFluxWb + this.lastInductanceH * (im - this.lastCurrentA);
    const scale = Math.abs(this.core.magnetizingInductanceH * im);
    return Math.abs(this.out.fluxWb - predicted) <= relative * scale + absoluteWb;
  }
}
