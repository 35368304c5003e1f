import { REQUIRED_PART_FIELDS } from '@ladderwright/shared/parts';
import { splitPastedCells } from '../../lib/spreadsheet-cells';
import type { PartDraft } from './api/create-part';

/** Rows one paste may turn into parts; a larger sheet goes through the CSV import. Common practice, no source. */
export const MAX_PASTED_PART_ROWS = 200;

export type PartPaste =
  | { kind: 'fill'; draft: PartDraft }
  | { kind: 'rows'; csv: string; rowCount: number }
  | { kind: 'refused'; message: string };

/** A CSV cell: quoted when it holds a comma, a quote or a line break (RFC 4180). */
function csvCell(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * Cells pasted from a spreadsheet into the Add-a-part form at `startField`, filling the form's fields from there
 * left to right as the capacitor table fills its columns. One row fills the form (an empty cell keeps the field);
 * several rows become one part each, as a shelf CSV for the import preview, every row taking the form's other
 * fields (the kind, a cost typed once) where the paste leaves them out. Nothing changes when the block is wider
 * than the fields from `startField` on.
 */
export function pasteIntoPartForm(
  draft: PartDraft,
  fields: readonly { name: string; label: string }[],
  startField: string,
  text: string,
): PartPaste {
  const rows = splitPastedCells(text);
  const from = fields.findIndex((field) => field.name === startField);
  if (from < 0) return { kind: 'refused', message: `${startField} is not a field of this form.` };
  const widest = Math.max(...rows.map((row) => row.length));
  const room = fields.slice(from);
  if (widest > room.length) {
    return {
      kind: 'refused',
      message: `${widest} columns pasted from ${room[0]?.label}, but the form has ${room.length} from there (${room
        .map((field) => field.label)
        .join(', ')}).`,
    };
  }
  if (rows.length > MAX_PASTED_PART_ROWS) {
    return {
      kind: 'refused',
      message: `${rows.length} rows pasted; at most ${MAX_PASTED_PART_ROWS} at once (import a CSV for more).`,
    };
  }
  const pasted = room.slice(0, widest).map((field) => field.name);
  if (rows.length === 1) {
    const next = { ...draft };
    (rows[0] ?? []).forEach((cell, i) => {
      const name = pasted[i];
      if (name && cell.trim() !== '') next[name] = cell.trim();
    });
    return { kind: 'fill', draft: next };
  }
  // The shelf CSV needs its required columns; an empty one is then named on every row by the preview.
  const required: readonly string[] = REQUIRED_PART_FIELDS;
  const kept = ['kind', ...fields.map((field) => field.name)].filter(
    (name) => !pasted.includes(name) && ((draft[name] ?? '').trim() !== '' || required.includes(name)),
  );
  const header = [...kept, ...pasted];
  const lines = rows.map((row) =>
    [...kept.map((name) => draft[name] ?? ''), ...pasted.map((_, i) => (row[i] ?? '').trim())].map(csvCell).join(','),
  );
  return { kind: 'rows', csv: [header.join(','), ...lines].join('\r\n') + '\r\n', rowCount: rows.length };
}
