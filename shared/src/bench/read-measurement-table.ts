import { DomainError } from '../errors';
import type { FieldIssue } from '../errors';
import type { BenchKind, MeasuredPoint, MeasurementColumn, MeasurementTable } from './bench.types';

type Quantity = 'time' | 'voltage' | 'current';

const NAME_PATTERNS: Record<Quantity, RegExp> = {
  time: /^(time|t|sec|seconds?)$/i,
  voltage: /^(voltage|v|u|vout|v ?out|output|output voltage|volts?|ch ?\d+|channel ?\d+)$/i,
  current: /^(current|i|load|load current|i ?load|amps?)$/i,
};

const UNIT_SCALES: Record<Quantity, Record<string, number>> = {
  time: { s: 1, ms: 1e-3, us: 1e-6, µs: 1e-6, μs: 1e-6, ns: 1e-9 },
  voltage: { v: 1, mv: 1e-3, kv: 1e3 },
  current: { a: 1, ma: 1e-3, ua: 1e-6, µa: 1e-6, μa: 1e-6, na: 1e-9 },
};

const BASE_UNIT: Record<Quantity, string> = { time: 's', voltage: 'V', current: 'A' };
const HEADER_SEARCH_LINES = 50;
const MAX_REPORTED_ISSUES = 20;

/** `Time [ms]` -> { name: 'Time', unit: 'ms' }; `t (s)`, `CH1 [kV]`, `voltage` alike. */
function splitHeader(cell: string): { name: string; unit: string | null } {
  const match = /^\s*([^([]*?)\s*(?:[([]\s*([^)\]]*?)\s*[)\]])?\s*$/.exec(cell);
  if (!match) return { name: cell.trim(), unit: null };
  return { name: match[1] ?? '', unit: match[2] ? match[2] : null };
}

function findColumn(
  header: string[],
  quantity: Quantity,
): { index: number; header: string; unit: string | null } | null {
  for (let index = 0; index < header.length; index += 1) {
    const cell = header[index] ?? '';
    const { name, unit } = splitHeader(cell);
    if (NAME_PATTERNS[quantity].test(name)) return { index, header: cell.trim(), unit };
  }
  return null;
}

function isBlankRow(row: readonly string[]): boolean {
  return row.every((cell) => cell.trim() === '');
}

const NUMBER_PATTERN = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a bench data table (rows of cells as a CSV parser gives them) into SI points. Finds the header
 * among the first 50 lines (lines above it are kept as metadata), recognises the columns by name
 * (`time`, `t`, `voltage`, `V`, `CH1`, `current`, `I` …) and scales their units (`t (s)`, `Time [ms]`,
 * `CH1 [kV]`, `current (uA)`; no unit means s, V, A). Load sweeps need current and voltage columns,
 * scope captures time and voltage; a capture's time must not run backwards.
 * Throws DomainError('invalid_argument') with one issue per bad cell, path `line <n>, column <header>`.
 */
export function readMeasurementTable(rows: readonly (readonly string[])[], kind: BenchKind): MeasurementTable {
  const xQuantity: Quantity = kind === 'load-sweep' ? 'current' : 'time';
  let headerIndex = -1;
  let xFound: ReturnType<typeof findColumn> = null;
  let yFound: ReturnType<typeof findColumn> = null;
  for (let i = 0; i < Math.min(rows.length, HEADER_SEARCH_LINES); i += 1) {
    const row = rows[i] ?? [];
    const x = findColumn([...row], xQuantity);
    const y = findColumn([...row], 'voltage');
    if (x && y && x.index !== y.index) {
      headerIndex = i;
      xFound = x;
      yFound = y;
      break;
    }
  }
  if (headerIndex < 0 || !xFound || !yFound) {
    const expected =
      kind === 'load-sweep'
        ? 'current and voltage, e.g. "current (uA),voltage (V)"'
        : 'time and voltage, e.g. "time,voltage" or "Time [ms],CH1 [kV]"';
    throw new DomainError(
      'invalid_argument',
      `No header row with ${expected} in the first ${HEADER_SEARCH_LINES} lines`,
      'data',
    );
  }

  const issues: FieldIssue[] = [];
  const column = (found: NonNullable<ReturnType<typeof findColumn>>, quantity: Quantity): MeasurementColumn | null => {
    const unit = found.unit ?? BASE_UNIT[quantity];
    const scale = UNIT_SCALES[quantity][unit.toLowerCase()];
    if (scale === undefined) {
      issues.push({
        path: `line ${headerIndex + 1}, column ${found.header}`,
        message: `unit '${unit}' is not a ${quantity} unit (use ${Object.keys(UNIT_SCALES[quantity])
          .filter((u) => !u.startsWith('μ'))
          .join(', ')})`,
      });
      return null;
    }
    return { header: found.header, index: found.index, unit, scaleToSi: scale };
  };
  const x = column(xFound, xQuantity);
  const y = column(yFound, 'voltage');
  if (!x || !y)
    throw new DomainError('invalid_argument', issues[0]?.message ?? 'Unknown unit', issues[0]?.path ?? 'data', issues);

  const metadata = rows
    .slice(0, headerIndex)
    .filter((row) => !isBlankRow(row))
    .map((row) =>
      row
        .map((cell) => cell.trim())
        .filter((cell) => cell !== '')
        .join(', '),
    );
  const points: MeasuredPoint[] = [];
  let badCells = 0;
  const report = (issue: FieldIssue) => {
    badCells += 1;
    if (issues.length < MAX_REPORTED_ISSUES) issues.push(issue);
  };
  for (let i = headerIndex + 1; i < rows.length; i += 1) {
    const row = rows[i] ?? [];
    if (isBlankRow(row)) continue;
    const line = i + 1;
    const cellValue = (col: MeasurementColumn): number | null => {
      const raw = (row[col.index] ?? '').trim();
      if (raw === '') {
        report({
          path: `line ${line}, column ${col.header}`,
          message: `line ${line}, column ${col.header}: the cell is empty`,
        });
        return null;
      }
      if (!NUMBER_PATTERN.test(raw)) {
        report({
          path: `line ${line}, column ${col.header}`,
          message: `line ${line}, column ${col.header}: '${raw.slice(0, 40)}' is not a number`,
        });
        return null;
      }
      return Number(raw) * col.scaleToSi;
    };
    const xValue = cellValue(x);
    const yValue = cellValue(y);
    if (xValue === null || yValue === null) continue;
    const previous = points[points.length - 1];
    if (kind === 'scope-capture' && previous && xValue < previous.x) {
      report({
        path: `line ${line}, column ${x.header}`,
        message: `line ${line}, column ${x.header}: time runs backwards`,
      });
      continue;
    }
    points.push({ x: xValue, y: yValue });
  }
  if (badCells > 0) {
    if (badCells > issues.length)
      issues.push({ path: 'data', message: `${badCells - issues.length} more bad cells not listed` });
    const first = issues[0] as FieldIssue;
    throw new DomainError(
      'invalid_argument',
      `The data file has ${badCells} bad cell(s); first: ${first.message}`,
      first.path,
      issues,
    );
  }
  if (points.length < 2) {
    throw new DomainError('invalid_argument', 'The data file needs at least two data rows below the header', 'data');
  }
  return { kind, points, metadata, headerLine: headerIndex + 1, x, y };
}
