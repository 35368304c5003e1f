/** ∫i² dt (A²·s) of the first-order ramp i(t) = I∞(1 − e^(−t/τ)) from 0 to t; i²·t/3 for the linear ramp. */
export function rampSquareIntegral(finalA: number, tauS: number, endA: number, tS: number): number {
  if (!(tauS > 0 && Number.isFinite(tauS))) return (endA * endA * tS) / 3;
  const e1 = -Math.expm1(-tS / tauS);
  const e2 = -Math.expm1((-2 * tS) / tauS);
  return finalA * finalA * (tS - 2 * tauS * e1 + 0.5 * tauS * e2);
}

/** Charge (C) of the first-order ramp i(t) = I∞(1 − e^(−t/τ)) from 0 to t, τ = Lp/R; the linear ramp's ½·i·t when R = 0. */
export function rampChargeC(finalA: number, tauS: number, endA: number, tS: number): number {
  return tauS > 0 && Number.isFinite(tauS) ? finalA * tS - tauS * endA : 0.5 * endA * tS;
}
