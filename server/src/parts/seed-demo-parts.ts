import type { PartInput } from '@ladderwright/shared/api';
import { normalizePart } from '@ladderwright/shared/parts';
import { ProjectModel } from '../projects/project.model';
import { PartModel } from './part.model';

type DemoPart = Record<keyof PartInput, string | number>;

/** Invented Northfold shelf parts (codes as the demo designs reference them); costs are invented too. */
const DEMO_PARTS: readonly Partial<DemoPart>[] = [
  {
    code: 'NF-C222-2K',
    kind: 'capacitor',
    description: 'HV ceramic disc 2.2 nF',
    valueSi: '2.2n',
    tolerance: '10%',
    ratedVoltageV: '2 kV',
    unitCost: 0.18,
    sizeMm: '8x4',
  },
  {
    code: 'NF-C103-1K',
    kind: 'capacitor',
    description: 'Film capacitor 10 nF',
    valueSi: '10n',
    tolerance: '10%',
    ratedVoltageV: '1 kV',
    unitCost: 0.22,
    sizeMm: '13x5x11',
  },
  {
    code: 'NF-C223-630',
    kind: 'capacitor',
    description: 'Film capacitor 22 nF',
    valueSi: '22n',
    tolerance: '10%',
    ratedVoltageV: '630',
    unitCost: 0.2,
    sizeMm: '13x6x12',
  },
  {
    code: 'NF-C223-1K',
    kind: 'capacitor',
    description: 'Film capacitor 22 nF',
    valueSi: '22n',
    tolerance: '10%',
    ratedVoltageV: '1 kV',
    unitCost: 0.31,
    sizeMm: '18x7x14',
  },
  {
    code: 'NF-C472-3K',
    kind: 'capacitor',
    description: 'HV ceramic disc 4.7 nF',
    valueSi: '4.7n',
    tolerance: '20%',
    ratedVoltageV: '3 kV',
    unitCost: 0.27,
    sizeMm: '10x5',
  },
  {
    code: 'NF-C103-3K',
    kind: 'capacitor',
    description: 'HV ceramic disc 10 nF',
    valueSi: '10n',
    tolerance: '20%',
    ratedVoltageV: '3 kV',
    unitCost: 0.39,
    sizeMm: '13x5',
  },
  {
    code: 'NF-D1K-100M',
    kind: 'diode',
    description: 'Fast HV rectifier, 1 kV',
    ratedVoltageV: '1 kV',
    ratedCurrentA: '100 mA',
    ratedSurgeCurrentA: '3 A',
    unitCost: 0.06,
    sizeMm: '5x3',
  },
  {
    code: 'NF-D2K-50M',
    kind: 'diode',
    description: 'Stacked HV rectifier, 2 kV',
    ratedVoltageV: '2 kV',
    ratedCurrentA: '50 mA',
    ratedSurgeCurrentA: '10 A',
    unitCost: 0.12,
    sizeMm: '8x3',
  },
  {
    code: 'NF-D3K-50M',
    kind: 'diode',
    description: 'Stacked HV rectifier, 3 kV',
    ratedVoltageV: '3 kV',
    ratedCurrentA: '50 mA',
    ratedSurgeCurrentA: '10 A',
    unitCost: 0.16,
    sizeMm: '10x3',
  },
  {
    code: 'NF-D4K-50M',
    kind: 'diode',
    description: 'Stacked HV rectifier, 4 kV',
    ratedVoltageV: '4 kV',
    ratedCurrentA: '50 mA',
    ratedSurgeCurrentA: '10 A',
    unitCost: 0.21,
    sizeMm: '12x3',
  },
  {
    code: 'NF-R47M-HV',
    kind: 'resistor',
    description: 'Thick-film HV resistor 47 MΩ',
    valueSi: '47M',
    tolerance: '5%',
    ratedPowerW: '0.5',
    ratedVoltageV: '1.6 kV',
    unitCost: 0.09,
    sizeMm: '10x3',
  },
  {
    code: 'NF-R82M-1K',
    kind: 'resistor',
    description: 'Thick-film HV resistor 82 MΩ',
    valueSi: '82M',
    tolerance: '5%',
    ratedPowerW: '0.25',
    ratedVoltageV: '1 kV',
    unitCost: 0.07,
    sizeMm: '7x2',
  },
  {
    code: 'NF-R100M-1K',
    kind: 'resistor',
    description: 'Thick-film HV resistor 100 MΩ',
    valueSi: '100M',
    tolerance: '5%',
    ratedPowerW: '0.25',
    ratedVoltageV: '1 kV',
    unitCost: 0.07,
    sizeMm: '7x2',
  },
  {
    code: 'NF-R200M-HV',
    kind: 'resistor',
    description: 'Thick-film HV resistor 200 MΩ',
    valueSi: '200M',
    tolerance: '5%',
    ratedPowerW: '0.5',
    ratedVoltageV: '2.5 kV',
    unitCost: 0.14,
    sizeMm: '15x4',
  },
  {
    code: 'NF-Q30-2A',
    kind: 'transistor',
    description: 'Low-saturation switching transistor',
    ratedVoltageV: '30',
    ratedCurrentA: '2 A',
    ratedPowerW: '0.9',
    unitCost: 0.11,
    sizeMm: '5x4x2',
  },
  {
    code: 'NF-K13-AL160',
    kind: 'core',
    description: 'Ferrite pot core 13x8, gapped',
    valueSi: '160n',
    tolerance: '10%',
    ratedVoltageV: '3 kV',
    unitCost: 0.85,
    sizeMm: '13x8',
  },
];

/** Puts the demo parts on every demo project's shelf where missing; returns how many it created. */
export async function seedDemoParts(projectNames: readonly string[]): Promise<number> {
  let created = 0;
  const parts = DEMO_PARTS.map((raw) => {
    const { part, issues } = normalizePart(raw);
    if (!part) throw new Error(`demo part ${String(raw.code)} is invalid: ${issues.map((i) => i.message).join('; ')}`);
    return part;
  });
  const projects = await ProjectModel.findAll({ where: { name: [...projectNames] } });
  for (const project of projects) {
    for (const part of parts) {
      const [, isNew] = await PartModel.findOrCreate({
        where: { projectId: project.id, code: part.code },
        defaults: { projectId: project.id, ...part },
      });
      if (isNew) created += 1;
    }
  }
  return created;
}

/** Parts the demo seed creates per demo project. */
export const DEMO_PARTS_PER_PROJECT = DEMO_PARTS.length;
