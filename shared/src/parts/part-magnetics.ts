import type { PartKind, PartMagnetics } from '../api/parts.types';
import { DomainError } from '../errors';
import { parseQuantity } from '../units';

/** The magnetics fields in CSV column order: a core's, then a wire's, then a tape's. */
export const MAGNETICS_FIELDS = [
  'coreAreaM2',
  'corePathLengthM',
  'coreVolumeM3',
  'windowAreaM2',
  'bobbinBreadthM',
  'bobbinHeightM',
  'meanTurnLengthM',
  'saturationFluxDensity25T',
  'saturationFluxDensity100T',
  'steinmetzK',
  'steinmetzAlpha',
  'steinmetzBeta',
  'copperDiameterM',
  'overallDiameterM',
  'enamelGrade',
  'breakdownVoltageV',
  'thicknessM',
  'dielectricStrengthVPerM',
] as const satisfies readonly (keyof PartMagnetics)[];

export type MagneticsField = (typeof MAGNETICS_FIELDS)[number];

/** How a magnetics field is typed: a length, an area, a volume, a flux density, a field strength or a plain number. */
type MagneticsQuantity = 'length' | 'area' | 'volume' | 'fluxDensity' | 'voltage' | 'fieldStrength' | 'number';

interface MagneticsFieldSpec {
  /** The kind of part the field belongs to. */
  kind: 'core' | 'wire' | 'tape';
  /** What a person reads beside the field, and an example as datasheets write it. */
  label: string;
  example: string;
  quantity: MagneticsQuantity;
  /** Domain bounds in SI, inclusive. */
  min: number;
  max: number;
  /** How the bounds read in a message (the units datasheets use). */
  range: string;
  isInteger?: boolean;
}

/**
 * Bounds of the magnetics fields: the cores, wires and tapes of small step-up transformers (a few watts), with
 * room either side. A value outside is almost always a unit slip (mm² typed as m²). Common practice, no source.
 */
export const MAGNETICS_FIELD_SPECS: Readonly<Record<MagneticsField, MagneticsFieldSpec>> = {
  coreAreaM2: {
    kind: 'core',
    label: 'Effective area Ae',
    example: '43.3 mm²',
    quantity: 'area',
    min: 1e-7,
    max: 1e-2,
    range: '0.1 mm² to 10,000 mm²',
  },
  corePathLengthM: {
    kind: 'core',
    label: 'Path length le',
    example: '26 mm',
    quantity: 'length',
    min: 1e-3,
    max: 1,
    range: '1 mm to 1 m',
  },
  coreVolumeM3: {
    kind: 'core',
    label: 'Volume Ve',
    example: '1120 mm³',
    quantity: 'volume',
    min: 1e-10,
    max: 1e-3,
    range: '0.1 mm³ to 1,000,000 mm³',
  },
  windowAreaM2: {
    kind: 'core',
    label: 'Winding area (bobbin)',
    example: '15.8 mm²',
    quantity: 'area',
    min: 1e-7,
    max: 1e-2,
    range: '0.1 mm² to 10,000 mm²',
  },
  bobbinBreadthM: {
    kind: 'core',
    label: 'Bobbin winding breadth',
    example: '7.2 mm',
    quantity: 'length',
    min: 1e-4,
    max: 0.5,
    range: '0.1 mm to 500 mm',
  },
  bobbinHeightM: {
    kind: 'core',
    label: 'Bobbin winding height',
    example: '2.2 mm',
    quantity: 'length',
    min: 1e-4,
    max: 0.2,
    range: '0.1 mm to 200 mm',
  },
  meanTurnLengthM: {
    kind: 'core',
    label: 'Mean length per turn',
    example: '37 mm',
    quantity: 'length',
    min: 1e-3,
    max: 1,
    range: '1 mm to 1 m',
  },
  saturationFluxDensity25T: {
    kind: 'core',
    label: 'Bsat at 25 °C',
    example: '490 mT',
    quantity: 'fluxDensity',
    min: 0.05,
    max: 2.5,
    range: '50 mT to 2.5 T',
  },
  saturationFluxDensity100T: {
    kind: 'core',
    label: 'Bsat at 100 °C',
    example: '390 mT',
    quantity: 'fluxDensity',
    min: 0.05,
    max: 2.5,
    range: '50 mT to 2.5 T',
  },
  steinmetzK: {
    kind: 'core',
    label: 'Steinmetz k',
    example: '2.5',
    quantity: 'number',
    min: 1e-9,
    max: 1e9,
    range: '1e-9 to 1e9 (W/m³ with f in Hz, B in T)',
  },
  steinmetzAlpha: {
    kind: 'core',
    label: 'Steinmetz α',
    example: '1.4',
    quantity: 'number',
    min: 1,
    max: 3,
    range: '1 to 3',
  },
  steinmetzBeta: {
    kind: 'core',
    label: 'Steinmetz β',
    example: '2.5',
    quantity: 'number',
    min: 1,
    max: 4,
    range: '1 to 4',
  },
  copperDiameterM: {
    kind: 'wire',
    label: 'Copper diameter',
    example: '0.1 mm',
    quantity: 'length',
    min: 1e-5,
    max: 5e-3,
    range: '10 µm to 5 mm',
  },
  overallDiameterM: {
    kind: 'wire',
    label: 'Diameter over enamel',
    example: '0.125 mm',
    quantity: 'length',
    min: 1e-5,
    max: 6e-3,
    range: '10 µm to 6 mm',
  },
  enamelGrade: {
    kind: 'wire',
    label: 'Enamel grade',
    example: '2',
    quantity: 'number',
    min: 1,
    max: 3,
    range: '1 to 3',
    isInteger: true,
  },
  breakdownVoltageV: {
    kind: 'wire',
    label: 'Breakdown voltage',
    example: '1 kV',
    quantity: 'voltage',
    min: 10,
    max: 1e5,
    range: '10 V to 100 kV',
  },
  thicknessM: {
    kind: 'tape',
    label: 'Thickness',
    example: '25 µm',
    quantity: 'length',
    min: 1e-6,
    max: 2e-3,
    range: '1 µm to 2 mm',
  },
  dielectricStrengthVPerM: {
    kind: 'tape',
    label: 'Dielectric strength',
    example: '100 kV/mm',
    quantity: 'fieldStrength',
    min: 1e6,
    max: 1e9,
    range: '1 kV/mm to 1000 kV/mm',
  },
};

/** The magnetics fields each kind needs; every other magnetics field must stay empty for it. */
export const KIND_MAGNETICS: Readonly<Record<PartKind, readonly MagneticsField[]>> = {
  capacitor: [],
  diode: [],
  resistor: [],
  transistor: [],
  core: MAGNETICS_FIELDS.filter((field) => MAGNETICS_FIELD_SPECS[field].kind === 'core'),
  wire: MAGNETICS_FIELDS.filter((field) => MAGNETICS_FIELD_SPECS[field].kind === 'wire'),
  tape: MAGNETICS_FIELDS.filter((field) => MAGNETICS_FIELD_SPECS[field].kind === 'tape'),
};

const NUMBER = String.raw`[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?`;
const LENGTH_PREFIX: Readonly<Record<string, number>> = { '': 1, c: 1e-2, m: 1e-3, u: 1e-6, µ: 1e-6, μ: 1e-6 };
const areaPattern = new RegExp(String.raw`^(${NUMBER})\s*(?:([cmuµμ]?)m(?:²|2|\^2))?$`);
const volumePattern = new RegExp(String.raw`^(${NUMBER})\s*(?:([cmuµμ]?)m(?:³|3|\^3))?$`);
const strengthPattern = /^(.+?)\s*V\s*\/\s*([cmuµμ]?)m$/;

function refuse(field: string, text: string, example: string): never {
  throw new DomainError('invalid_quantity', `"${text}": expected e.g. ${example}`, field);
}

/** A length, area or volume with an optional metric prefix on the metre, raised to the power. */
function parsePower(field: string, text: string, pattern: RegExp, power: number, example: string): number {
  const match = pattern.exec(text.trim());
  if (!match) refuse(field, text, example);
  const scale = LENGTH_PREFIX[match[2] ?? ''] ?? 1;
  return Number((Number(match[1]) * scale ** power).toPrecision(15));
}

/**
 * Parses one magnetics field as engineers type it into SI: "19.8 mm²" (or mm2, mm^2, a bare number in m²),
 * "1240 mm³", "31 mm", "390 mT", "100 kV/mm", "3 kV", plain numbers for Steinmetz coefficients and the grade.
 */
export function parseMagneticsValue(field: MagneticsField, value: string | number): number {
  if (typeof value === 'number') return parseQuantity(value, { field });
  const text = value.trim();
  switch (MAGNETICS_FIELD_SPECS[field].quantity) {
    case 'length':
      return parseQuantity(text, { unit: 'm', field });
    case 'area':
      return parsePower(field, text, areaPattern, 2, '"19.8 mm²" or "19.8 mm2"');
    case 'volume':
      return parsePower(field, text, volumePattern, 3, '"1240 mm³" or "1240 mm3"');
    case 'fluxDensity':
      return parseQuantity(text.replace(/\s*T$/, ''), { field });
    case 'voltage':
      return parseQuantity(text, { unit: 'V', field });
    case 'fieldStrength': {
      const match = strengthPattern.exec(text);
      if (!match) return parseQuantity(text, { field });
      const volts = parseQuantity(`${match[1] ?? ''}V`, { unit: 'V', field });
      return Number((volts / (LENGTH_PREFIX[match[2] ?? ''] ?? 1)).toPrecision(15));
    }
    case 'number':
      return parseQuantity(text, { field });
  }
}

/** Why a parsed magnetics value is out of its domain, or null when it is within. */
export function magneticsValueIssue(field: MagneticsField, value: number): string | null {
  const spec = MAGNETICS_FIELD_SPECS[field];
  if (spec.isInteger && !Number.isInteger(value)) return `must be a whole number from ${spec.range}`;
  if (!(value >= spec.min && value <= spec.max)) return `must be from ${spec.range}`;
  return null;
}

/** Rules across the magnetics fields of one part (the enamel is over the copper; Ve near Ae·le). */
export function magneticsCrossIssues(part: Partial<PartMagnetics>): { field: MagneticsField; message: string }[] {
  const issues: { field: MagneticsField; message: string }[] = [];
  // A value outside its own domain is reported by itself; comparing it with others would only add noise.
  const usable = (field: MagneticsField) => {
    const value = part[field];
    return value != null && magneticsValueIssue(field, value) === null ? value : null;
  };
  const copper = usable('copperDiameterM');
  const overall = usable('overallDiameterM');
  if (copper !== null && overall !== null && !(overall > copper)) {
    issues.push({ field: 'overallDiameterM', message: 'must be larger than copperDiameterM (it includes the enamel)' });
  }
  const area = usable('coreAreaM2');
  const path = usable('corePathLengthM');
  const volume = usable('coreVolumeM3');
  // Ve = Ae·le by the definition of the effective parameters (IEC 60205, from memory); datasheets round.
  if (area !== null && path !== null && volume !== null) {
    const ratio = volume / (area * path);
    if (ratio < 0.8 || ratio > 1.25) {
      issues.push({
        field: 'coreVolumeM3',
        message: `must be close to coreAreaM2 × corePathLengthM (Ve = Ae·le); it is ${ratio.toFixed(2)}× that`,
      });
    }
  }
  return issues;
}

/** The magnetics fields of a part (or of anything carrying them, such as a model row), missing ones as null. */
export function magneticsOf(source: Partial<Record<MagneticsField, number | null>>): PartMagnetics {
  const result = {} as Record<MagneticsField, number | null>;
  for (const field of MAGNETICS_FIELDS) result[field] = source[field] ?? null;
  return result;
}
