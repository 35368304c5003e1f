import type { MethodInfo } from '../methods';
import { MU0 } from './gap';

export const LEAKAGE_METHOD: MethodInfo = {
  methodId: 'transformer.leakage-geometry',
  summary:
    'Leakage between two windings, referred to the first: L = µ0·N²·MLT·(c + (h1 + h2)/3)/b, c the radial distance between them (tapes and any winding between), h1, h2 their builds, b the winding breadth; coupling k = √(1 − L/L1).',
  assumptions: [
    'concentric windings filling the same breadth; one-dimensional field across the window',
    'MLT the mean turn length of the space between the two windings',
  ],
  source:
    'C. W. T. McLyman, Transformer and Inductor Design Handbook, 3rd ed., ch. 17 (leakage inductance of concentric windings); the same formula in E. C. Snelling, Soft Ferrites, 2nd ed. (from memory)',
};

/** Leakage inductance (H) between two concentric windings, referred to the one of `turns` turns. */
export function leakageInductanceH(input: {
  turns: number;
  meanTurnLengthM: number;
  breadthM: number;
  innerBuildM: number;
  outerBuildM: number;
  separationM: number;
}): number {
  const { turns, meanTurnLengthM, breadthM, innerBuildM, outerBuildM, separationM } = input;
  return (MU0 * turns ** 2 * meanTurnLengthM * (separationM + (innerBuildM + outerBuildM) / 3)) / breadthM;
}

/**
 * Least coupling reported: the formula's leakage reaches the self-inductance only for windings far too thick
 * for their bobbin (the bobbin-build Check fails them), and the driver needs a coupling above zero.
 */
export const MIN_COUPLING = 0.05;

/** Coupling coefficient from the short-circuit leakage referred to a winding of self-inductance `selfH`. */
export function couplingFromLeakage(leakageH: number, selfH: number): number {
  return Math.max(MIN_COUPLING, Math.sqrt(Math.max(0, 1 - leakageH / selfH)));
}
