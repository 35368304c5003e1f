import { DomainError } from '../../errors';
import type { Winding } from '../circuit.types';

/**
 * Inductance matrix of windings on one core: L_ii = L_i, L_ij = k·√(L_i·L_j) (every pair with the same
 * coupling coefficient k, the usual transformer description; leakage inductance of winding i is (1 − k)·L_i).
 * Row-major, windings.length².
 */
export function inductanceMatrix(
  windings: ReadonlyArray<Winding>,
  couplingCoefficient: number,
  path: string,
): Float64Array {
  if (!(couplingCoefficient > 0 && couplingCoefficient <= 1)) {
    throw new DomainError('invalid_argument', 'coupling coefficient must lie in (0, 1]', `${path}.couplingCoefficient`);
  }
  const n = windings.length;
  const m = new Float64Array(n * n);
  windings.forEach((w, i) => {
    if (!(w.inductanceH > 0))
      throw new DomainError('invalid_argument', 'inductance must be positive', `${path}.windings[${i}].inductanceH`);
  });
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const li = windings[i]!.inductanceH;
      const lj = windings[j]!.inductanceH;
      m[i * n + j] = i === j ? li : couplingCoefficient * Math.sqrt(li * lj);
    }
  }
  return m;
}
