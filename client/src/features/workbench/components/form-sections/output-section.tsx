import { Select, Stack, Switch } from '@mantine/core';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder } from '../../document-path';
import { PartCodeInput } from '../part-code-input';
import type { SectionProps, ShelfProps } from './form-section.types';

const bp = 'outputNetwork.bleeder';

/** The bleeder string, the series output resistor and the load. */
export function OutputSection({ document, edit, issue, parts, onPickPart }: SectionProps & ShelfProps) {
  const bleeder = document.outputNetwork.bleeder;
  const bind = binder(document, edit, issue);
  return (
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
            }, `${bp}.partCode`)
          }
          onPick={(part) => onPickPart({ kind: 'bleeder' }, part)}
        />
      )}
      {bleeder && (
        <FieldGrid>
          <BoundField
            label="Resistors in the string"
            unit={null}
            isInteger
            min={1}
            max={100}
            {...bind('outputNetwork.bleeder.count')}
          />
          <BoundField label="Each resistor" unit="Ohm" {...bind('outputNetwork.bleeder.valueOhm')} />
          <BoundField label="Rated power (each)" unit="W" {...bind('outputNetwork.bleeder.ratedPowerW')} />
          <BoundField label="Limiting element voltage" unit="V" {...bind('outputNetwork.bleeder.limitingVoltageV')} />
        </FieldGrid>
      )}
      <FieldGrid>
        <BoundField label="Series output resistor" unit="Ohm" {...bind('outputNetwork.seriesOutputResistanceOhm')} />
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
          <BoundField label="Load current" unit="A" {...bind('load.currentA')} />
        ) : (
          <BoundField label="Load resistance" unit="Ohm" {...bind('load.resistanceOhm')} />
        )}
      </FieldGrid>
    </Stack>
  );
}
