import type { Design } from '../designs/design.types';
import { validateDesign } from '../designs/validate-design';
import { DomainError, fieldPath, prefixedFieldPath } from '../errors';
import { mulberry32 } from './seeded-random';

/**
 * Most members of one batch of simulations (sweep values or Monte Carlo trials): each member is a whole
 * simulation job, and 256 of them are already hours of one worker's time at the job size limit.
 */
export const BATCH_MAX_MEMBERS = 256;

/** One member of a batch: the document it simulates and the values that differ from the base design. */
export interface DesignVariant {
  /** The varied numbers by field path (`multiplier.capacitors[2].valueF`, `load.resistanceOhm`). */
  variant: Record<string, number>;
  document: Design;
}

const PATH_PART = /([^.[\]]+)|\[(\d+)\]/g;

/** The keys of a field path in the notation of `fieldPath` (`a.b[2].c` gives a, b, 2, c). */
function pathKeys(path: string): (string | number)[] {
  const keys: (string | number)[] = [];
  for (const match of path.matchAll(PATH_PART)) keys.push(match[2] !== undefined ? Number(match[2]) : String(match[1]));
  return keys;
}

function checkCount(count: number, field: string): void {
  if (!Number.isInteger(count) || count < 1 || count > BATCH_MAX_MEMBERS) {
    throw new DomainError('invalid_argument', `${field} must hold 1 to ${BATCH_MAX_MEMBERS} members`, field);
  }
}

/** A copy of `design` with the number at `path` replaced; 400 naming `field` when the path holds no number. */
function withNumberAt(design: Design, path: string, value: number, field: string): Design {
  // A design document is plain JSON, so its JSON text copies it whole.
  const copy = JSON.parse(JSON.stringify(design)) as Record<string | number, unknown>;
  const keys = pathKeys(path);
  let node: Record<string | number, unknown> = copy;
  for (const key of keys.slice(0, -1)) {
    const next = node[key];
    if (typeof next !== 'object' || next === null) break;
    node = next as Record<string | number, unknown>;
  }
  const last = keys[keys.length - 1];
  if (last === undefined || typeof node[last] !== 'number') {
    throw new DomainError('invalid_argument', `${field}: the design holds no number at '${path}'`, field);
  }
  node[last] = value;
  return copy as unknown as Design;
}

/** Validates a member's document; its issues name the member's field (`sweep.values[3]`). */
function validMember(document: Design, field: string): Design {
  try {
    return validateDesign(document);
  } catch (error) {
    if (error instanceof DomainError) {
      const issues = error.issues.map((issue) => ({ ...issue, path: prefixedFieldPath(field, issue.path) }));
      throw new DomainError(error.code, `${field}: ${error.message}`, field, issues);
    }
    throw error;
  }
}

/**
 * One design per value of the number at `path` (a parameter sweep), each validated like any document, so a
 * value outside the design's limits is a 400 naming `sweep.values[i]`.
 */
export function sweepDesigns(design: Design, path: string, values: readonly number[]): DesignVariant[] {
  checkCount(values.length, 'sweep.values');
  return values.map((value, index) => {
    const field = fieldPath('sweep.values', index);
    if (!Number.isFinite(value)) throw new DomainError('invalid_argument', `${field} must be a number`, field);
    const document = validMember(withNumberAt(design, path, value, 'sweep.path'), field);
    return { variant: { [path]: value }, document };
  });
}

/**
 * `trials` designs whose capacitors are drawn independently and uniformly within each one's stated tolerance
 * (`multiplier.capacitors[i].tolerance`, ±, the usual reading of a tolerance band; common practice, no
 * source), from the seeded mulberry32 sequence: the same seed gives the same members on every platform.
 */
export function monteCarloDesigns(design: Design, trials: number, seed: number): DesignVariant[] {
  checkCount(trials, 'monteCarlo.trials');
  const random = mulberry32(seed);
  const members: DesignVariant[] = [];
  for (let trial = 0; trial < trials; trial += 1) {
    const variant: Record<string, number> = {};
    const capacitors = design.multiplier.capacitors.map((capacitor, index) => {
      const valueF = capacitor.valueF * (1 + capacitor.tolerance * (2 * random() - 1));
      variant[`multiplier.capacitors[${index}].valueF`] = valueF;
      return { ...capacitor, valueF };
    });
    const document = { ...design, multiplier: { ...design.multiplier, capacitors } };
    members.push({ variant, document: validMember(document, fieldPath('monteCarlo.trials', trial)) });
  }
  return members;
}
