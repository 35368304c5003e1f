import type { FieldIssue } from '../errors';

/** What sits on the Parts shelf. A transformer core is `core`; magnet wire `wire`; insulation tape `tape`. */
export type PartKind = 'capacitor' | 'diode' | 'resistor' | 'transistor' | 'core' | 'wire' | 'tape';

/**
 * The magnetics fields of a shelf part, SI units, null where the kind does not use them.
 * - core (with its bobbin): effective area Ae, path length le, volume Ve, winding window area and the bobbin's
 *   winding breadth and height, mean length per turn, saturation flux density of the material at 25 and 100 °C,
 *   Steinmetz coefficients of the material (Pv in W/m³ = k · f^α · B^β, f in Hz, B peak in T).
 * - wire: copper diameter, diameter over the enamel, enamel grade (IEC 60317: 1, 2 or 3), breakdown voltage
 *   between two twisted wires.
 * - tape: thickness and dielectric strength.
 */
export interface PartMagnetics {
  coreAreaM2: number | null;
  corePathLengthM: number | null;
  coreVolumeM3: number | null;
  windowAreaM2: number | null;
  bobbinBreadthM: number | null;
  bobbinHeightM: number | null;
  meanTurnLengthM: number | null;
  saturationFluxDensity25T: number | null;
  saturationFluxDensity100T: number | null;
  steinmetzK: number | null;
  steinmetzAlpha: number | null;
  steinmetzBeta: number | null;
  copperDiameterM: number | null;
  overallDiameterM: number | null;
  enamelGrade: number | null;
  breakdownVoltageV: number | null;
  thicknessM: number | null;
  dielectricStrengthVPerM: number | null;
}

/**
 * One shelf part, SI units. Which ratings apply depends on `kind`:
 * - capacitor: valueSi = capacitance (F), ratedVoltageV = rated DC voltage.
 * - diode: ratedVoltageV = PIV, ratedCurrentA = average forward current, ratedSurgeCurrentA = surge.
 * - resistor: valueSi = resistance (Ω), ratedPowerW, ratedVoltageV = limiting element voltage.
 * - transistor: ratedVoltageV = collector-emitter voltage, ratedCurrentA = collector current, ratedPowerW.
 * - core: valueSi = ungapped inductance factor AL (H per turn²), tolerance = of AL, ratedVoltageV = the bobbin's
 *   insulation (hipot) rating; the core's geometry and material in the `PartMagnetics` fields.
 * - wire, tape: the `PartMagnetics` fields only; unitCost is per metre.
 * `unitCost` is a plain number in the team's currency; `sizeMm` is the body size, e.g. `18x8x14`.
 */
export interface Part extends PartMagnetics {
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
  | keyof PartMagnetics
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
