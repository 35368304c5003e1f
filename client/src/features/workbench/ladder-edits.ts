import { buildLadderNetwork } from '@ladderwright/shared/multiplier';
import type { CapacitorPart, Topology } from '@ladderwright/shared/designs';

/** Column and stage of each capacitor position, as the engine's network of the topology places them. */
export interface CapacitorPlace {
  column: string;
  stage: number;
}

/** Where each capacitor sits in the ladder, or null when the list does not form a ladder of the topology. */
export function capacitorPlaces(topology: Topology, capacitors: readonly CapacitorPart[]): CapacitorPlace[] | null {
  try {
    // Only the positions matter here, so every value is taken as 1 F.
    const network = buildLadderNetwork(
      topology,
      capacitors.map(() => 1),
    );
    return capacitors.map((_, i) => ({ column: network.capColumn[i] ?? '', stage: network.capStage[i] ?? 1 }));
  } catch {
    return null;
  }
}

/** Copies capacitor `fromIndex` (value, tolerance, rating, part code) onto every capacitor above it. */
export function fillDown(capacitors: readonly CapacitorPart[], fromIndex: number): CapacitorPart[] {
  const source = capacitors[fromIndex];
  if (!source) return [...capacitors];
  return capacitors.map((capacitor, i) => (i > fromIndex ? { ...source } : capacitor));
}

/**
 * Grading: larger capacitors at the bottom of the ladder. With n stages, a capacitor of stage k gets
 * (n − k + 1) · `topStageF`, so the top stage keeps `topStageF` and stage 1 gets n times it.
 */
export function gradeCapacitors(
  topology: Topology,
  capacitors: readonly CapacitorPart[],
  topStageF: number,
): CapacitorPart[] {
  const places = capacitorPlaces(topology, capacitors);
  if (!places) return [...capacitors];
  const stageCount = Math.max(...places.map((p) => p.stage));
  return capacitors.map((capacitor, i) => ({
    ...capacitor,
    valueF: (stageCount - (places[i]?.stage ?? 1) + 1) * topStageF,
  }));
}

/** The capacitor list resized to `count`, repeating the top capacitor when it grows. */
export function resizeCapacitors(capacitors: readonly CapacitorPart[], count: number): CapacitorPart[] {
  const top = capacitors[capacitors.length - 1] ?? { valueF: 10e-9, tolerance: 0.1, ratedVoltageV: 1000 };
  return Array.from({ length: count }, (_, i) => ({ ...(capacitors[i] ?? top) }));
}

const columnLabels: Record<string, string> = {
  oscillating: 'oscillating',
  smoothing: 'smoothing',
  'oscillating-a': 'oscillating A',
  'oscillating-b': 'oscillating B',
  bridge: 'bridge half',
};

/** "stage 2, smoothing": a capacitor's place as the table and the confirmations name it. */
export function placeLabel(place: CapacitorPlace | undefined): string {
  return place ? `stage ${place.stage}, ${columnLabels[place.column] ?? place.column}` : '—';
}

/** A capacitor that keeps its list position (and value) but takes another place in the ladder. */
export interface RoleChange {
  index: number;
  from: CapacitorPlace;
  to: CapacitorPlace;
  capacitor: CapacitorPart;
}

/** The capacitors whose place changes when the ladder's shape changes and the list is kept by position. */
export function roleChanges(
  before: { topology: Topology; capacitors: readonly CapacitorPart[] },
  after: { topology: Topology; capacitors: readonly CapacitorPart[] },
): RoleChange[] {
  const from = capacitorPlaces(before.topology, before.capacitors);
  const to = capacitorPlaces(after.topology, after.capacitors);
  if (!from || !to) return [];
  const changes: RoleChange[] = [];
  for (let i = 0; i < Math.min(from.length, to.length); i += 1) {
    const a = from[i];
    const b = to[i];
    const capacitor = before.capacitors[i];
    if (a && b && capacitor && (a.column !== b.column || a.stage !== b.stage))
      changes.push({ index: i, from: a, to: b, capacitor });
  }
  return changes;
}

/**
 * The capacitor list for a new shape with each capacitor kept at its place in the ladder (same column and stage)
 * where the new shape has that place; new places repeat the top capacitor, as `resizeCapacitors` does.
 */
export function resizeKeepingPlaces(
  topology: Topology,
  capacitors: readonly CapacitorPart[],
  nextTopology: Topology,
  count: number,
): CapacitorPart[] {
  const byPosition = resizeCapacitors(capacitors, count);
  const from = capacitorPlaces(topology, capacitors);
  const to = capacitorPlaces(nextTopology, byPosition);
  if (!from || !to) return byPosition;
  return byPosition.map((fallback, i) => {
    const place = to[i];
    const j = place ? from.findIndex((p) => p.column === place.column && p.stage === place.stage) : -1;
    const kept = j >= 0 ? capacitors[j] : undefined;
    return kept ? { ...kept } : fallback;
  });
}
