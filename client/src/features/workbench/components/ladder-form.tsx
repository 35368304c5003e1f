import type { ReactNode } from 'react';
import {
  Fieldset,
  Group,
  NumberInput,
  SegmentedControl,
  Select,
  SimpleGrid,
  Stack,
  Switch,
  Text,
  TextInput,
  Textarea,
} from '@mantine/core';
import type { Part } from '@ladderwright/shared/api';
import { capacitorCountFor, type Design, type DischargeRule, type Topology } from '@ladderwright/shared/designs';
import { driverExamples } from '@ladderwright/shared/driver';
import type { QuantityUnit } from '@ladderwright/shared/units';
import { QuantityInput } from '../../../components/quantity-input';
import { binder } from '../document-path';
import { resizeCapacitors } from '../ladder-edits';
import { withShelfPart } from '../shelf-picks';
import { PartCodeInput } from './part-code-input';
import { CapacitorTable } from './capacitor-table';
import { DriverFields } from './driver-fields';

export interface LadderFormProps {
  document: Design;
  onChange: (document: Design) => void;
  /** validateDesign's messages by document path. */
  issues: Readonly<Record<string, string>>;
  /** The project's Parts shelf: the part-code fields offer its parts; picking one fills value and ratings. */
  parts?: readonly Part[];
}

type Edit = (mutate: (draft: Design) => void) => void;

const dischargeRules: Array<{ value: string; label: string }> = [
  { value: '50V-1min', label: 'to 50 V within 1 min' },
  { value: '50V-5min', label: 'to 50 V within 5 min' },
  { value: '60V-5s', label: 'to 60 V within 5 s' },
];

/** The design document as a form: drive, ladder, output network, load and targets, each field checked in place. */
export function LadderForm({ document, onChange, issues, parts = [] }: LadderFormProps) {
  const edit: Edit = (mutate) => {
    const draft = structuredClone(document);
    mutate(draft);
    onChange(draft);
  };
  const issue = (path: string) => issues[path] ?? null;

  return (
    <Stack gap="md">
      <Fieldset legend="Design">
        <SimpleGrid cols={{ base: 1, sm: 2 }} spacing="sm">
          <TextInput
            label="Name"
            value={document.name}
            onChange={(e) => {
              const name = e.currentTarget.value;
              edit((d) => {
                d.name = name;
              });
            }}
            error={issue('name')}
          />
          <Textarea
            label="Notes"
            value={document.notes}
            autosize
            minRows={1}
            maxRows={4}
            onChange={(e) => {
              const notes = e.currentTarget.value;
              edit((d) => {
                d.notes = notes;
              });
            }}
          />
        </SimpleGrid>
      </Fieldset>
      <DriveSection document={document} edit={edit} issue={issue} />
      <LadderSection
        document={document}
        edit={edit}
        issue={issue}
        issues={issues}
        parts={parts}
        onDocument={onChange}
      />
      <OutputSection document={document} edit={edit} issue={issue} parts={parts} onDocument={onChange} />
      <TargetsSection document={document} edit={edit} issue={issue} />
    </Stack>
  );
}

interface SectionProps {
  document: Design;
  edit: Edit;
  issue: (path: string) => string | null;
}

/** A section with part-code fields: the shelf, and a way to replace the document after a pick. */
interface ShelfProps {
  parts: readonly Part[];
  onDocument: (document: Design) => void;
}

/** A quantity field bound to one document path (spread `bind(path)` into it). */
function Field({
  label,
  unit,
  value,
  path,
  issue,
  onValue,
}: {
  label: string;
  unit: QuantityUnit;
  value: number;
  path: string;
  issue: (path: string) => string | null;
  onValue: (value: number) => void;
}): ReactNode {
  return <QuantityInput label={label} unit={unit} value={value} onChange={onValue} issue={issue(path)} />;
}

function DriveSection({ document, edit, issue }: SectionProps) {
  const drive = document.drive;
  const bind = binder(document, edit);
  const setKind = (kind: string) =>
    edit((d) => {
      const frequencyHz = d.drive.kind === 'driver' ? 25e3 : d.drive.frequencyHz;
      const sourceResistanceOhm = d.drive.kind === 'driver' ? 100 : d.drive.sourceResistanceOhm;
      if (kind === 'sine') d.drive = { kind: 'sine', peakV: 500, frequencyHz, sourceResistanceOhm };
      if (kind === 'pulse')
        d.drive = {
          kind: 'pulse',
          forwardPeakV: 500,
          flybackPeakV: 500,
          frequencyHz,
          dutyCycle: 0.5,
          sourceResistanceOhm,
        };
      if (kind === 'driver') d.drive = { kind: 'driver', driver: structuredClone(driverExamples.surfaceChargeTester) };
    });
  return (
    <Fieldset legend="Drive (transformer secondary)">
      <Stack gap="sm">
        <SegmentedControl
          aria-label="Drive kind"
          value={drive.kind}
          onChange={setKind}
          data={[
            { value: 'sine', label: 'Sine' },
            { value: 'pulse', label: 'Pulse' },
            { value: 'driver', label: 'Blocking oscillator' },
          ]}
          w="fit-content"
        />
        {drive.kind === 'sine' && (
          <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
            <Field label="Secondary peak" unit="V" issue={issue} {...bind('drive.peakV')} />
            <Field label="Frequency" unit="Hz" issue={issue} {...bind('drive.frequencyHz')} />
            <Field label="Source resistance" unit="Ohm" issue={issue} {...bind('drive.sourceResistanceOhm')} />
          </SimpleGrid>
        )}
        {drive.kind === 'pulse' && (
          <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
            <Field label="Forward peak" unit="V" issue={issue} {...bind('drive.forwardPeakV')} />
            <Field label="Flyback peak" unit="V" issue={issue} {...bind('drive.flybackPeakV')} />
            <NumberInput
              label="Duty cycle"
              value={drive.dutyCycle}
              min={0.01}
              max={0.99}
              step={0.05}
              decimalScale={3}
              error={issue('drive.dutyCycle')}
              onChange={(v) =>
                edit((d) => {
                  if (d.drive.kind === 'pulse') d.drive.dutyCycle = Number(v);
                })
              }
            />
            <Field label="Frequency" unit="Hz" issue={issue} {...bind('drive.frequencyHz')} />
            <Field label="Source resistance" unit="Ohm" issue={issue} {...bind('drive.sourceResistanceOhm')} />
          </SimpleGrid>
        )}
        {drive.kind === 'driver' && (
          <DriverFields
            driver={drive.driver}
            issue={issue}
            onDriver={(mutate) =>
              edit((d) => {
                if (d.drive.kind === 'driver') mutate(d.drive.driver);
              })
            }
          />
        )}
      </Stack>
    </Fieldset>
  );
}

function LadderSection({
  document,
  edit,
  issue,
  issues,
  parts,
  onDocument,
}: SectionProps & ShelfProps & { issues: Readonly<Record<string, string>> }) {
  const m = document.multiplier;
  const setShape = (topology: Topology, cellCount: number) =>
    edit((d) => {
      d.multiplier.topology = topology;
      d.multiplier.cellCount = topology === 'bridge-doubler' ? 2 : cellCount;
      d.multiplier.capacitors = resizeCapacitors(
        d.multiplier.capacitors,
        capacitorCountFor(topology, d.multiplier.cellCount),
      );
    });
  const diode = m.diode;
  const dp = 'multiplier.diode';
  const bind = binder(document, edit);
  return (
    <Fieldset legend="Ladder">
      <Stack gap="sm">
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
          <Select
            label="Topology"
            value={m.topology}
            allowDeselect={false}
            data={[
              { value: 'half-wave', label: 'half-wave cascade' },
              { value: 'full-wave', label: 'full-wave (symmetrical) cascade' },
              { value: 'bridge-doubler', label: 'bridge doubler' },
            ]}
            onChange={(v) => v && setShape(v, m.cellCount)}
            error={issue('multiplier.topology')}
          />
          <NumberInput
            label={m.topology === 'full-wave' ? 'Stages' : 'Cells'}
            value={m.cellCount}
            min={1}
            max={60}
            allowDecimal={false}
            disabled={m.topology === 'bridge-doubler'}
            error={issue('multiplier.cellCount')}
            onChange={(v) => {
              const count = Number(v);
              if (Number.isInteger(count) && count >= 1 && count <= 60) setShape(m.topology, count);
            }}
          />
        </SimpleGrid>
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
          onPickPart={(index, part) => onDocument(withShelfPart(document, { kind: 'capacitor', index }, part, parts))}
          onChange={(capacitors) =>
            edit((d) => {
              d.multiplier.capacitors = capacitors;
            })
          }
        />
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
            edit((d) => {
              d.multiplier.diode.partCode = partCode;
            })
          }
          onPick={(part) => onDocument(withShelfPart(document, { kind: 'diode' }, part, parts))}
        />
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
          <Field label="Rated PIV" unit="V" issue={issue} {...bind('multiplier.diode.ratedPivV')} />
          <Field
            label="Rated average current"
            unit="A"
            issue={issue}
            {...bind('multiplier.diode.ratedAverageCurrentA')}
          />
          <Field label="Rated surge current" unit="A" issue={issue} {...bind('multiplier.diode.ratedSurgeCurrentA')} />
          <Field label="Saturation current" unit="A" issue={issue} {...bind('multiplier.diode.saturationCurrentA')} />
          <NumberInput
            label="Emission coefficient"
            value={diode.emissionCoefficient}
            min={0.5}
            step={0.5}
            decimalScale={3}
            error={issue(`${dp}.emissionCoefficient`)}
            onChange={(v) =>
              edit((d) => {
                d.multiplier.diode.emissionCoefficient = Number(v);
              })
            }
          />
          <Field label="Series resistance" unit="Ohm" issue={issue} {...bind('multiplier.diode.seriesResistanceOhm')} />
        </SimpleGrid>
      </Stack>
    </Fieldset>
  );
}

function OutputSection({ document, edit, issue, parts, onDocument }: SectionProps & ShelfProps) {
  const bleeder = document.outputNetwork.bleeder;
  const bind = binder(document, edit);
  const bp = 'outputNetwork.bleeder';
  return (
    <Fieldset legend="Output network and load">
      <Stack gap="sm">
        <Switch
          label="Bleeder string across the ladder output"
          checked={bleeder !== null}
          onChange={(e) => {
            const on = e.currentTarget.checked;
            edit((d) => {
              d.outputNetwork.bleeder = on
                ? { count: 5, valueOhm: 100e6, ratedPowerW: 0.5, limitingVoltageV: 2000 }
                : null;
            });
          }}
        />
        {bleeder && (
          <PartCodeInput
            label="Bleeder resistor part code"
            isLabelHidden={false}
            kind="resistor"
            parts={parts}
            value={bleeder.partCode}
            issue={issue(`${bp}.partCode`)}
            onCodeChange={(partCode) =>
              edit((d) => {
                if (d.outputNetwork.bleeder) d.outputNetwork.bleeder.partCode = partCode;
              })
            }
            onPick={(part) => onDocument(withShelfPart(document, { kind: 'bleeder' }, part, parts))}
          />
        )}
        {bleeder && (
          <SimpleGrid cols={{ base: 1, sm: 4 }} spacing="sm">
            <NumberInput
              label="Resistors in the string"
              value={bleeder.count}
              min={1}
              max={100}
              allowDecimal={false}
              error={issue(`${bp}.count`)}
              onChange={(v) =>
                edit((d) => {
                  if (d.outputNetwork.bleeder) d.outputNetwork.bleeder.count = Number(v);
                })
              }
            />
            <Field label="Each resistor" unit="Ohm" issue={issue} {...bind('outputNetwork.bleeder.valueOhm')} />
            <Field label="Rated power (each)" unit="W" issue={issue} {...bind('outputNetwork.bleeder.ratedPowerW')} />
            <Field
              label="Limiting element voltage"
              unit="V"
              issue={issue}
              {...bind('outputNetwork.bleeder.limitingVoltageV')}
            />
          </SimpleGrid>
        )}
        <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
          <Field
            label="Series output resistor"
            unit="Ohm"
            issue={issue}
            {...bind('outputNetwork.seriesOutputResistanceOhm')}
          />
          <Select
            label="Load"
            value={document.load.kind}
            allowDeselect={false}
            data={[
              { value: 'current', label: 'constant current' },
              { value: 'resistance', label: 'resistance' },
            ]}
            onChange={(v) =>
              edit((d) => {
                d.load =
                  v === 'resistance'
                    ? { kind: 'resistance', resistanceOhm: 1e9 }
                    : { kind: 'current', currentA: d.targets.loadCurrentA };
              })
            }
          />
          {document.load.kind === 'current' ? (
            <Field label="Load current" unit="A" issue={issue} {...bind('load.currentA')} />
          ) : (
            <Field label="Load resistance" unit="Ohm" issue={issue} {...bind('load.resistanceOhm')} />
          )}
        </SimpleGrid>
      </Stack>
    </Fieldset>
  );
}

function TargetsSection({ document, edit, issue }: SectionProps) {
  const t = document.targets;
  const rule = typeof t.dischargeRule === 'string' ? t.dischargeRule : null;
  const bind = binder(document, edit);
  return (
    <Fieldset legend="Targets">
      <SimpleGrid cols={{ base: 1, sm: 3 }} spacing="sm">
        <Field label="Output (signed)" unit="V" issue={issue} {...bind('targets.outputV')} />
        <Field label="Ripple at most" unit="V" issue={issue} {...bind('targets.rippleMaxV')} />
        <Field label="Rated load current" unit="A" issue={issue} {...bind('targets.loadCurrentA')} />
        <Field label="Safe touch level" unit="V" issue={issue} {...bind('targets.safeVoltageV')} />
        <Select
          label="Discharge rule"
          value={rule}
          allowDeselect={false}
          data={dischargeRules}
          placeholder="custom rule"
          error={issue('targets.dischargeRule')}
          onChange={(v) =>
            v &&
            edit((d) => {
              d.targets.dischargeRule = v as DischargeRule;
            })
          }
        />
        <Group grow gap="sm" align="flex-start">
          <Select
            label="Pollution degree"
            value={String(t.spacing.pollutionDegree)}
            allowDeselect={false}
            data={['1', '2', '3']}
            onChange={(v) =>
              v &&
              edit((d) => {
                d.targets.spacing.pollutionDegree = Number(v) as 1 | 2 | 3;
              })
            }
          />
          <Select
            label="Material group"
            value={t.spacing.materialGroup}
            allowDeselect={false}
            data={['I', 'II', 'IIIa', 'IIIb']}
            onChange={(v) =>
              v &&
              edit((d) => {
                d.targets.spacing.materialGroup = v;
              })
            }
          />
        </Group>
        <NumberInput
          label="Provided creepage per stage (mm)"
          value={t.spacing.providedCreepageMm ?? ''}
          min={0.1}
          step={0.5}
          decimalScale={2}
          error={issue('targets.spacing.providedCreepageMm')}
          onChange={(v) =>
            edit((d) => {
              if (v === '' || v === null) delete d.targets.spacing.providedCreepageMm;
              else d.targets.spacing.providedCreepageMm = Number(v);
            })
          }
        />
        <Switch
          label="Ladder on a printed board"
          checked={t.spacing.pcb}
          mt="lg"
          onChange={(e) => {
            const pcb = e.currentTarget.checked;
            edit((d) => {
              d.targets.spacing.pcb = pcb;
            });
          }}
        />
      </SimpleGrid>
    </Fieldset>
  );
}
