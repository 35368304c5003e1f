/**
 * The round step (1, 2, 2.5 or 5 × 10ⁿ) that cuts `span` into about `count` parts: the usual chart scale (common
 * practice, no source). A step already round (1000 / 4 = 250) stays, however the division rounds.
 */
export function roundStep(span: number, count: number): number {
  const raw = span / Math.max(1, count);
  const power = 10 ** Math.floor(Math.log10(raw));
  const mantissa = raw / power;
  return ([1, 2, 2.5, 5, 10].find((nice) => nice >= mantissa * (1 - 1e-9)) ?? 10) * power;
}
