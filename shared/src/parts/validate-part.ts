import type { PartInput, PartKind } from '../api/parts.types';
import type { FieldIssue } from '../errors';
import { isDomainError } from '../errors';
import { parseQuantity } from '../units';
import type { QuantityUnit } from '../units';
import {
  KIND_MAGNETICS,
  MAGNETICS_FIELDS,
  magneticsCrossIssues,
  magneticsOf,
  magneticsValueIssue,
  parseMagneticsValue,
} from './part-magnetics';

export const PART_KINDS: readonly PartKind[] = ['capacitor', 'diode', 'resistor', 'transistor', 'core', 'wire', 'tape'];

/** Invented shelf codes: capitals, digits and dashes, e.g. `NF-C103-3K`. */
export const PART_CODE_PATTERN = /^[A-Z0-9][A-Z0-9-]{2,39}$/;
const SIZE_PATTERN = /^\d+(\.\d+)?(x\d+(\.\d+)?){0,2}$/;
/** Longest part description: a line of a BOM, not a datasheet. Common practice, no source. */
export const PART_DESCRIPTION_MAX_LENGTH = 500;
/** Longest text in any other part field before it is checked (a size or a quantity is a few characters). */
const PART_TEXT_MAX_LENGTH = 100;

/** The writable fields in CSV column order (the CSV header uses these names). */
export const PART_FIELDS = [
  'code',
  'kind',
  'description',
  'valueSi',
  'tolerance',
  'ratedVoltageV',
  'ratedCurrentA',
  'ratedSurgeCurrentA',
  'ratedPowerW',
  'unitCost',
  'sizeMm',
  ...MAGNETICS_FIELDS,
] as const satisfies readonly (keyof PartInput)[];

export type PartField = (typeof PART_FIELDS)[number];
export const REQUIRED_PART_FIELDS: readonly PartField[] = ['code', 'kind', 'unitCost'];

type NumericField = 'valueSi' | 'ratedVoltageV' | 'ratedCurrentA' | 'ratedSurgeCurrentA' | 'ratedPowerW';

/** Which numeric fields each kind needs (required) and which it may carry; the rest must stay empty. */
const KIND_FIELDS: Record<PartKind, { required: NumericField[]; allowed: NumericField[] }> = {
  capacitor: { required: ['valueSi', 'ratedVoltageV'], allowed: [] },
  diode: { required: ['ratedVoltageV', 'ratedCurrentA'], allowed: ['ratedSurgeCurrentA'] },
  resistor: { required: ['valueSi', 'ratedPowerW'], allowed: ['ratedVoltageV'] },
  transistor: { required: ['ratedVoltageV', 'ratedCurrentA'], allowed: ['ratedPowerW'] },
  core: { required: ['valueSi'], allowed: ['ratedVoltageV'] },
  wire: { required: [], allowed: [] },
  tape: { required: [], allowed: [] },
};

const VALUE_UNIT: Partial<Record<PartKind, QuantityUnit>> = { capacitor: 'F', resistor: 'Ohm', core: 'H' };
const FIELD_UNIT: Record<Exclude<NumericField, 'valueSi'>, QuantityUnit> = {
  ratedVoltageV: 'V',
  ratedCurrentA: 'A',
  ratedSurgeCurrentA: 'A',
  ratedPowerW: 'W',
};

/** The fields a part of this kind may carry, in CSV order (the rest stay empty). */
export function partFieldsFor(kind: PartKind): PartField[] {
  const rules = KIND_FIELDS[kind];
  const numeric: readonly string[] = [...rules.required, ...rules.allowed];
  const magnetics: readonly string[] = KIND_MAGNETICS[kind];
  return PART_FIELDS.filter(
    (field) =>
      ['code', 'kind', 'description', 'unitCost', 'sizeMm'].includes(field) ||
      (field === 'tolerance' && (kind === 'capacitor' || kind === 'resistor' || kind === 'core')) ||
      numeric.includes(field) ||
      magnetics.includes(field),
  );
}

function isBlank(value: unknown): boolean {
  return value === undefined || value === null || (typeof value === 'string' && value.trim() === '');
}

/**
 * Checks and normalises one part from JSON or a CSV row (strings such as "10n", "3 kV", "10%" are parsed
 * into SI numbers). Reports every problem as a field issue; `partial` validates a PATCH (missing fields
 * are left out, `code` and `kind` come from `base`).
 */
export function normalizePart(
  raw: Record<string, unknown>,
  options: { partial?: boolean; base?: PartInput; pathPrefix?: string } = {},
): { part: PartInput | null; issues: FieldIssue[] } {
  const issues: FieldIssue[] = [];
  const prefix = options.pathPrefix ?? '';
  const issue = (field: string, message: string) =>
    issues.push({ path: `${prefix}${field}`, message: `${field} ${message}` });
  const base = options.base;
  const present = (field: PartField) => !options.partial || raw[field] !== undefined;

  for (const key of Object.keys(raw)) {
    if (!(PART_FIELDS as readonly string[]).includes(key) || (options.partial && (key === 'code' || key === 'kind'))) {
      issues.push({ path: `${prefix}${key}`, message: `${key} is not a part field that can be written here` });
    }
  }

  const text = (field: 'code' | 'kind' | 'description' | 'sizeMm'): string => {
    const value = raw[field];
    if (isBlank(value)) return '';
    if (typeof value !== 'string') {
      issue(field, 'must be text');
      return '';
    }
    const maxLength = field === 'description' ? PART_DESCRIPTION_MAX_LENGTH : PART_TEXT_MAX_LENGTH;
    if (value.length > maxLength) {
      issue(field, `must be at most ${maxLength} characters`);
      return '';
    }
    return value.trim();
  };

  const code = options.partial && base ? base.code : text('code').toUpperCase();
  if (!options.partial) {
    if (code === '') issue('code', 'is required');
    else if (!PART_CODE_PATTERN.test(code)) issue('code', 'must be 3-40 capitals, digits or dashes, e.g. NF-C103-3K');
  }
  const kindText = options.partial && base ? base.kind : text('kind').toLowerCase();
  const kind = (PART_KINDS as readonly string[]).includes(kindText) ? (kindText as PartKind) : null;
  if (!options.partial && !kind) {
    issue('kind', kindText === '' ? 'is required' : `must be one of ${PART_KINDS.join(', ')} (got '${kindText}')`);
  }

  const number = (field: NumericField | 'unitCost' | 'tolerance', unit?: QuantityUnit): number | null => {
    const value = raw[field];
    if (isBlank(value)) return null;
    if (typeof value !== 'string' && typeof value !== 'number') {
      issue(field, 'must be a number');
      return null;
    }
    try {
      if (field === 'tolerance' && typeof value === 'string' && value.trim().endsWith('%')) {
        return parseQuantity(value.trim().slice(0, -1), { field }) / 100;
      }
      return parseQuantity(value, unit ? { unit, field } : { field });
    } catch (error) {
      if (!isDomainError(error)) throw error;
      issue(field, `is not a valid quantity: ${error.message}`);
      return null;
    }
  };

  const merged: Partial<PartInput> = { ...base };
  if (!options.partial || raw.description !== undefined) merged.description = text('description');
  if (!options.partial || raw.sizeMm !== undefined) {
    const size = text('sizeMm')
      .toLowerCase()
      .replace(/\s*[x×]\s*/g, 'x');
    if (size !== '' && !SIZE_PATTERN.test(size)) issue('sizeMm', 'must be up to three sizes in mm, e.g. 18x8x14');
    merged.sizeMm = size;
  }
  if (present('unitCost')) {
    const cost = number('unitCost');
    if (cost === null) {
      if (!issues.some((item) => item.path === `${prefix}unitCost`)) issue('unitCost', 'is required');
    } else if (cost < 0) issue('unitCost', 'must not be negative');
    merged.unitCost = cost ?? 0;
  }
  if (present('tolerance')) {
    const tolerance = number('tolerance');
    if (tolerance !== null && !(tolerance > 0 && tolerance < 1)) {
      issue('tolerance', 'must be a fraction between 0 and 1 (0.1 or 10%)');
    }
    merged.tolerance = tolerance;
  }
  const numericFields: NumericField[] = [
    'valueSi',
    'ratedVoltageV',
    'ratedCurrentA',
    'ratedSurgeCurrentA',
    'ratedPowerW',
  ];
  for (const field of numericFields) {
    if (!present(field)) continue;
    const unit = field === 'valueSi' ? (kind ? VALUE_UNIT[kind] : undefined) : FIELD_UNIT[field];
    const value = number(field, unit);
    if (value !== null && !(value > 0)) issue(field, 'must be positive');
    merged[field] = value;
  }

  for (const field of MAGNETICS_FIELDS) {
    if (!present(field)) continue;
    const value = raw[field];
    if (isBlank(value)) {
      merged[field] = null;
      continue;
    }
    if (typeof value !== 'string' && typeof value !== 'number') {
      issue(field, 'must be a number');
      continue;
    }
    if (typeof value === 'string' && value.length > PART_TEXT_MAX_LENGTH) {
      issue(field, `must be at most ${PART_TEXT_MAX_LENGTH} characters`);
      continue;
    }
    try {
      const parsed = parseMagneticsValue(field, value);
      const problem = magneticsValueIssue(field, parsed);
      if (problem) issue(field, problem);
      merged[field] = parsed;
    } catch (error) {
      if (!isDomainError(error)) throw error;
      issue(field, `is not a valid quantity: ${error.message}`);
    }
  }
  for (const { field, message } of magneticsCrossIssues(merged)) {
    if (!issues.some((item) => item.path === `${prefix}${field}`)) issue(field, message);
  }

  if (kind) {
    const needed = KIND_MAGNETICS[kind];
    for (const field of MAGNETICS_FIELDS) {
      const value = merged[field] ?? null;
      const hasOwnIssue = issues.some((item) => item.path === `${prefix}${field}`);
      if (needed.includes(field) && value === null && !hasOwnIssue) issue(field, `is required for a ${kind}`);
      if (!needed.includes(field) && value !== null && !hasOwnIssue) {
        issue(field, `does not apply to a ${kind}; leave it empty`);
      }
    }
    const rules = KIND_FIELDS[kind];
    for (const field of numericFields) {
      const value = merged[field] ?? null;
      const hasOwnIssue = issues.some((item) => item.path === `${prefix}${field}`);
      if (rules.required.includes(field) && value === null && !hasOwnIssue) issue(field, `is required for a ${kind}`);
      if (!rules.required.includes(field) && !rules.allowed.includes(field) && value !== null) {
        issue(field, `does not apply to a ${kind}; leave it empty`);
      }
    }
  }
  if (issues.length > 0 || !kind) return { part: null, issues };
  return {
    part: {
      code,
      kind,
      description: merged.description ?? '',
      valueSi: merged.valueSi ?? null,
      tolerance: merged.tolerance ?? null,
      ratedVoltageV: merged.ratedVoltageV ?? null,
      ratedCurrentA: merged.ratedCurrentA ?? null,
      ratedSurgeCurrentA: merged.ratedSurgeCurrentA ?? null,
      ratedPowerW: merged.ratedPowerW ?? null,
      unitCost: merged.unitCost ?? 0,
      sizeMm: merged.sizeMm ?? '',
      ...magneticsOf(merged),
    },
    issues,
  };
}
