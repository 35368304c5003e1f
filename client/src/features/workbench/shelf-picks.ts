import type { Part } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { fillPartRatings } from '@ladderwright/shared/parts';

/** Where a picked shelf part goes in the design. */
export type PartSlot = { kind: 'capacitor'; index: number } | { kind: 'diode' } | { kind: 'bleeder' };

/**
 * The design with `part` picked for `slot`: its code is set, a capacitor or bleeder takes the part's value,
 * and the ratings come from the shelf through the shared `fillPartRatings`, as the Checks will read them.
 */
export function withShelfPart(design: Design, slot: PartSlot, part: Part, parts: readonly Part[]): Design {
  const next = structuredClone(design);
  if (slot.kind === 'capacitor') {
    const capacitor = next.multiplier.capacitors[slot.index];
    if (!capacitor) return design;
    capacitor.partCode = part.code;
    if (part.valueSi !== null) capacitor.valueF = part.valueSi;
  } else if (slot.kind === 'diode') {
    next.multiplier.diode.partCode = part.code;
  } else {
    const bleeder = next.outputNetwork.bleeder;
    if (!bleeder) return design;
    bleeder.partCode = part.code;
    if (part.valueSi !== null) bleeder.valueOhm = part.valueSi;
  }
  return fillPartRatings(next, parts).design;
}
