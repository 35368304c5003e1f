import { Select, Switch } from '@mantine/core';
import { NumberField } from '../../../../components/number-field';
import { DISCHARGE_RULE_LABELS, NAMED_DISCHARGE_RULES } from '@ladderwright/shared/designs';
import { BoundField } from '../../../../components/bound-field';
import { FieldGrid } from '../../../../components/field-grid';
import { binder } from '../../document-path';
import type { SectionProps } from './form-section.types';

const dischargeRules = NAMED_DISCHARGE_RULES.map((value) => ({ value, label: DISCHARGE_RULE_LABELS[value] }));

/** Output, ripple and load targets, the safe touch level with its discharge rule, and the spacing environment. */
export function TargetsSection({ document, edit, issue }: SectionProps) {
  const t = document.targets;
  const rule = typeof t.dischargeRule === 'string' ? t.dischargeRule : null;
  const bind = binder(document, edit, issue);
  return (
    <FieldGrid>
      <BoundField label="Output (signed)" unit="V" {...bind('targets.outputV')} />
      <BoundField label="Ripple at most" unit="V" {...bind('targets.rippleMaxV')} />
      <BoundField label="Rated load current" unit="A" {...bind('targets.loadCurrentA')} />
      <BoundField label="Safe touch level" unit="V" {...bind('targets.safeVoltageV')} />
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
            d.targets.dischargeRule = v;
          })
        }
      />
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
      <NumberField
        label="Creepage per stage (mm)"
        value={t.spacing.providedCreepageMm ?? ''}
        min={0.1}
        step={0.5}
        decimalScale={2}
        error={issue('targets.spacing.providedCreepageMm')}
        onChange={(v) =>
          edit((d) => {
            if (v === '' || v === null) delete d.targets.spacing.providedCreepageMm;
            else d.targets.spacing.providedCreepageMm = Number(v);
          }, 'targets.spacing.providedCreepageMm')
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
    </FieldGrid>
  );
}
