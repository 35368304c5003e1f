import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import Papa from 'papaparse';
import { Sequelize } from 'sequelize-typescript';
import type { PartImportResult, PartImportRow } from '@ladderwright/shared/api';
import { DomainError, MAX_FIELD_ISSUES, capIssues } from '@ladderwright/shared/errors';
import {
  csvCellNeedsQuotes,
  neutraliseCsvCell,
  normalizePart,
  PART_FIELDS,
  REQUIRED_PART_FIELDS,
} from '@ladderwright/shared/parts';
import { PartModel } from './part.model';
import { PartsService } from './parts.service';

export const PARTS_CSV_MAX_BYTES = 512 * 1024;
export const PARTS_CSV_MAX_ROWS = 5000;

type ImportError = PartImportResult['errors'][number];

/** The first MAX_FIELD_ISSUES errors of an import and, past them, one line counting the rest. */
function capErrors(errors: ImportError[]): ImportError[] {
  if (errors.length <= MAX_FIELD_ISSUES) return errors;
  const rest = errors.length - MAX_FIELD_ISSUES;
  const message = `and ${rest} more problem${rest === 1 ? '' : 's'} not listed`;
  return [...errors.slice(0, MAX_FIELD_ISSUES), { line: 0, column: 'file', path: 'file', message }];
}

/** Parts shelf CSV: import (all rows valid or nothing written) and export (spreadsheet-safe cells). */
@Injectable()
export class PartsCsvService {
  constructor(
    @InjectModel(PartModel) private readonly parts: typeof PartModel,
    private readonly shelf: PartsService,
    private readonly sequelize: Sequelize,
  ) {}

  /**
   * Reads a shelf CSV (header row of field names, then one part per line). Every row is checked; codes
   * already on the shelf become updates. With `dryRun` false and no errors, all rows are written in one
   * transaction; with errors nothing is written and the errors are thrown as one 400.
   */
  async import(projectId: string, text: string, dryRun: boolean): Promise<PartImportResult> {
    // Rows past the limit (plus the header and a blank line) are not even parsed.
    const parsed = Papa.parse<string[]>(text, {
      header: false,
      skipEmptyLines: false,
      preview: PARTS_CSV_MAX_ROWS + 2,
    });
    const rows = parsed.data;
    const header = (rows[0] ?? []).map((cell) => cell.trim());
    const headerIssues: ImportError[] = [];
    const push = (list: ImportError[], line: number, column: string, message: string) =>
      list.push({ line, column, path: `line ${line}, ${column}`, message: `line ${line}, ${column}: ${message}` });
    if (header.length > PART_FIELDS.length) {
      throw new DomainError(
        'invalid_argument',
        `The CSV header has ${header.length} columns; a Parts shelf CSV has at most ${PART_FIELDS.length}: ${PART_FIELDS.join(', ')}`,
        'file',
      );
    }
    header.forEach((name) => {
      if (!(PART_FIELDS as readonly string[]).includes(name)) {
        push(headerIssues, 1, name || '(empty)', `unknown column; the columns are ${PART_FIELDS.join(', ')}`);
      }
    });
    for (const required of REQUIRED_PART_FIELDS) {
      if (!header.includes(required)) push(headerIssues, 1, required, 'required column is missing');
    }
    if (new Set(header).size !== header.length) push(headerIssues, 1, 'header', 'a column appears twice');
    if (headerIssues.length > 0) this.refuse('The CSV header is not a Parts shelf header', headerIssues);

    const dataRows = rows
      .map((cells, index) => ({ cells, line: index + 1 }))
      .slice(1)
      .filter(({ cells }) => cells.some((cell) => cell.trim() !== ''));
    if (dataRows.length === 0) throw new DomainError('invalid_argument', 'The CSV has a header but no parts', 'file');
    if (dataRows.length > PARTS_CSV_MAX_ROWS) {
      throw new DomainError(
        'invalid_argument',
        `The CSV has more than ${PARTS_CSV_MAX_ROWS} parts, the limit per file`,
        'file',
      );
    }

    const existing = new Map((await this.parts.findAll({ where: { projectId } })).map((part) => [part.code, part]));
    const errors: ImportError[] = [];
    const result: PartImportRow[] = [];
    const firstLineOf = new Map<string, number>();
    for (const { cells, line } of dataRows) {
      if (cells.length !== header.length) {
        push(errors, line, 'row', `has ${cells.length} cells where the header has ${header.length}`);
        continue;
      }
      const record = Object.fromEntries(header.map((name, i) => [name, cells[i] ?? '']));
      const { part, issues } = normalizePart(record);
      for (const issue of issues) push(errors, line, issue.path, issue.message);
      if (!part) continue;
      const earlier = firstLineOf.get(part.code);
      if (earlier !== undefined) {
        push(errors, line, 'code', `${part.code} already appears on line ${earlier}`);
        continue;
      }
      firstLineOf.set(part.code, line);
      const stored = existing.get(part.code);
      if (stored && stored.kind !== part.kind) {
        push(errors, line, 'kind', `${part.code} is on the shelf as a ${stored.kind}; a code keeps its kind`);
        continue;
      }
      result.push({ line, action: stored ? 'update' : 'create', part });
    }
    if (errors.length > 0 && !dryRun)
      this.refuse(`The CSV has ${errors.length} problem(s); nothing was written`, errors);
    if (errors.length > 0 || dryRun) return { dryRun, written: false, rows: result, errors: capErrors(errors) };

    await this.sequelize.transaction(async (transaction) => {
      for (const row of result) {
        const stored = existing.get(row.part.code);
        if (stored) await stored.update(row.part, { transaction });
        else await this.parts.create({ projectId, ...row.part }, { transaction });
      }
    });
    return { dryRun, written: true, rows: result, errors: [] };
  }

  /** The shelf as CSV in the import layout; cells that a spreadsheet would run as formulas are neutralised. */
  async export(projectId: string): Promise<string> {
    const parts = await this.shelf.list(projectId);
    const data = parts.map((part) => PART_FIELDS.map((field) => neutraliseCsvCell(part[field])));
    return Papa.unparse({ fields: [...PART_FIELDS], data }, { newline: '\r\n', quotes: csvCellNeedsQuotes });
  }

  private refuse(message: string, errors: ImportError[]): never {
    throw new DomainError(
      'invalid_argument',
      `${message}. First: ${errors[0]?.message ?? ''}`,
      errors[0]?.path ?? 'file',
      capIssues(
        errors.map(({ path, message: text }) => ({ path, message: text })),
        'file',
      ),
    );
  }
}
