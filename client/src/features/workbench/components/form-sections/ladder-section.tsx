import { lazy, memo, Suspense, useState } from 'react';
import { Select, Stack, Text } from '@mantine/core';
import { NumberField } from '../../../../components/number-field';
import { capacitorCountFor, DIODE_MODEL_DEFAULTS, type DiodePart, type Topology } from '@ladderwright/shared/designs';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder, optionalBinder, type Edit } from '../../document-path';
import { resizeCapacitors, resizeKeepingPlaces, roleChanges, type RoleChange } from '../../ladder-edits';
import { CapacitorTable } from '../capacitor-table';
import { PartCodeInput } from '../part-code-input';
import type { SectionProps, ShelfProps } from './form-section.types';
import { ModelDetails } from './model-details';

// The dialog opens only on a change of shape that moves capacitors: it loads then, not with the Workbench.
const CapacitorMoveDialog = lazy(() =>
  import('./capacitor-move-dialog').then((module) => ({ default: module.CapacitorMoveDialog })),
);

const topologies: Array<{ value: Topology; label: string }> = [
  { value: 'half-wave', label: 'half-wave cascade' },
  { value: 'full-wave', label: 'full-wave (symmetrical)' },
  { value: 'bridge-doubler', label: 'bridge doubler' },
];

interface PendingShape {
  topology: Topology;
  cellCount: number;
  changes: RoleChange[];
}

/**
 * Topology, cell count, the capacitor table and the diodes. A change of shape that would move capacitors to
 * other places in the ladder (a four-cell ladder made a tripler moves C1 from the oscillating to the smoothing
 * column) asks first, naming each one, and offers to keep the values at their places instead.
 */
export function LadderSection({
  document,
  edit,
  issue,
  issues,
  parts,
  onPickPart,
}: SectionProps & ShelfProps & { issues: Readonly<Record<string, string>> }) {
  const m = document.multiplier;
  const [pending, setPending] = useState<PendingShape | null>(null);
  const applyShape = (topology: Topology, cellCount: number, isKeepingPlaces: boolean) =>
    edit((d) => {
      const count = capacitorCountFor(topology, cellCount);
      d.multiplier.capacitors = isKeepingPlaces
        ? resizeKeepingPlaces(d.multiplier.topology, d.multiplier.capacitors, topology, count)
        : resizeCapacitors(d.multiplier.capacitors, count);
      d.multiplier.topology = topology;
      d.multiplier.cellCount = cellCount;
    });
  const setShape = (topology: Topology, requestedCount: number) => {
    const cellCount = topology === 'bridge-doubler' ? 2 : requestedCount;
    const next = resizeCapacitors(m.capacitors, capacitorCountFor(topology, cellCount));
    const changes = roleChanges(m, { topology, capacitors: next });
    if (changes.length > 0) setPending({ topology, cellCount, changes });
    else applyShape(topology, cellCount, false);
  };
  return (
    <Stack gap="sm">
      <FieldGrid>
        <Select
          label="Topology"
          value={m.topology}
          allowDeselect={false}
          data={topologies}
          onChange={(v) => v && setShape(v, m.cellCount)}
          error={issue('multiplier.topology')}
        />
        <NumberField
          label={m.topology === 'full-wave' ? 'Stages' : 'Cells'}
          value={m.cellCount}
          min={1}
          max={60}
          allowDecimal={false}
          disabled={m.topology === 'bridge-doubler'}
          error={issue('multiplier.cellCount')}
          onChange={(v) => {
            const count = Number(v);
            if (Number.isInteger(count) && count >= 1 && count <= 60 && count !== m.cellCount)
              setShape(m.topology, count);
          }}
        />
      </FieldGrid>
      {issue('multiplier.capacitors') && (
        <Text size="sm" c="red" role="alert">
          {issue('multiplier.capacitors')}
        </Text>
      )}
      <CapacitorTable
        topology={m.topology}
        capacitors={m.capacitors}
        issues={issues}
        parts={parts}
        onPickPart={(index, part) => onPickPart({ kind: 'capacitor', index }, part)}
        onChange={(capacitors, key) =>
          edit((d) => {
            d.multiplier.capacitors = capacitors;
          }, key)
        }
      />
      <DiodeFields diode={m.diode} edit={edit} issue={issue} parts={parts} onPickPart={onPickPart} />
      {pending && (
        <Suspense fallback={null}>
          <CapacitorMoveDialog
            cellCount={pending.cellCount}
            isFullWave={pending.topology === 'full-wave'}
            topologyLabel={topologies.find((t) => t.value === pending.topology)?.label ?? pending.topology}
            changes={pending.changes}
            onCancel={() => setPending(null)}
            onApply={(isKeepingPlaces) => {
              applyShape(pending.topology, pending.cellCount, isKeepingPlaces);
              setPending(null);
            }}
          />
        </Suspense>
      )}
    </Stack>
  );
}

/** The ladder diodes' optional model fields in the order of their SPICE card. */
const diodeModelKeys = [
  'junctionCapacitanceF',
  'junctionPotentialV',
  'gradingCoefficient',
  'breakdownVoltageV',
  'breakdownCurrentA',
] as const;

/**
 * The diodes' part code and ratings; a separate memoized part, so typing in the capacitor table does not render it
 * (the edit, issue and shelf functions keep their identity while the diode is unchanged).
 */
const DiodeFields = memo(function DiodeFields({
  diode,
  edit,
  issue,
  parts,
  onPickPart,
}: Omit<SectionProps, 'document'> & ShelfProps & { diode: DiodePart }) {
  const dp = 'multiplier.diode';
  const diodeEdit: Edit<DiodePart> = (mutate, key) => edit((d) => mutate(d.multiplier.diode), key);
  const bind = binder(diode, diodeEdit, issue, dp);
  const bindOptional = optionalBinder(diode, diodeEdit, issue, dp);
  return (
    <>
      <Text size="sm" fw={600} mt="xs">
        Diodes (all alike)
      </Text>
      <PartCodeInput
        label="Diode part code"
        isLabelHidden={false}
        kind="diode"
        parts={parts}
        value={diode.partCode}
        issue={issue(`${dp}.partCode`)}
        onCodeChange={(partCode) =>
          diodeEdit((d) => {
            d.partCode = partCode;
          }, `${dp}.partCode`)
        }
        onPick={(part) => onPickPart({ kind: 'diode' }, part)}
      />
      <FieldGrid>
        <BoundField label="Rated PIV" unit="V" {...bind('ratedPivV')} />
        <BoundField label="Rated average current" unit="A" {...bind('ratedAverageCurrentA')} />
        <BoundField label="Rated surge current" unit="A" {...bind('ratedSurgeCurrentA')} />
        <BoundField label="Saturation current" unit="A" {...bind('saturationCurrentA')} />
        <BoundField
          label="Emission coefficient"
          unit={null}
          min={0.5}
          step={0.5}
          decimalScale={3}
          {...bind('emissionCoefficient')}
        />
        <BoundField label="Series resistance" unit="Ohm" {...bind('seriesResistanceOhm')} />
      </FieldGrid>
      <ModelDetails
        title="Diode model details"
        details={diodeModelKeys.map((key) => ({
          binding: bindOptional(key),
          fallback: key === 'breakdownVoltageV' ? null : DIODE_MODEL_DEFAULTS[key],
        }))}
      />
    </>
  );
});
