/** Capacitors a topology needs for a cell count (see design.types.ts for the order). */
export function capacitorCountFor(topology: string, cellCount: number): number {
  if (topology === 'full-wave') return 3 * cellCount;
  return cellCount;
}
