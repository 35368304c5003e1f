import type { Part } from '@ladderwright/shared/api';
import { magneticsOf } from '@ladderwright/shared/parts';

const stamp = '2025-01-01T00:00:00.000Z';

/** A Parts shelf row for component tests: the given fields, every rating empty otherwise. */
export function shelfPart(fields: Partial<Part> & Pick<Part, 'code' | 'kind'>): Part {
  return {
    id: fields.code,
    projectId: 'p1',
    description: '',
    valueSi: null,
    tolerance: null,
    ratedVoltageV: null,
    ratedCurrentA: null,
    ratedSurgeCurrentA: null,
    ratedPowerW: null,
    unitCost: 1,
    sizeMm: '',
    ...magneticsOf({}),
    createdAt: stamp,
    updatedAt: stamp,
    ...fields,
  };
}
