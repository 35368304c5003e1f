import { DomainError } from '../errors';
import type { SpacingEnvironment } from '../designs/design.types';
import { lowerLimitVerdict } from './hazard-limits';
import type { CheckVerdict } from './check.types';

/** IEC 60664-1:2007 Table F.4 rows as reproduced in REFERENCES.md §5 (read from a manufacturer's reproduction). */
export const CREEPAGE_TABLE_F4_VOLTAGES_V = [250, 500, 1000, 2000] as const;

export type CreepageColumn =
  'pwbPd1' | 'pwbPd2' | 'pd1' | 'pd2MgI' | 'pd2MgII' | 'pd2MgIII' | 'pd3MgI' | 'pd3MgII' | 'pd3MgIII';

/** Creepage in mm per column; null where the reproduction has no entry (printed-wiring columns above 1000 V). */
export const CREEPAGE_TABLE_F4_MM: Readonly<Record<CreepageColumn, readonly (number | null)[]>> = {
  pwbPd1: [0.56, 1.3, 3.2, null],
  pwbPd2: [1.0, 2.5, 5.0, null],
  pd1: [0.56, 1.3, 3.2, 7.5],
  pd2MgI: [1.25, 2.5, 5.0, 10.0],
  pd2MgII: [1.8, 3.6, 7.1, 14.0],
  pd2MgIII: [2.5, 5.0, 10.0, 20.0],
  pd3MgI: [3.2, 6.3, 12.5, 25.0],
  pd3MgII: [3.6, 7.1, 14.0, 28.0],
  pd3MgIII: [4.0, 8.0, 16.0, 32.0],
};

export const CREEPAGE_METHOD_TEXT =
  'IEC 60664-1:2007 Table F.4 (rows 250/500/1000/2000 V as reproduced in a manufacturer’s technical appendix), log-log interpolation between rows; below 250 V and above the last row log-log extrapolation along the nearest segment (the standard has more rows: check against it); DC working voltage taken as rms';

/** Picks the Table F.4 column for an environment; printed-wiring columns apply to PD1/PD2 up to 1000 V. */
export function creepageColumn(
  env: Pick<SpacingEnvironment, 'pollutionDegree' | 'materialGroup' | 'pcb'>,
  workingVoltageV: number,
): CreepageColumn {
  const group = env.materialGroup === 'I' ? 'I' : env.materialGroup === 'II' ? 'II' : 'III';
  if (env.pcb && env.pollutionDegree <= 2 && Math.abs(workingVoltageV) <= 1000)
    return env.pollutionDegree === 1 ? 'pwbPd1' : 'pwbPd2';
  if (env.pollutionDegree === 1) return 'pd1';
  return `pd${env.pollutionDegree}Mg${group}` as CreepageColumn;
}

/** Required creepage (mm) at a working voltage, interpolated log-log in the column (see CREEPAGE_METHOD_TEXT). */
export function requiredCreepageMm(workingVoltageV: number, column: CreepageColumn): number {
  const v = Math.abs(workingVoltageV);
  if (!(v > 0)) throw new DomainError('invalid_argument', 'working voltage must be non-zero', 'workingVoltageV');
  const rows = CREEPAGE_TABLE_F4_MM[column];
  const points: Array<[number, number]> = [];
  CREEPAGE_TABLE_F4_VOLTAGES_V.forEach((voltage, i) => {
    const mm = rows[i];
    if (mm !== null && mm !== undefined) points.push([voltage, mm]);
  });
  let segment = points.length - 2;
  for (let i = 0; i < points.length - 1; i += 1) {
    if (v <= (points[i + 1] as [number, number])[0]) {
      segment = i;
      break;
    }
  }
  const [v0, d0] = points[segment] as [number, number];
  const [v1, d1] = points[segment + 1] as [number, number];
  const slope = Math.log(d1 / d0) / Math.log(v1 / v0);
  return d0 * Math.exp(slope * Math.log(v / v0));
}

/**
 * IPC-2221 Table 6-1 B2 (external, uncoated, sea level to 3050 m): the voltage bands up to 500 V
 * (from memory; the 301–500 V row 2.5 mm is read, REFERENCES.md §5), above 500 V 2.5 mm + 0.005 mm/V
 * (from memory).
 */
export function ipc2221B2SpacingMm(voltageV: number): number {
  const v = Math.abs(voltageV);
  if (v <= 30) return 0.1;
  if (v <= 150) return 0.6;
  if (v <= 300) return 1.25;
  if (v <= 500) return 2.5;
  return 2.5 + 0.005 * (v - 500);
}

export interface StageSpacing {
  stage: number;
  workingVoltageV: number;
  creepageColumn: CreepageColumn;
  iecCreepageMm: number;
  ipcSpacingMm: number | null;
  requiredMm: number;
}

/** Required spacing per stage from its working voltage (the larger of IEC 60664-1 creepage and, on a PCB, IPC-2221 B2). */
export function stageSpacing(stageWorkingVoltagesV: readonly number[], env: SpacingEnvironment): StageSpacing[] {
  return stageWorkingVoltagesV.map((workingVoltageV, i) => {
    const column = creepageColumn(env, workingVoltageV);
    const iecCreepageMm = requiredCreepageMm(workingVoltageV, column);
    const ipcSpacingMm = env.pcb ? ipc2221B2SpacingMm(workingVoltageV) : null;
    return {
      stage: i + 1,
      workingVoltageV,
      creepageColumn: column,
      iecCreepageMm,
      ipcSpacingMm,
      requiredMm: Math.max(iecCreepageMm, ipcSpacingMm ?? 0),
    };
  });
}

/** Per-stage verdicts when the layout's creepage is given; pass with ≥ 20 % over the requirement. */
export function creepageChecks(stages: readonly StageSpacing[], env: SpacingEnvironment): CheckVerdict[] {
  const provided = env.providedCreepageMm;
  if (provided === undefined) return [];
  const altitudeNote = (env.altitudeM ?? 0) > 3050 ? '; above 3050 m IPC-2221 B3 applies and is not applied here' : '';
  return stages.map((s) =>
    lowerLimitVerdict({
      id: `creepage-stage-${s.stage}`,
      subject: `stage ${s.stage} (${s.workingVoltageV.toFixed(0)} V working)`,
      rule: `${CREEPAGE_METHOD_TEXT}, column ${s.creepageColumn}${env.pcb ? '; IPC-2221 B2 2.5 mm at 500 V + 0.005 mm/V above (larger governs)' : ''}${altitudeNote}; marginal within 20 % above the requirement`,
      value: provided,
      limit: s.requiredMm,
      unit: 'mm',
    }),
  );
}
