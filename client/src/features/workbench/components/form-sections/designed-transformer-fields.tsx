import { ActionIcon, Group, Paper, Select, Stack, Text } from '@mantine/core';
import { NumberField } from '../../../../components/number-field';
import type { Part } from '@ladderwright/shared/api';
import { documentFieldLabel } from '@ladderwright/shared/designs';
import type { DriverStage } from '@ladderwright/shared/driver';
import type { TransformerGap, TransformerSection, TransformerWinding } from '@ladderwright/shared/transformer';
import { formatQuantity } from '@ladderwright/shared/units';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import type { Edit } from '../../document-path';
import { magneticsChoices } from '../../transformer-start';
import { DRIVER_PATH } from './driver-edit';

const SECTION_PATH = `${DRIVER_PATH}.transformerDesign`;
const label = (path: string) => documentFieldLabel(`${SECTION_PATH}.${path}`).label;

const GAP_KINDS: { value: TransformerGap['kind']; label: string }[] = [
  { value: 'primary-inductance', label: 'Target primary inductance' },
  { value: 'al', label: 'Target AL' },
  { value: 'gap', label: 'Gap length' },
];

const ROLE_NAMES: Record<TransformerWinding['role'], string> = {
  primary: 'Primary',
  feedback: 'Feedback',
  secondary: 'Secondary',
};

export interface DesignedTransformerFieldsProps {
  section: TransformerSection;
  edit: Edit<DriverStage>;
  issue: (path: string) => string | null;
  parts: readonly Part[];
}

/** Options for a select of kinds by code, keeping the current code even when it is no longer on the shelf. */
function codeOptions(codes: readonly { code: string; label: string }[], current: string | undefined) {
  const options = codes.map(({ code, label: text }) => ({ value: code, label: text }));
  if (current !== undefined && !options.some((option) => option.value === current)) {
    options.unshift({ value: current, label: `${current} (not on the shelf)` });
  }
  return options;
}

const mm = (valueM: number) => `${Number((valueM * 1e3).toPrecision(3))} mm`;

/**
 * The transformer designed from a core: core and gap (a length, a target AL or a target primary inductance),
 * the windings from the core outward (turns, wire, layers, tape between layers, pins), the tapes between
 * windings and the margins. Every change goes to `drive.driver.transformerDesign`.
 */
export function DesignedTransformerFields({ section, edit, issue, parts }: DesignedTransformerFieldsProps) {
  const { cores, wires, tapes } = magneticsChoices(parts);
  const editSection = (mutate: (design: TransformerSection) => void, path?: string) =>
    edit(
      (dr) => {
        if (dr.transformerDesign) mutate(dr.transformerDesign);
      },
      path ? `${SECTION_PATH}.${path}` : undefined,
    );
  const issueAt = (path: string) => issue(`${SECTION_PATH}.${path}`);
  const gap = section.gap;
  const gapValue = gap.kind === 'gap' ? gap.gapM : gap.kind === 'al' ? gap.alHPerTurn2 : gap.primaryInductanceH;
  const gapPath = gap.kind === 'gap' ? 'gap.gapM' : gap.kind === 'al' ? 'gap.alHPerTurn2' : 'gap.primaryInductanceH';
  const wireOptions = (current: string) =>
    codeOptions(
      wires.map((w) => ({ code: w.code, label: `${w.code} · Ø ${mm(w.copperDiameterM)}` })),
      current,
    );
  const tapeOptions = (current: string | undefined) =>
    codeOptions(
      tapes.map((t) => ({ code: t.code, label: `${t.code} · ${Number((t.thicknessM * 1e6).toPrecision(3))} µm` })),
      current,
    );
  const move = (index: number, by: -1 | 1) =>
    editSection((design) => {
      const other = index + by;
      const a = design.windings[index];
      const b = design.windings[other];
      if (!a || !b) return;
      design.windings[index] = b;
      design.windings[other] = a;
    }, 'windings');

  return (
    <Stack gap="sm">
      <FieldGrid>
        <Select
          label={label('core')}
          value={section.core.code}
          allowDeselect={false}
          searchable
          data={codeOptions(
            cores.map((c) => ({
              code: c.code,
              label: `${c.code} · Ae ${Number((c.effectiveAreaM2 * 1e6).toPrecision(3))} mm²`,
            })),
            section.core.code,
          )}
          error={issueAt('core')}
          onChange={(code) => {
            const core = cores.find((c) => c.code === code);
            if (core) editSection((design) => void (design.core = core), 'core');
          }}
        />
        <Select
          label={label('gap.kind')}
          value={gap.kind}
          allowDeselect={false}
          data={GAP_KINDS}
          onChange={(kind) =>
            editSection((design) => {
              if (kind === design.gap.kind) return;
              if (kind === 'gap') design.gap = { kind: 'gap', gapM: 0.1e-3 };
              if (kind === 'al') design.gap = { kind: 'al', alHPerTurn2: section.core.ungappedAlHPerTurn2 / 10 };
              if (kind === 'primary-inductance') design.gap = { kind: 'primary-inductance', primaryInductanceH: 1e-3 };
            }, 'gap')
          }
        />
        <BoundField
          label={label(gapPath)}
          unit={gap.kind === 'gap' ? 'm' : 'H'}
          value={gapValue}
          path={`${SECTION_PATH}.${gapPath}`}
          issue={issueAt(gapPath)}
          onValue={(value) =>
            editSection((design) => {
              const g = design.gap;
              if (g.kind === 'gap') g.gapM = value;
              else if (g.kind === 'al') g.alHPerTurn2 = value;
              else g.primaryInductanceH = value;
            }, gapPath)
          }
        />
        <BoundField
          label={`${label('inductanceTolerance')} (±)`}
          unit={null}
          step={0.05}
          decimalScale={3}
          min={0.01}
          max={0.5}
          value={section.inductanceTolerance ?? 0.1}
          path={`${SECTION_PATH}.inductanceTolerance`}
          issue={issueAt('inductanceTolerance')}
          onValue={(value) => editSection((design) => void (design.inductanceTolerance = value), 'inductanceTolerance')}
        />
      </FieldGrid>
      <Text size="xs" c="dimmed">
        Core {section.core.code}: Ae {formatQuantity(section.core.effectiveAreaM2 * 1e6, '')} mm², le{' '}
        {mm(section.core.pathLengthM)}, AL ungapped {formatQuantity(section.core.ungappedAlHPerTurn2, 'H')}/turn², Bsat{' '}
        {formatQuantity(section.core.saturationFluxDensity100T * 1e3, '')} mT at 100 °C, bobbin{' '}
        {mm(section.core.bobbinBreadthM)} × {mm(section.core.bobbinHeightM)}.
      </Text>
      <Text size="sm" fw={600}>
        Windings, from the core outward
      </Text>
      {section.windings.map((winding, index) => {
        const at = (field: string) => `windings.${index}.${field}`;
        const name = ROLE_NAMES[winding.role];
        const integerField = (
          field: 'turns' | 'startPin' | 'endPin' | 'layers' | 'layerTapeWraps',
          value: number | undefined,
          options: { min: number; placeholder?: string; isOptional?: boolean },
        ) => (
          <NumberField
            label={label(`windings[${index}].${field}`).replace(/^Winding \d+ /, `${name} `)}
            data-path={`${SECTION_PATH}.${at(field)}`}
            value={value ?? ''}
            min={options.min}
            allowDecimal={false}
            placeholder={options.placeholder}
            error={issueAt(at(field))}
            onChange={(raw) =>
              editSection((design) => {
                const target = design.windings[index];
                if (!target) return;
                if (raw === '' && options.isOptional) delete target[field];
                else target[field] = typeof raw === 'number' ? raw : Number.NaN;
              }, at(field))
            }
          />
        );
        return (
          <Paper key={winding.role} withBorder p="xs" aria-label={`${name} winding`}>
            <Group justify="space-between" mb={4}>
              <Text size="sm" fw={600}>
                {index + 1}. {name}
              </Text>
              <Group gap={2}>
                <ActionIcon
                  variant="subtle"
                  size="sm"
                  aria-label={`Wind the ${winding.role} earlier`}
                  disabled={index === 0}
                  onClick={() => move(index, -1)}
                >
                  ↑
                </ActionIcon>
                <ActionIcon
                  variant="subtle"
                  size="sm"
                  aria-label={`Wind the ${winding.role} later`}
                  disabled={index === section.windings.length - 1}
                  onClick={() => move(index, 1)}
                >
                  ↓
                </ActionIcon>
              </Group>
            </Group>
            <FieldGrid>
              {integerField('turns', winding.turns, { min: 1 })}
              <Select
                label={`${name} wire`}
                value={winding.wire.code}
                allowDeselect={false}
                data={wireOptions(winding.wire.code)}
                error={issueAt(at('wire'))}
                onChange={(code) => {
                  const wire = wires.find((w) => w.code === code);
                  if (!wire) return;
                  editSection((design) => {
                    const target = design.windings[index];
                    if (target) target.wire = wire;
                  }, at('wire'));
                }}
              />
              {integerField('layers', winding.layers, {
                min: 1,
                placeholder: 'fewest that hold the turns',
                isOptional: true,
              })}
              {integerField('layerTapeWraps', winding.layerTapeWraps, { min: 0, placeholder: '0', isOptional: true })}
              {integerField('startPin', winding.startPin, { min: 1 })}
              {integerField('endPin', winding.endPin, { min: 1 })}
            </FieldGrid>
          </Paper>
        );
      })}
      {issueAt('windings') && (
        <Text size="sm" c="red" role="alert">
          {issueAt('windings')}
        </Text>
      )}
      <FieldGrid>
        <Select
          label={label('layerTape')}
          value={section.layerTape?.code ?? null}
          placeholder="none"
          clearable
          data={tapeOptions(section.layerTape?.code)}
          onChange={(code) =>
            editSection((design) => {
              const tape = tapes.find((t) => t.code === code);
              if (tape) design.layerTape = tape;
              else delete design.layerTape;
            }, 'layerTape')
          }
        />
        <Select
          label={label('windingTape')}
          value={section.windingTape.code}
          allowDeselect={false}
          data={tapeOptions(section.windingTape.code)}
          onChange={(code) => {
            const tape = tapes.find((t) => t.code === code);
            if (tape) editSection((design) => void (design.windingTape = tape), 'windingTape');
          }}
        />
        <BoundField
          label={label('windingTapeWraps')}
          unit={null}
          isInteger
          min={1}
          value={section.windingTapeWraps}
          path={`${SECTION_PATH}.windingTapeWraps`}
          issue={issueAt('windingTapeWraps')}
          onValue={(value) => editSection((design) => void (design.windingTapeWraps = value), 'windingTapeWraps')}
        />
        <BoundField
          label={label('endMarginM')}
          unit="m"
          value={section.endMarginM ?? 0}
          path={`${SECTION_PATH}.endMarginM`}
          issue={issueAt('endMarginM')}
          onValue={(value) => editSection((design) => void (design.endMarginM = value), 'endMarginM')}
        />
      </FieldGrid>
    </Stack>
  );
}
