import type { Part, PartKind } from '../api/parts.types';
import type { Design } from '../designs/design.types';
import type { FieldIssue } from '../errors';

/** A shelf part reduced to what the engine reads (any object with these fields will do). */
export type ShelfPart = Pick<
  Part,
  | 'code'
  | 'kind'
  | 'valueSi'
  | 'tolerance'
  | 'ratedVoltageV'
  | 'ratedCurrentA'
  | 'ratedSurgeCurrentA'
  | 'ratedPowerW'
  | 'unitCost'
>;

/** The design paths that may carry a `partCode`, with the kind of part each must be. */
export function partReferences(design: Design): { path: string; code: string; kind: PartKind }[] {
  const references: { path: string; code: string; kind: PartKind }[] = [];
  design.multiplier.capacitors.forEach((capacitor, i) => {
    if (capacitor.partCode)
      references.push({ path: `multiplier.capacitors[${i}].partCode`, code: capacitor.partCode, kind: 'capacitor' });
  });
  if (design.multiplier.diode.partCode) {
    references.push({ path: 'multiplier.diode.partCode', code: design.multiplier.diode.partCode, kind: 'diode' });
  }
  const bleeder = design.outputNetwork.bleeder;
  if (bleeder?.partCode)
    references.push({ path: 'outputNetwork.bleeder.partCode', code: bleeder.partCode, kind: 'resistor' });
  return references;
}

/** Looks up each referenced code; an unknown code or a part of the wrong kind becomes an issue. */
function resolve(design: Design, parts: readonly ShelfPart[]) {
  const byCode = new Map(parts.map((part) => [part.code, part]));
  const issues: FieldIssue[] = [];
  const found = new Map<string, ShelfPart>();
  for (const reference of partReferences(design)) {
    const part = byCode.get(reference.code);
    if (!part) issues.push({ path: reference.path, message: `no part ${reference.code} on the Parts shelf` });
    else if (part.kind !== reference.kind) {
      issues.push({ path: reference.path, message: `${reference.code} is a ${part.kind}, not a ${reference.kind}` });
    } else found.set(reference.path, part);
  }
  return { found, issues };
}

/**
 * Copies the ratings of the shelf parts a design references (by `partCode`) into the design, so that the
 * Checks compare against the shelf: capacitor rated voltage and tolerance (the capacitance stays the
 * design's own), diode PIV, average and surge current, bleeder resistor power and limiting voltage.
 * Returns a new design; the input is not changed. Unknown codes and wrong kinds are reported, not thrown.
 */
export function fillPartRatings(design: Design, parts: readonly ShelfPart[]): { design: Design; issues: FieldIssue[] } {
  const { found, issues } = resolve(design, parts);
  const capacitors = design.multiplier.capacitors.map((capacitor, i) => {
    const part = found.get(`multiplier.capacitors[${i}].partCode`);
    if (!part) return capacitor;
    return {
      ...capacitor,
      ratedVoltageV: part.ratedVoltageV ?? capacitor.ratedVoltageV,
      tolerance: part.tolerance ?? capacitor.tolerance,
    };
  });
  const diodePart = found.get('multiplier.diode.partCode');
  const diode = diodePart
    ? {
        ...design.multiplier.diode,
        ratedPivV: diodePart.ratedVoltageV ?? design.multiplier.diode.ratedPivV,
        ratedAverageCurrentA: diodePart.ratedCurrentA ?? design.multiplier.diode.ratedAverageCurrentA,
        ratedSurgeCurrentA: diodePart.ratedSurgeCurrentA ?? design.multiplier.diode.ratedSurgeCurrentA,
      }
    : design.multiplier.diode;
  const bleederPart = found.get('outputNetwork.bleeder.partCode');
  const bleeder = design.outputNetwork.bleeder;
  const filledBleeder =
    bleeder && bleederPart
      ? {
          ...bleeder,
          ratedPowerW: bleederPart.ratedPowerW ?? bleeder.ratedPowerW,
          limitingVoltageV: bleederPart.ratedVoltageV ?? bleeder.limitingVoltageV,
        }
      : bleeder;
  return {
    design: {
      ...design,
      multiplier: { ...design.multiplier, capacitors, diode },
      outputNetwork: { ...design.outputNetwork, bleeder: filledBleeder },
    },
    issues,
  };
}
