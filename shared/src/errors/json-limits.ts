import { fieldPath } from './field-path';
import type { FieldIssue } from './domain-error';

/** Bounds on a parsed JSON value as a whole. */
export interface JsonLimits {
  /** Deepest nesting of objects and lists (the value itself is depth 0). */
  maxDepth: number;
  /** Size of the value as JSON text, estimated from above without serializing it. */
  maxBytes: number;
  /** Refuse NUL and other control characters (tab, line feed, carriage return allowed) and unpaired surrogates. */
  checkText: boolean;
}

// Control characters other than tab, LF, CR; an unpaired high or low surrogate.
const BAD_TEXT =
  // eslint-disable-next-line no-control-regex
  /[\u0000-\u0008\u000B\u000C\u000E-\u001F]|[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** Why a string cannot be stored as text, or null when it can. */
export function textProblem(value: string): string | null {
  const match = BAD_TEXT.exec(value);
  if (!match) return null;
  const code = match[0].charCodeAt(0);
  return code < 0x20
    ? `contains the control character U+${code.toString(16).toUpperCase().padStart(4, '0')}`
    : 'contains an unpaired UTF-16 surrogate';
}

/** A value still to be looked at; its path is spelled out only for an issue (most values have none). */
interface PendingValue {
  value: unknown;
  parent: PendingValue | null;
  key: string | number;
  depth: number;
}

/** The field path of `item` under `rootPath`, from its chain of parents. */
function pathOf(item: PendingValue, rootPath: string): string {
  const keys: (string | number)[] = [];
  for (let at: PendingValue | null = item; at?.parent; at = at.parent) keys.push(at.key);
  let path = rootPath;
  for (let i = keys.length - 1; i >= 0; i--) path = fieldPath(path, keys[i]!);
  return path;
}

/**
 * The first way a parsed JSON value exceeds its limits, as a field issue (path in the validator's
 * notation, `rootLabel` for the value itself), or null. Iterative, so a hostile nesting depth cannot
 * overflow the stack, and it stops at the first problem, so its cost is bounded by the limits. Paths are
 * spelled out only for the issue found: every request body passes here, and most have none.
 */
export function jsonLimitIssue(
  value: unknown,
  limits: JsonLimits,
  rootPath = '',
  rootLabel = '(document)',
): FieldIssue | null {
  const stack: PendingValue[] = [{ value, parent: null, key: '', depth: 0 }];
  let bytes = 0;
  const at = (item: PendingValue) => pathOf(item, rootPath) || rootLabel;
  while (stack.length > 0) {
    const item = stack.pop()!;
    const v = item.value;
    if (typeof v === 'string') {
      bytes += v.length * 3 + 2;
      const problem = limits.checkText ? textProblem(v) : null;
      if (problem) return { path: at(item), message: problem };
    } else if (typeof v === 'object' && v !== null) {
      if (item.depth >= limits.maxDepth) {
        return { path: at(item), message: `nests deeper than ${limits.maxDepth} levels` };
      }
      if (Array.isArray(v)) {
        bytes += 2 + v.length;
        for (let i = v.length - 1; i >= 0; i--)
          stack.push({ value: v[i], parent: item, key: i, depth: item.depth + 1 });
      } else {
        const keys = Object.keys(v);
        bytes += 2 + keys.length;
        for (let i = keys.length - 1; i >= 0; i--) {
          const key = keys[i]!;
          bytes += key.length * 3 + 3;
          const child: PendingValue = {
            value: (v as Record<string, unknown>)[key],
            parent: item,
            key,
            depth: item.depth + 1,
          };
          const problem = limits.checkText ? textProblem(key) : null;
          if (problem) return { path: at(child), message: `key ${problem}` };
          stack.push(child);
        }
      }
    } else {
      bytes += 24;
    }
    if (bytes > limits.maxBytes) {
      return { path: rootPath || rootLabel, message: `is larger than ${limits.maxBytes} bytes as JSON text` };
    }
  }
  return null;
}
