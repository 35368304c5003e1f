import type { PartKind } from '../api/parts.types';
import type { Design } from '../designs/design.types';
import type { ShelfPart } from './fill-part-ratings';

export interface BomLine {
  code: string;
  kind: PartKind;
  quantity: number;
  unitCost: number;
  lineCost: number;
}

export interface BomCost {
  lines: BomLine[];
  /** Sum of the priced lines, in the shelf's currency. */
  totalCost: number;
  /** Positions of the ladder with no partCode or a code that is not on the shelf. */
  unpriced: { position: string; quantity: number; code: string | null }[];
}

/**
 * Diodes in the ladder, as the engine's ladder networks build it (shared/src/multiplier/topologies.ts):
 * one per capacitor in a half-wave chain, four per stage in a full-wave cascade, two in a bridge doubler.
 */
function diodeCountOf(design: Design): number {
  const { topology, cellCount, capacitors } = design.multiplier;
  if (topology === 'full-wave') return 4 * cellCount;
  if (topology === 'bridge-doubler') return 2;
  return capacitors.length;
}

/**
 * BOM cost of a design's ladder from the shelf: every capacitor by its own `partCode`, the diode code
 * times the number of diodes of the topology, the bleeder code times its count.
 * Transformer, transistor and board are not in the design document, so they are not counted.
 */
export function bomCost(design: Design, parts: readonly ShelfPart[]): BomCost {
  const byCode = new Map(parts.map((part) => [part.code, part]));
  const quantities = new Map<string, number>();
  const unpriced: BomCost['unpriced'] = [];
  const add = (position: string, code: string | undefined, kind: PartKind, quantity: number) => {
    const part = code ? byCode.get(code) : undefined;
    if (!code || !part || part.kind !== kind) {
      unpriced.push({ position, quantity, code: code ?? null });
      return;
    }
    quantities.set(code, (quantities.get(code) ?? 0) + quantity);
  };
  design.multiplier.capacitors.forEach((capacitor, i) => add(`C${i + 1}`, capacitor.partCode, 'capacitor', 1));
  const diodeCount = diodeCountOf(design);
  add('diodes', design.multiplier.diode.partCode, 'diode', diodeCount);
  const bleeder = design.outputNetwork.bleeder;
  if (bleeder) add('bleeder', bleeder.partCode, 'resistor', bleeder.count);

  const lines: BomLine[] = [...quantities.entries()].map(([code, quantity]) => {
    const part = byCode.get(code) as ShelfPart;
    return { code, kind: part.kind, quantity, unitCost: part.unitCost, lineCost: quantity * part.unitCost };
  });
  // Summed in cents-free floating point; round to 1e-9 so 0.1 + 0.2 shows as 0.3.
  const totalCost = Math.round(lines.reduce((sum, line) => sum + line.lineCost, 0) * 1e9) / 1e9;
  return { lines, totalCost, unpriced };
}
