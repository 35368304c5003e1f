import { storedChargeLimit, upperLimitVerdict } from './hazard-limits';
import type { HazardStandard } from './hazard-limits';
import type { CheckVerdict } from './check.types';
import type { MethodInfo } from '../methods';

export interface StoredEnergyItem {
  index: number;
  valueF: number;
  voltageV: number;
  energyJ: number;
  chargeC: number;
}

export const STORED_ENERGY_METHOD: MethodInfo = {
  methodId: 'stored-energy-v1',
  summary:
    'Energy ½CV² and charge CV of each capacitor at its largest operating voltage; at the output, all stored energy as deliverable (energy-equivalent capacitance 2E/V²), compared with the IEC 61010-1 and IEC 60335-1 limits.',
  assumptions: [
    'the diodes conduct forward while the ladder discharges through its output, so the oscillating column’s energy also reaches the output (conservative)',
    'limits: IEC 61010-1 from memory, IEC 60335-1 8.1.4 read (quoted text); verdicts marginal within 20 % of a limit',
  ],
  source: 'IEC 61010-1, 2010 ed. (from memory); IEC 60335-1 8.1.4 (read, quoted text)',
};

export interface StoredEnergySummary {
  capacitors: StoredEnergyItem[];
  totalEnergyJ: number;
  totalChargeC: number;
  /** Charge the output could deliver into a short, energy-equivalent: 2·E_total / |V_out|. */
  outputEquivalentChargeC: number;
  /** Energy-equivalent capacitance seen at the output, 2·E_total / V_out². */
  outputEquivalentCapacitanceF: number;
}

/**
 * Stored energy ½CV² and charge CV per capacitor at its largest operating voltage, and totals
 * (REFERENCES.md §4). The output figures take all stored energy as deliverable at the output, as the
 * diodes conduct forward while the ladder discharges through it (a conservative reading).
 */
export function storedEnergy(
  capacitors: ReadonlyArray<{ index: number; valueF: number; maxVoltageV: number }>,
  outputV: number,
): StoredEnergySummary {
  const items = capacitors.map((c) => ({
    index: c.index,
    valueF: c.valueF,
    voltageV: c.maxVoltageV,
    energyJ: 0.5 * c.valueF * c.maxVoltageV ** 2,
    chargeC: c.valueF * c.maxVoltageV,
  }));
  const totalEnergyJ = items.reduce((s, i) => s + i.energyJ, 0);
  const totalChargeC = items.reduce((s, i) => s + i.chargeC, 0);
  const v = Math.abs(outputV);
  return {
    capacitors: items,
    totalEnergyJ,
    totalChargeC,
    outputEquivalentChargeC: v > 0 ? (2 * totalEnergyJ) / v : 0,
    outputEquivalentCapacitanceF: v > 0 ? (2 * totalEnergyJ) / v ** 2 : 0,
  };
}

function limitVerdict(
  id: string,
  subject: string,
  voltageV: number,
  capacitanceF: number,
  standard: HazardStandard,
): CheckVerdict {
  const limit = storedChargeLimit(voltageV, standard);
  const v = Math.abs(voltageV);
  const rule = `${limit.text}; marginal within 20 % of the limit`;
  if (limit.kind === 'none') return upperLimitVerdict({ id, subject, rule, value: v, limit: limit.limit, unit: 'V' });
  const value =
    limit.kind === 'charge' ? capacitanceF * v : limit.kind === 'energy' ? 0.5 * capacitanceF * v * v : capacitanceF;
  return upperLimitVerdict({ id, subject, rule, value, limit: limit.limit, unit: limit.unit });
}

/** Stored charge / energy verdicts against IEC 61010-1 and IEC 60335-1, per capacitor and at the output. */
export function storedEnergyChecks(summary: StoredEnergySummary, outputV: number): CheckVerdict[] {
  const checks: CheckVerdict[] = [];
  for (const standard of ['IEC 61010-1', 'IEC 60335-1'] as const) {
    const tag = standard === 'IEC 61010-1' ? 'iec61010' : 'iec60335';
    checks.push(
      limitVerdict(
        `stored-output-${tag}`,
        'output (all stored energy)',
        outputV,
        summary.outputEquivalentCapacitanceF,
        standard,
      ),
    );
    for (const c of summary.capacitors) {
      checks.push(limitVerdict(`stored-c${c.index}-${tag}`, `C${c.index}`, c.voltageV, c.valueF, standard));
    }
  }
  return checks;
}
