import type { CommentAnchor } from '@ladderwright/shared/api';
import { fieldPath } from '@ladderwright/shared/errors';

/** The places a comment thread may point at: the document's input fields and the report's scalar results. */
export interface AnchorOptions {
  inputPaths: string[];
  resultKeys: string[];
}

function collectLeafPaths(value: unknown, prefix: string, into: string[]): void {
  if (Array.isArray(value)) {
    value.forEach((item, index) => collectLeafPaths(item, fieldPath(prefix, index), into));
  } else if (value !== null && typeof value === 'object') {
    for (const [key, child] of Object.entries(value)) collectLeafPaths(child, fieldPath(prefix, key), into);
  } else if (prefix && value !== undefined) {
    into.push(prefix);
  }
}

/**
 * Every scalar field of the design document as a path (`multiplier.capacitors[2].valueF`), and every top-level
 * numeric result of the stored report (`ripplePeakToPeakV`): the anchors the server accepts.
 */
export function anchorOptionsOf(document: unknown, report: unknown): AnchorOptions {
  const inputPaths: string[] = [];
  collectLeafPaths(document, '', inputPaths);
  const resultKeys =
    report !== null && typeof report === 'object'
      ? Object.entries(report)
          .filter(([, value]) => typeof value === 'number')
          .map(([key]) => key)
      : [];
  return { inputPaths, resultKeys };
}

/** `input:multiplier.stages` ⇄ `{ kind: 'input', path: 'multiplier.stages' }`, for select values. */
export function anchorValue(anchor: CommentAnchor): string {
  return `${anchor.kind}:${anchor.path}`;
}

export function anchorFromValue(value: string): CommentAnchor | null {
  const separator = value.indexOf(':');
  const kind = value.slice(0, separator);
  const path = value.slice(separator + 1);
  if (separator < 0 || !path || (kind !== 'input' && kind !== 'result')) return null;
  return { kind, path };
}
