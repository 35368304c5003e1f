import { describe, expect, it } from 'vitest';
import type { CapacitorPart } from '@ladderwright/shared/designs';
import { capacitorPlacesOf, resizeCapacitors, resizeKeepingPlaces, roleChanges } from './ladder-edits';

const caps = (...nF: number[]): CapacitorPart[] =>
  nF.map((n) => ({ valueF: n * 1e-9, tolerance: 0.1, ratedVoltageV: 1000 }));

// Capacitor order of the half-wave cascade as the design document defines it (design.types.ts): an even cell
// count starts in the oscillating column, an odd one with a half-wave rectifier cell in the smoothing column.
describe('capacitor roles when the cell count changes', () => {
  it('names the capacitors that move column when a four-cell ladder becomes a tripler', () => {
    const before = { topology: 'half-wave' as const, capacitors: caps(40, 30, 20, 10) };
    const after = { topology: 'half-wave' as const, capacitors: resizeCapacitors(before.capacitors, 3) };
    const changes = roleChanges(before, after);
    expect(changes.length).toBeGreaterThan(0);
    expect(changes[0]?.index).toBe(0);
    expect(changes[0]?.from.column).toBe('oscillating');
    expect(changes[0]?.to.column).toBe('smoothing');
  });

  it('finds no moves when cells are added to an even ladder', () => {
    const before = { topology: 'half-wave' as const, capacitors: caps(40, 30, 20, 10) };
    const after = { topology: 'half-wave' as const, capacitors: resizeCapacitors(before.capacitors, 6) };
    expect(roleChanges(before, after)).toEqual([]);
  });

  it('keeps each value at its place in the ladder when asked to', () => {
    const capacitors = caps(40, 30, 20, 10);
    const next = resizeKeepingPlaces('half-wave', capacitors, 'half-wave', 3);
    const from = capacitorPlacesOf('half-wave', capacitors) ?? [];
    const to = capacitorPlacesOf('half-wave', next) ?? [];
    next.forEach((capacitor, i) => {
      const j = from.findIndex((p) => p.column === to[i]?.column && p.stage === to[i]?.stage);
      if (j >= 0) expect(capacitor.valueF).toBe(capacitors[j]?.valueF);
    });
    expect(next).toHaveLength(3);
  });
});
