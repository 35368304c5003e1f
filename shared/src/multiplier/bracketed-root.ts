/**
 * Root of a continuous f between `a` and `b`, where f(a) = `fa` and f(b) = `fb` differ in sign (or one is
 * zero), by Brent's method: inverse quadratic interpolation and secant steps inside the bracket, bisection
 * whenever they stall, so it never does worse than bisection and on smooth functions converges
 * superlinearly (R. P. Brent, Algorithms for Minimization without Derivatives, 1973, ch. 4; the layout of
 * Numerical Recipes' zbrent; from memory). Stops when the bracket is narrower than `toleranceX` (absolute,
 * units of x) or f is exactly zero.
 */
export function bracketedRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  fa: number,
  fb: number,
  toleranceX: number,
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  let c = b;
  let fc = fb;
  let d = b - a;
  let e = d;
  for (let iteration = 0; iteration < 200; iteration += 1) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * toleranceX;
    const half = 0.5 * (c - b);
    if (Math.abs(half) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * half * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * half * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      p = Math.abs(p);
      if (2 * p < Math.min(3 * half * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = half;
        e = d;
      }
    } else {
      d = half;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : Math.sign(half) * tol;
    fb = f(b);
  }
  return b;
}
