import { DomainError } from '../../errors';
import type { CircuitElement } from '../circuit.types';

type CoupledInductors = Extract<CircuitElement, { kind: 'coupled-inductors' }>;

/**
 * Inductance matrix of windings on one core: L_ii = L_i, L_ij = k_ij·√(L_i·L_j), k_ij the pair's own
 * coefficient when `couplings` names it, else the element's `couplingCoefficient` (the usual transformer
 * description; with one k for all pairs the leakage inductance of winding i is (1 − k)·L_i). Row-major,
 * windings.length².
 */
export function inductanceMatrix(e: CoupledInductors, path: string): Float64Array {
  const check = (k: number, at: string): number => {
    if (!(k > 0 && k <= 1)) throw new DomainError('invalid_argument', 'coupling coefficient must lie in (0, 1]', at);
    return k;
  };
  check(e.couplingCoefficient, `${path}.couplingCoefficient`);
  const windings = e.windings;
  const n = windings.length;
  const k = new Float64Array(n * n).fill(e.couplingCoefficient);
  (e.couplings ?? []).forEach((c, p) => {
    const a = windings.findIndex((w) => w.name === c.windingA);
    const b = windings.findIndex((w) => w.name === c.windingB);
    if (a < 0 || b < 0 || a === b)
      throw new DomainError(
        'invalid_argument',
        'names two different windings of the element',
        `${path}.couplings[${p}]`,
      );
    k[a * n + b] = k[b * n + a] = check(c.coefficient, `${path}.couplings[${p}].coefficient`);
  });
  const m = new Float64Array(n * n);
  windings.forEach((w, i) => {
    if (!(w.inductanceH > 0))
      throw new DomainError('invalid_argument', 'inductance must be positive', `${path}.windings[${i}].inductanceH`);
  });
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const li = windings[i]!.inductanceH;
      const lj = windings[j]!.inductanceH;
      m[i * n + j] = i === j ? li : k[i * n + j]! * Math.sqrt(li * lj);
    }
  }
  return m;
}
