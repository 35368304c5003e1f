import type { SaturableCore } from '../circuit.types';
import type { BandedLu } from '../solver/banded-lu';
import type { AddReactive } from './junction-stamp';

/**
 * Fraction of its unsaturated value to which the incremental inductance has fallen at the saturation
 * current: 70 %, a 30 % drop (the usual rating of an inductor's saturation current; common practice, no
 * source).
 */
export const INDUCTANCE_AT_SATURATION_FRACTION = 0.7;

/** Knee scale c of the arctangent law: 1/(1 + c²) = INDUCTANCE_AT_SATURATION_FRACTION at i = Isat. */
const KNEE = Math.sqrt(1 / INDUCTANCE_AT_SATURATION_FRACTION - 1);

/**
 * Flux linkage of a saturating core against its magnetizing current (referred to the first winding), the
 * arctangent law: Λ(i) = Ls·i + (Lm − Ls)·(Is/c)·atan(c·i/Is), a smooth knee with the incremental inductance
 * L(i) = Ls + (Lm − Ls)/(1 + (c·i/Is)²) falling from Lm at zero current to Ls in deep saturation, and
 * to 70 % of Lm (Ls small) at the saturation current Is. (The arctangent is a common single-valued,
 * hysteresis-free magnetization law for circuit simulation; common practice, no single source.) Returns
 * the correction to the linear model, Φc(i) = Λ(i) − Lm·i, and its derivative, so a linear inductance
 * matrix carrying Lm keeps its meaning below saturation. Wb, A, H.
 */
export function coreFluxCorrection(
  core: SaturableCore,
  currentA: number,
  out: { fluxWb: number; inductanceH: number },
): void {
  const is = core.saturationCurrentA;
  const drop = core.magnetizingInductanceH - core.saturatedInductanceH;
  const x = (KNEE * currentA) / is;
  out.fluxWb = drop * ((is / KNEE) * Math.atan(x) - currentA);
  out.inductanceH = drop * (1 / (1 + x * x) - 1);
}

/**
 * Magnetic energy of the correction at magnetizing current i: ∫ i dΦc = i·Φc(i) − ∫₀ⁱ Φc, closed form for
 * the arctangent law (J); added to ½·iᵀMi of the linear windings.
 */
export function coreCorrectionEnergyJ(core: SaturableCore, currentA: number): number {
  const is = core.saturationCurrentA;
  const drop = core.magnetizingInductanceH - core.saturatedInductanceH;
  const x = (KNEE * currentA) / is;
  const flux = drop * ((is / KNEE) * Math.atan(x) - currentA);
  const integral =
    drop * ((is / KNEE) * (currentA * Math.atan(x) - (is / (2 * KNEE)) * Math.log1p(x * x)) - 0.5 * currentA ** 2);
  return currentA * flux - integral;
}

/** The ngspice expression of Φc(i) for a magnetizing-current expression `im` (same law as coreFluxCorrection). */
export function coreFluxCorrectionSpice(core: SaturableCore, im: string, num: (v: number) => string): string {
  const is = core.saturationCurrentA;
  const drop = core.magnetizingInductanceH - core.saturatedInductanceH;
  return `${num(drop)}*(${num(is / KNEE)}*atan(${num(KNEE / is)}*(${im}))-(${im}))`;
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
