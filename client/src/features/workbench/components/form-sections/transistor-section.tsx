import { Select, Stack, Text } from '@mantine/core';
import { driverExamples, type DriverClamp, type DriverTransistor } from '@ladderwright/shared/driver';
import { DIODE_MODEL_DEFAULTS, RCD_CLAMP_DEFAULTS, TRANSISTOR_MODEL_DEFAULTS } from '@ladderwright/shared/designs';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder, optionalBinder } from '../../document-path';
import { ModelDetails } from './model-details';
import { DRIVER_PATH } from './driver-edit';
import type { DriverSectionProps, FieldSpec, NumberKeys } from './transformer-section';

const transistorFields: FieldSpec<NumberKeys<DriverTransistor>>[] = [
  { key: 'forwardBeta', label: 'Forward β', unit: null },
  { key: 'reverseBeta', label: 'Reverse β', unit: null, step: 0.5 },
  { key: 'vbeOnV', label: 'Vbe (on)', unit: 'V' },
  { key: 'vceSatV', label: 'Vce (sat)', unit: 'V' },
  { key: 'vceoMaxV', label: 'Vceo max', unit: 'V' },
  { key: 'icMaxA', label: 'Ic max', unit: 'A' },
];

type ClampKind = 'none' | DriverClamp['kind'];

/**
 * The clamp a kind starts with: a zener at the present zener voltage or the demo stage's; an RCD clamp with its
 * resistor and capacitor at the simulated circuit's defaults (its level follows from them and the flyback).
 */
function clampOf(kind: ClampKind, present: DriverClamp | undefined): DriverClamp | undefined {
  if (kind === 'zener') {
    const demo = driverExamples.surfaceChargeTester.clamp;
    const clampVoltageV =
      present?.kind === 'zener' ? present.clampVoltageV : demo?.kind === 'zener' ? demo.clampVoltageV : 30;
    return { kind: 'zener', clampVoltageV };
  }
  if (kind === 'rcd') return { kind: 'rcd', ...RCD_CLAMP_DEFAULTS };
  return undefined;
}

/** The transistor's optional model fields in the order of its SPICE card (VAF has no default: none). */
const transistorModelKeys = [
  'saturationCurrentA',
  'baseEmitterCapacitanceF',
  'baseEmitterPotentialV',
  'baseEmitterGrading',
  'baseCollectorCapacitanceF',
  'baseCollectorPotentialV',
  'baseCollectorGrading',
  'earlyVoltageV',
  'forwardTransitTimeS',
  'reverseTransitTimeS',
  'baseResistanceOhm',
  'collectorResistanceOhm',
  'emitterResistanceOhm',
] as const;

const modelDefault = (defaults: Readonly<Record<string, number>>, key: string): number | null => defaults[key] ?? null;

/** The switching transistor, its base resistor and the collector clamp. */
export function TransistorSection({ driver, edit, issue }: DriverSectionProps) {
  const bind = binder(driver, edit, issue, DRIVER_PATH);
  const bindOptional = optionalBinder(driver, edit, issue, DRIVER_PATH);
  const clamp = driver.clamp;
  const clampDiodeKeys = [
    'junctionCapacitanceF',
    'junctionPotentialV',
    'gradingCoefficient',
    ...(clamp?.kind === 'rcd' ? (['breakdownVoltageV'] as const) : []),
    'breakdownCurrentA',
  ] as const;
  return (
    <Stack gap="sm">
      <FieldGrid>
        {transistorFields.map(({ key, ...field }) => (
          <BoundField key={key} {...field} {...bind(`transistor.${key}`)} />
        ))}
      </FieldGrid>
      <ModelDetails
        title="Transistor model details"
        details={transistorModelKeys.map((key) => ({
          binding: bindOptional(`transistor.${key}`),
          fallback: modelDefault(TRANSISTOR_MODEL_DEFAULTS, key),
        }))}
      />
      <Text size="sm" fw={600}>
        Base resistor and collector clamp
      </Text>
      <FieldGrid>
        <BoundField label="Base resistor" unit="Ohm" {...bind('baseResistorOhm')} />
        <Select
          label="Clamp"
          value={clamp?.kind ?? 'none'}
          allowDeselect={false}
          data={[
            { value: 'none', label: 'none (breakdown limits)' },
            { value: 'zener', label: 'zener' },
            { value: 'rcd', label: 'RCD' },
          ]}
          comboboxProps={{ width: 'max-content', position: 'bottom-start' }}
          error={issue(`${DRIVER_PATH}.clamp`)}
          onChange={(v) =>
            edit((dr) => {
              const next = clampOf(v ?? 'none', dr.clamp);
              if (next) dr.clamp = next;
              else delete dr.clamp;
            })
          }
        />
        {clamp?.kind === 'zener' && <BoundField label="Zener voltage" unit="V" {...bind('clamp.clampVoltageV')} />}
        {clamp?.kind === 'rcd' && (
          <>
            <BoundField label="Clamp resistor" unit="Ohm" {...bind('clamp.resistorOhm')} />
            <BoundField label="Clamp capacitor" unit="F" {...bind('clamp.capacitorF')} />
          </>
        )}
      </FieldGrid>
      {clamp?.kind === 'rcd' && (
        <Text size="xs" c="dimmed">
          The RCD clamp has no set voltage: it settles where its resistor takes the flyback energy it is given. The
          collector peak on the Driver tab is that level.
        </Text>
      )}
      {clamp && (
        <ModelDetails
          title={clamp.kind === 'zener' ? 'Zener model details' : 'Clamp diode model details'}
          details={clampDiodeKeys.map((key) => ({
            binding: bindOptional(`clamp.${key}`),
            fallback: modelDefault(DIODE_MODEL_DEFAULTS, key),
          }))}
        />
      )}
    </Stack>
  );
}
