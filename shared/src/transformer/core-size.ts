import type { CoreKind } from './transformer.types';

/** McLyman's area product Ap = Wa·Ae (m⁴): the core's window area times its effective cross-section. */
export function areaProductM4(windowAreaM2: number, effectiveAreaM2: number): number {
  return windowAreaM2 * effectiveAreaM2;
}

/**
 * The core geometrical constant Kg = Ae²·Wa/MLT (m⁵) of the Kg method of sizing a copper-loss-limited inductor,
 * coupled inductor or flyback transformer (R. W. Erickson, D. Maksimović, Fundamentals of Power Electronics,
 * 3rd ed., §11.1.5, Eqs. (11.14)–(11.16)); catalogues print it in cm⁵ (× 10¹⁰).
 */
export function coreGeometryM5(core: Pick<CoreKind, 'effectiveAreaM2' | 'windowAreaM2' | 'meanTurnLengthM'>): number {
  return (core.effectiveAreaM2 ** 2 * core.windowAreaM2) / core.meanTurnLengthM;
}
