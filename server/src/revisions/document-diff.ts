import type { InputDifference } from '@ladderwright/shared/api';
import { fieldPath } from '@ladderwright/shared/errors';

/**
 * Leaf values of a JSON value by path, in the notation of the validator's field issues:
 * `multiplier.capacitors[2].valueF`. An empty array or object counts as a leaf so that its
 * appearance or disappearance is seen.
 */
export function flattenLeaves(value: unknown, prefix = ''): Map<string, unknown> {
  const leaves = new Map<string, unknown>();
  const visit = (node: unknown, path: string): void => {
    if (Array.isArray(node) && node.length > 0) {
      node.forEach((item, index) => visit(item, fieldPath(path, index)));
    } else if (typeof node === 'object' && node !== null && Object.keys(node).length > 0) {
      for (const [key, child] of Object.entries(node)) visit(child, fieldPath(path, key));
    } else {
      leaves.set(path, node);
    }
  };
  visit(value, prefix);
  return leaves;
}

function sameLeaf(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** Every leaf path whose value differs between `a` and `b` (added, removed or changed), in document order. */
export function changedPaths(a: unknown, b: unknown): string[] {
  return differences(a, b).map((difference) => difference.path);
}

/** The differing leaves side by side; a missing side is null; `delta` = b − a when both sides are numbers. */
export function differences(a: unknown, b: unknown): InputDifference[] {
  const leavesA = flattenLeaves(a);
  const leavesB = flattenLeaves(b);
  const paths = [...leavesA.keys(), ...[...leavesB.keys()].filter((path) => !leavesA.has(path))];
  return (
    paths
      .filter((path) => !sameLeaf(leavesA.get(path), leavesB.get(path)))
      .map((path) => {
        const valueA = leavesA.has(path) ? leavesA.get(path) : null;
        const valueB = leavesB.has(path) ? leavesB.get(path) : null;
        const difference: InputDifference = { path, a: valueA, b: valueB };
        if (typeof valueA === 'number' && typeof valueB === 'number') difference.delta = valueB - valueA;
        return difference;
      })
      // null -> object shows up through the object's own leaves; the bare "null vs missing" line says nothing.
      .filter((difference) => !(difference.a === null && difference.b === null))
  );
}
