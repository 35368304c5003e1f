import {
  capacitorGradeFactors,
  capacitorPlaces,
  capacitorRoleChanges,
  type CapacitorPlace,
} from '@ladderwright/shared/multiplier';
import type { CapacitorPart, Topology } from '@ladderwright/shared/designs';

/** Where each capacitor sits in the ladder, or null when the list does not form a ladder of the topology. */
export function capacitorPlacesOf(topology: Topology, capacitors: readonly CapacitorPart[]): CapacitorPlace[] | null {
  return capacitorPlaces(topology, capacitors.length);
}

/** Copies capacitor `fromIndex` (value, tolerance, rating, part code) onto every capacitor above it. */
export function fillDown(capacitors: readonly CapacitorPart[], fromIndex: number): CapacitorPart[] {
  const source = capacitors[fromIndex];
  if (!source) return [...capacitors];
  return capacitors.map((capacitor, i) => (i > fromIndex ? { ...source } : capacitor));
}

/** The capacitors graded from `topStageF` at the top (`capacitorGradeFactors`); unchanged when they form no ladder. */
export function gradeCapacitors(
  topology: Topology,
  capacitors: readonly CapacitorPart[],
  topStageF: number,
): CapacitorPart[] {
  const factors = capacitorGradeFactors(topology, capacitors.length);
  if (!factors) return [...capacitors];
  return capacitors.map((capacitor, i) => ({ ...capacitor, valueF: (factors[i] ?? 1) * topStageF }));
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
  return capacitorRoleChanges(
    { topology: before.topology, capacitorCount: before.capacitors.length },
    { topology: after.topology, capacitorCount: after.capacitors.length },
  ).flatMap((change) => {
    const capacitor = before.capacitors[change.index];
    return capacitor ? [{ ...change, capacitor }] : [];
  });
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
  const from = capacitorPlacesOf(topology, capacitors);
  const to = capacitorPlacesOf(nextTopology, byPosition);
  if (!from || !to) return byPosition;
  return byPosition.map((fallback, i) => {
    const place = to[i];
    const j = place ? from.findIndex((p) => p.column === place.column && p.stage === place.stage) : -1;
    const kept = j >= 0 ? capacitors[j] : undefined;
    return kept ? { ...kept } : fallback;
  });
}
