/**
 * Whether `path` (dotted keys with `[i]` indices, e.g. `multiplier.capacitors[2].valueF`) names a value
 * inside `root`. Used to check that a comment anchor points at a real input field or result key.
 */
export function hasPath(root: unknown, path: string): boolean {
  if (!/^[A-Za-z_][A-Za-z0-9_]*(\[[0-9]+\]|\.[A-Za-z_][A-Za-z0-9_]*)*$/.test(path)) return false;
  let current: unknown = root;
  for (const token of path.match(/[A-Za-z_][A-Za-z0-9_]*|\[[0-9]+\]/g) ?? []) {
    if (current === null || typeof current !== 'object') return false;
    if (token.startsWith('[')) {
      if (!Array.isArray(current)) return false;
      current = current[Number(token.slice(1, -1))];
    } else {
      if (Array.isArray(current) || !Object.prototype.hasOwnProperty.call(current, token)) return false;
      current = (current as Record<string, unknown>)[token];
    }
    if (current === undefined) return false;
  }
  return true;
}
