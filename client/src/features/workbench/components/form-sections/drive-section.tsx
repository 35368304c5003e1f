import { SegmentedControl, Select, Stack, Text } from '@mantine/core';
import { NumberField } from '../../../../components/number-field';
import { driverExamples, type CellChemistry, type DriverStage } from '@ladderwright/shared/driver';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder, type Edit } from '../../document-path';
import { DRIVER_PATH, driverEdit } from './driver-edit';
import type { SectionProps } from './form-section.types';

const chemistries: Array<{ value: Exclude<CellChemistry, 'custom'>; label: string }> = [
  { value: 'alkaline', label: 'alkaline' },
  { value: 'nimh', label: 'NiMH' },
  { value: 'li-ion', label: 'lithium-ion' },
];

/** The secondary the ladder sees: a sine or pulse source, or a blocking-oscillator stage and its supply. */
export function DriveSection({ document, edit, issue }: SectionProps) {
  const drive = document.drive;
  const bind = binder(document, edit, issue);
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
        <FieldGrid>
          <BoundField label="Secondary peak" unit="V" {...bind('drive.peakV')} />
          <BoundField label="Frequency" unit="Hz" {...bind('drive.frequencyHz')} />
          <BoundField label="Source resistance" unit="Ohm" {...bind('drive.sourceResistanceOhm')} />
        </FieldGrid>
      )}
      {drive.kind === 'pulse' && (
        <FieldGrid>
          <BoundField label="Forward peak" unit="V" {...bind('drive.forwardPeakV')} />
          <BoundField label="Flyback peak" unit="V" {...bind('drive.flybackPeakV')} />
          <BoundField
            label="Duty cycle"
            unit={null}
            min={0.01}
            max={0.99}
            step={0.05}
            decimalScale={3}
            {...bind('drive.dutyCycle')}
          />
          <BoundField label="Frequency" unit="Hz" {...bind('drive.frequencyHz')} />
          <BoundField label="Source resistance" unit="Ohm" {...bind('drive.sourceResistanceOhm')} />
        </FieldGrid>
      )}
      {drive.kind === 'driver' && <SupplyFields driver={drive.driver} edit={driverEdit(edit)} issue={issue} />}
    </Stack>
  );
}

/** The driver stage's supply: a string of cells with its battery-life target, or a DC supply. */
function SupplyFields({
  driver,
  edit,
  issue,
}: {
  driver: DriverStage;
  edit: Edit<DriverStage>;
  issue: SectionProps['issue'];
}) {
  const supply = driver.supply;
  const supplyIssue = issue(`${DRIVER_PATH}.supply`);
  const bind = binder(driver, edit, issue, DRIVER_PATH);
  return (
    <Stack gap="sm">
      <Text size="sm" fw={600}>
        Supply
      </Text>
      <SegmentedControl
        aria-label="Supply kind"
        value={supply.kind}
        w="fit-content"
        data={[
          { value: 'cells', label: 'Cells' },
          { value: 'dc', label: 'DC supply' },
        ]}
        onChange={(kind) =>
          edit((dr) => {
            if (kind === dr.supply.kind) return;
            dr.supply =
              kind === 'cells'
                ? structuredClone(driverExamples.surfaceChargeTester.supply)
                : { kind: 'dc', voltageV: 3, sourceResistanceOhm: 0.1 };
          })
        }
      />
      {supplyIssue && (
        <Text size="sm" c="red" role="alert">
          {supplyIssue}
        </Text>
      )}
      {supply.kind === 'cells' ? (
        <FieldGrid>
          <Select
            label="Cell chemistry"
            value={supply.chemistry}
            allowDeselect={false}
            data={chemistries}
            error={issue(`${DRIVER_PATH}.supply.chemistry`)}
            onChange={(v) =>
              edit((dr) => {
                if (dr.supply.kind === 'cells' && v) dr.supply.chemistry = v;
              })
            }
          />
          <BoundField label="Cells in series" unit={null} isInteger {...bind('supply.cellsInSeries')} />
          <BoundField label="Cell capacity (Ah)" unit={null} step={0.1} {...bind('supply.capacityAh')} />
          <BoundField label="Internal resistance per cell" unit="Ohm" {...bind('supply.internalResistanceOhm')} />
          <BoundField label="End voltage per cell" unit="V" {...bind('supply.endVoltagePerCellV')} />
          <NumberField
            label="Battery-life target (h)"
            placeholder="no target"
            value={driver.batteryLifeTargetH ?? ''}
            min={0}
            step={1}
            decimalScale={2}
            error={issue(`${DRIVER_PATH}.batteryLifeTargetH`)}
            onChange={(v) =>
              edit((dr) => {
                if (v === '' || v === null) delete dr.batteryLifeTargetH;
                else dr.batteryLifeTargetH = Number(v);
              }, `${DRIVER_PATH}.batteryLifeTargetH`)
            }
          />
        </FieldGrid>
      ) : (
        <FieldGrid>
          <BoundField label="Supply voltage" unit="V" {...bind('supply.voltageV')} />
          <BoundField label="Supply source resistance" unit="Ohm" {...bind('supply.sourceResistanceOhm')} />
        </FieldGrid>
      )}
    </Stack>
  );
}
