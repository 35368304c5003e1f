import type { FieldIssue } from '../errors';

/** What sits on the Parts shelf. A transformer core is `core`. */
export type PartKind = 'capacitor' | 'diode' | 'resistor' | 'transistor' | 'core';

/**
 * One shelf part, SI units. Which ratings apply depends on `kind`:
 * - capacitor: valueSi = capacitance (F), ratedVoltageV = rated DC voltage.
 * - diode: ratedVoltageV = PIV, ratedCurrentA = average forward current, ratedSurgeCurrentA = surge.
 * - resistor: valueSi = resistance (Ω), ratedPowerW, ratedVoltageV = limiting element voltage.
 * - transistor: ratedVoltageV = collector-emitter voltage, ratedCurrentA = collector current, ratedPowerW.
 * - core: valueSi = inductance factor AL (H per turn²), ratedVoltageV = winding insulation (hipot) rating.
 * `unitCost` is a plain number in the team's currency; `sizeMm` is the body size, e.g. `18x8x14`.
 */
export interface Part {
  id: string;
  projectId: string;
  code: string;
  kind: PartKind;
  description: string;
  valueSi: number | null;
  /** Fractional, e.g. 0.1 for ±10 %. */
  tolerance: number | null;
  ratedVoltageV: number | null;
  ratedCurrentA: number | null;
  ratedSurgeCurrentA: number | null;
  ratedPowerW: number | null;
  unitCost: number;
  sizeMm: string;
  createdAt: string;
  updatedAt: string;
}

/** The fields a client writes; POST takes all required ones, PATCH any subset (except `code`, `kind`). */
export type PartInput = Pick<
  Part,
  | 'code'
  | 'kind'
  | 'description'
  | 'valueSi'
  | 'tolerance'
  | 'ratedVoltageV'
  | 'ratedCurrentA'
  | 'ratedSurgeCurrentA'
  | 'ratedPowerW'
  | 'unitCost'
  | 'sizeMm'
>;

export type CreatePartRequest = PartInput;
export type UpdatePartRequest = Partial<Omit<PartInput, 'code' | 'kind'>>;

/** GET /api/projects/:projectId/parts query. */
export interface PartListQuery {
  kind?: PartKind;
  /** Matches code or description, case-insensitive. */
  q?: string;
  /** Only parts rated at least this voltage (V). */
  minVoltageV?: number;
}

/** One CSV row in an import preview: `line` is the 1-based line of the file (the header is line 1). */
export interface PartImportRow {
  line: number;
  action: 'create' | 'update';
  part: PartInput;
}

/** POST .../parts/import?dryRun=true|false. Nothing is written unless `errors` is empty. */
export interface PartImportResult {
  dryRun: boolean;
  written: boolean;
  rows: PartImportRow[];
  /** `path` is `line <n>, <column>`; `line` is the file line. */
  errors: (FieldIssue & { line: number; column: string })[];
}
