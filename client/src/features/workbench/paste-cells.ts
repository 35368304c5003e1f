import type { CapacitorPart } from '@ladderwright/shared/designs';
import { isDomainError } from '@ladderwright/shared/errors';
import { parseQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { splitPastedCells } from '../../lib/spreadsheet-cells';

/** The editable columns of the capacitor table, left to right, as a pasted block fills them. */
export const CAPACITOR_COLUMNS = [
  { key: 'valueF', title: 'capacitance', unit: 'F' },
  { key: 'tolerance', title: 'tolerance', unit: '%' },
  { key: 'ratedVoltageV', title: 'rated voltage', unit: 'V' },
  { key: 'partCode', title: 'part code', unit: null },
] as const satisfies ReadonlyArray<{ key: keyof CapacitorPart; title: string; unit: QuantityUnit | '%' | null }>;

export type CapacitorColumnKey = (typeof CAPACITOR_COLUMNS)[number]['key'];

/** Cells a pasted block holds; more is refused, not truncated (a ladder has at most 180 capacitors). */
export const MAX_PASTED_CELLS = 4 * 200;

export { isCellBlock, splitPastedCells } from '../../lib/spreadsheet-cells';

/** A tolerance cell in per cent ("10", "10 %", "±5%") as a fraction; null when it is not a percentage. */
function parsePercent(cell: string): number | null {
  const match = /^±?\s*(\d+(?:\.\d*)?|\.\d+)\s*%?$/.exec(cell.trim());
  return match?.[1] ? Number(match[1]) / 100 : null;
}

export type PasteResult = { ok: true; capacitors: CapacitorPart[]; cellCount: number } | { ok: false; message: string };

/**
 * Fills the capacitor table from a pasted block whose top-left cell lands on capacitor `startRow`, column
 * `startColumn`. Quantities are read as typed ("4n7", "10 nF", "1.6 kV"), tolerances in per cent; an empty cell
 * keeps the value there. Nothing changes unless every cell reads and the block fits the table.
 */
export function pasteIntoCapacitors(
  capacitors: readonly CapacitorPart[],
  text: string,
  startRow: number,
  startColumn: CapacitorColumnKey,
): PasteResult {
  const rows = splitPastedCells(text);
  const cellCount = rows.reduce((sum, row) => sum + row.length, 0);
  if (cellCount > MAX_PASTED_CELLS)
    return { ok: false, message: `${cellCount} cells pasted; the table takes at most ${MAX_PASTED_CELLS}.` };
  const firstColumn = CAPACITOR_COLUMNS.findIndex((column) => column.key === startColumn);
  const widest = Math.max(...rows.map((row) => row.length));
  if (firstColumn + widest > CAPACITOR_COLUMNS.length) {
    const room = CAPACITOR_COLUMNS.length - firstColumn;
    return {
      ok: false,
      message: `${widest} columns pasted from ${CAPACITOR_COLUMNS[firstColumn]?.title}, but the table has ${room} from there (${CAPACITOR_COLUMNS.slice(
        firstColumn,
      )
        .map((c) => c.title)
        .join(', ')}).`,
    };
  }
  if (startRow + rows.length > capacitors.length)
    return {
      ok: false,
      message: `${rows.length} rows pasted from C${startRow + 1}, but the ladder ends at C${capacitors.length}.`,
    };
  const next = capacitors.map((capacitor) => ({ ...capacitor }));
  for (const [r, row] of rows.entries()) {
    const target = next[startRow + r];
    if (!target) continue;
    const name = `C${startRow + r + 1}`;
    for (const [c, rawCell] of row.entries()) {
      const column = CAPACITOR_COLUMNS[firstColumn + c];
      const cell = rawCell.trim();
      if (!column || cell === '') continue;
      if (column.key === 'partCode') {
        target.partCode = cell;
      } else if (column.key === 'tolerance') {
        const fraction = parsePercent(cell);
        if (fraction === null) return { ok: false, message: `${name} tolerance: “${cell}” is not a percentage.` };
        target.tolerance = fraction;
      } else {
        try {
          target[column.key] = parseQuantity(cell, { unit: column.unit });
        } catch (error) {
          const reason = isDomainError(error) ? (error.message.split(';')[0] ?? error.message) : 'not a quantity';
          return { ok: false, message: `${name} ${column.title}: “${cell}”: ${reason}.` };
        }
      }
    }
  }
  return { ok: true, capacitors: next, cellCount };
}
