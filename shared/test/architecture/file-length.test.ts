import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

// Source files of shared/src and server/src stay at most MAX_LINES long (tests beside the code and database
// migrations excluded): past that a file holds more than one concept and is split along its seams
// (STYLE.md: one concept per file). The limit is common practice, no source.

const MAX_LINES = 400;
const repoDir = path.resolve(__dirname, '../../..');
const roots = ['shared/src', 'server/src'];

/**
 * Files allowed past the limit for now, each with the reason (repository-relative paths). Keep it short:
 * a file leaves the list as soon as it is split. Empty: every source file is within the limit.
 */
const ALLOWED_LONGER = new Map<string, string>([]);

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return e.name === 'migrations' ? [] : sourceFiles(p);
    return /\.tsx?$/.test(e.name) && !/\.test\.tsx?$/.test(e.name) ? [p] : [];
  });
}

/** Lines as `wc -l` counts them with a last line that may lack its newline. */
function lineCount(file: string): number {
  const text = readFileSync(file, 'utf8');
  const lines = text.split('\n').length;
  return text.endsWith('\n') ? lines - 1 : lines;
}

const lengths = roots.flatMap((root) =>
  sourceFiles(path.join(repoDir, root)).map((file) => ({
    file: path.relative(repoDir, file).split(path.sep).join('/'),
    lines: lineCount(file),
  })),
);

describe('source file length', () => {
  it('reads the source files of shared/src and server/src', () => {
    expect(lengths.some((f) => f.file === 'shared/src/sim/mna-system.ts')).toBe(true);
    expect(lengths.some((f) => f.file === 'server/src/main.ts')).toBe(true);
  });

  it(`keeps every source file at most ${MAX_LINES} lines, apart from the allowed ones`, () => {
    const tooLong = lengths.filter((f) => f.lines > MAX_LINES && !ALLOWED_LONGER.has(f.file));
    expect(tooLong.map((f) => `${f.file}: ${f.lines} lines`)).toEqual([]);
  });

  it('lists only files that exist and are still past the limit', () => {
    const stale = [...ALLOWED_LONGER.keys()].filter(
      (file) => !lengths.some((f) => f.file === file && f.lines > MAX_LINES),
    );
    expect(stale).toEqual([]);
  });
});
