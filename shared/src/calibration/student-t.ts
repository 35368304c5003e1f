/**
 * ln Γ(x) for x > 0 by the Lanczos approximation (g = 7, nine coefficients; Numerical Recipes 3rd ed.
 * §6.1 gives the method, these coefficients are the widely published set, from memory), relative error
 * near 1e-15.
 */
function logGamma(x: number): number {
  const c = [
    0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059,
    12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
  ];
  if (x < 0.5) return Math.log(Math.PI / Math.abs(Math.sin(Math.PI * x))) - logGamma(1 - x);
  const z = x - 1;
  let sum = c[0] as number;
  for (let i = 1; i < 9; i += 1) sum += (c[i] as number) / (z + i);
  const t = z + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Continued fraction of the incomplete beta function by the modified Lentz method (Numerical Recipes §6.4). */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const tiny = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m += 1) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a - 1 + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + 1 + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) break;
  }
  return h;
}

/** Regularized incomplete beta I_x(a, b), 0 ≤ x ≤ 1 (Numerical Recipes §6.4). */
export function regularizedBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(a, b, x)) / a
    : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

/** P(T ≤ t) of Student's t with ν degrees of freedom: 1 − ½·I_{ν/(ν+t²)}(ν/2, ½) for t ≥ 0, symmetric. */
export function studentTCdf(t: number, degreesOfFreedom: number): number {
  const tail = 0.5 * regularizedBeta(degreesOfFreedom / (degreesOfFreedom + t * t), degreesOfFreedom / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/**
 * The two-sided critical value t such that P(|T| ≤ t) = `confidence` for ν degrees of freedom (ν ≥ 1),
 * by bisection on the distribution function to 1e-12.
 */
export function studentTCritical(confidence: number, degreesOfFreedom: number): number {
  const target = 0.5 + confidence / 2;
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, degreesOfFreedom) < target) hi *= 2;
  while (hi - lo > 1e-12 * hi) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, degreesOfFreedom) < target) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
