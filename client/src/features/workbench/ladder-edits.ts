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
