import type { Topology } from '../designs/design.types';
import { buildLadderNetwork } from './topologies';

/** Column and stage of one capacitor position, as the engine's network of the topology places it. */
export interface CapacitorPlace {
  column: string;
  stage: number;
}

/** A capacitor that keeps its list position (and value) but takes another place in the ladder. */
export interface CapacitorRoleChange {
  /** 0-based position in the capacitor list (C1 is 0). */
  index: number;
  from: CapacitorPlace;
  to: CapacitorPlace;
}

/** Where each of `count` capacitors sits in a ladder of `topology`, or null when that count is no such ladder. */
export function capacitorPlaces(topology: Topology, count: number): CapacitorPlace[] | null {
  try {
    // Only the positions matter here, so every value is taken as 1 F.
    const network = buildLadderNetwork(topology, new Array<number>(count).fill(1));
    return Array.from({ length: count }, (_, i) => ({
      column: network.capColumn[i] ?? '',
      stage: network.capStage[i] ?? 1,
    }));
  } catch {
    return null;
  }
}

/**
 * Grading: larger capacitors at the bottom of the ladder. With n stages, the capacitor of stage k takes
 * (n − k + 1) times the top stage's value, so the top stage keeps it and stage 1 gets n times it (J. Lux,
 * "Cockcroft Walton Voltage Multipliers", read). The factor of each of `count` capacitors (list order), or
 * null when that count is no ladder of `topology`.
 */
export function capacitorGradeFactors(topology: Topology, count: number): number[] | null {
  const places = capacitorPlaces(topology, count);
  if (!places) return null;
  const stageCount = Math.max(...places.map((p) => p.stage));
  return places.map((place) => stageCount - place.stage + 1);
}

/**
 * The capacitors that sit elsewhere in the ladder after a change of shape when the list is kept by position:
 * for each position present in both, a change of column or stage. (Half-wave: an even cell count starts in the
 * oscillating column, an odd one in the smoothing column, so four cells made three move C1.)
 */
export function capacitorRoleChanges(
  before: { topology: Topology; capacitorCount: number },
  after: { topology: Topology; capacitorCount: number },
): CapacitorRoleChange[] {
  const from = capacitorPlaces(before.topology, before.capacitorCount);
  const to = capacitorPlaces(after.topology, after.capacitorCount);
  if (!from || !to) return [];
  const changes: CapacitorRoleChange[] = [];
  for (let index = 0; index < Math.min(from.length, to.length); index += 1) {
    const a = from[index];
    const b = to[index];
    if (a && b && (a.column !== b.column || a.stage !== b.stage)) changes.push({ index, from: a, to: b });
  }
  return changes;
}
