import { DomainError } from '../src/errors';
import { designLimits } from '../src/designs/design-limits';
import type { PulseDrive, SineDrive, Topology } from '../src/designs/design.types';
import type { LadderInput } from '../src/multiplier/ladder.types';
import { parseQuantity } from '../src/units/parse-quantity';
import type { QuantityUnit } from '../src/units/quantity.types';
import type { OptionTable } from './arguments';

/** A quantity flag with SI prefixes ("4.7n", "2k2", "25 kHz"); undefined when absent. */
export function quantityFlag(flags: Map<string, string | true>, name: string, unit: QuantityUnit): number | undefined {
  const value = flags.get(name);
  if (value === undefined) return undefined;
  if (value === true) throw new DomainError('invalid_quantity', `--${name} needs a value`, name);
  return parseQuantity(value, { unit, field: name });
}

function requiredQuantity(flags: Map<string, string | true>, name: string, unit: QuantityUnit): number {
  const value = quantityFlag(flags, name, unit);
  if (value === undefined) throw new DomainError('invalid_argument', `--${name} is required`, name);
  return value;
}

function integerFlag(flags: Map<string, string | true>, name: string): number | undefined {
  const value = flags.get(name);
  if (value === undefined) return undefined;
  const n = Number(value);
  if (value === true || !Number.isInteger(n) || n < 1)
    throw new DomainError('invalid_argument', `--${name} needs an integer ≥ 1`, name);
  return n;
}

/** The bare-ladder options, shared by `ladder`, `simulate` and `netlist`. Values accept SI prefixes (4.7n, 4n7, 2k2, 25 kHz). */
export const LADDER_OPTIONS: OptionTable = {
  topology: { type: 'string', value: 'half-wave|full-wave|bridge', help: 'ladder topology (default half-wave)' },
  stages: { type: 'string', value: 'N', help: 'stages: half-wave stage = 2 cells, full-wave stage = 3 capacitors' },
  cells: { type: 'string', value: 'K', help: 'cells instead of stages (a bridge has 2)' },
  peak: { type: 'string', value: 'V', help: 'secondary peak (not rms); the forward peak of a pulse drive' },
  freq: { type: 'string', value: 'F', help: 'drive frequency' },
  flyback: { type: 'string', value: 'V', help: 'pulse drive: flyback peak' },
  duty: { type: 'string', value: 'D', help: 'pulse drive: forward share of the period (default 0.5)' },
  cap: { type: 'string', value: 'C', help: 'every capacitor the same value' },
  caps: { type: 'string', value: 'C1,C2,...', help: 'capacitors from the source upward (C1 oscillating stage 1, ...)' },
  rs: { type: 'string', value: 'R', help: 'source resistance (default 0)' },
  'load-current': { type: 'string', value: 'I', help: 'external load current (default none)' },
  'load-r': { type: 'string', value: 'R', help: 'external load resistance (default none)' },
  'diode-is': { type: 'string', value: 'IS', help: 'diode saturation current (default 1n)' },
  'diode-n': { type: 'string', value: 'N', help: 'diode emission coefficient (default 2)' },
  'diode-rs': { type: 'string', value: 'R', help: 'diode series resistance (default 1)' },
  bleeder: { type: 'string', value: 'R', help: 'bleeder string total resistance' },
  'series-r': { type: 'string', value: 'R', help: 'series output resistor' },
  'safe-voltage': { type: 'string', value: 'V', help: "discharge target (default 50 V, or the design's)" },
  negative: { type: 'boolean', help: 'build a negative ladder' },
};

/** The `--text` switch of the commands that can print a table instead of JSON. */
export const TEXT_OPTION: OptionTable = { text: { type: 'boolean', help: 'a table instead of JSON' } };

/** A bare ladder from command-line flags (the same flags serve `ladder`, `simulate` and `netlist`). */
export function ladderInputFromFlags(flags: Map<string, string | true>): {
  input: LadderInput;
  safeVoltageV: number | undefined;
} {
  const topologyText = String(flags.get('topology') ?? 'half-wave');
  const topology: Topology | null =
    topologyText === 'bridge' || topologyText === 'bridge-doubler'
      ? 'bridge-doubler'
      : topologyText === 'half-wave' || topologyText === 'full-wave'
        ? topologyText
        : null;
  if (!topology) throw new DomainError('invalid_argument', 'expected half-wave, full-wave or bridge', 'topology');
  const stages = integerFlag(flags, 'stages');
  const cells = integerFlag(flags, 'cells');
  if (stages !== undefined && cells !== undefined)
    throw new DomainError('invalid_argument', 'give --stages or --cells, not both', 'stages');
  const cellCount =
    topology === 'bridge-doubler'
      ? 2
      : (cells ?? (stages === undefined ? undefined : topology === 'full-wave' ? stages : 2 * stages));
  if (cellCount !== undefined && !(cellCount >= 1 && cellCount <= designLimits.maxCellCount)) {
    throw new DomainError('invalid_argument', `must give 1 to ${designLimits.maxCellCount} cells`, 'cells');
  }
  const capsText = flags.get('caps');
  let capacitorsF: number[];
  if (typeof capsText === 'string') {
    const capsCount = capsText.split(',').length;
    if (capsCount > designLimits.maxCapacitorCount) {
      throw new DomainError('invalid_argument', `at most ${designLimits.maxCapacitorCount} capacitors`, 'caps');
    }
    capacitorsF = capsText.split(',').map((text, i) => parseQuantity(text, { unit: 'F', field: `caps[${i}]` }));
    const expected =
      cellCount === undefined ? capacitorsF.length : topology === 'full-wave' ? 3 * cellCount : cellCount;
    if (capacitorsF.length !== expected) {
      throw new DomainError(
        'invalid_argument',
        `${topology} with ${cellCount} cells needs ${expected} capacitors, got ${capacitorsF.length}`,
        'caps',
      );
    }
  } else {
    if (cellCount === undefined)
      throw new DomainError('invalid_argument', '--stages or --cells is required with --cap', 'stages');
    const cap = requiredQuantity(flags, 'cap', 'F');
    capacitorsF = Array<number>(topology === 'full-wave' ? 3 * cellCount : cellCount).fill(cap);
  }
  const peakV = requiredQuantity(flags, 'peak', 'V');
  const frequencyHz = requiredQuantity(flags, 'freq', 'Hz');
  const sourceResistanceOhm = quantityFlag(flags, 'rs', 'Ohm') ?? 0;
  const flybackV = quantityFlag(flags, 'flyback', 'V');
  const drive: SineDrive | PulseDrive =
    flybackV === undefined
      ? { kind: 'sine', peakV, frequencyHz, sourceResistanceOhm }
      : {
          kind: 'pulse',
          forwardPeakV: peakV,
          flybackPeakV: flybackV,
          frequencyHz,
          dutyCycle: quantityFlag(flags, 'duty', 's') ?? 0.5,
          sourceResistanceOhm,
        };
  const loadCurrent = quantityFlag(flags, 'load-current', 'A');
  const loadR = quantityFlag(flags, 'load-r', 'Ohm');
  if (loadCurrent !== undefined && loadR !== undefined)
    throw new DomainError('invalid_argument', 'give --load-current or --load-r, not both', 'load-current');
  const input: LadderInput = {
    topology,
    capacitorsF,
    drive,
    diode: {
      saturationCurrentA: quantityFlag(flags, 'diode-is', 'A') ?? 1e-9,
      emissionCoefficient: quantityFlag(flags, 'diode-n', 'V') ?? 2,
      seriesResistanceOhm: quantityFlag(flags, 'diode-rs', 'Ohm') ?? 1,
    },
    polarity: flags.has('negative') ? -1 : 1,
    load:
      loadCurrent !== undefined
        ? { kind: 'current', currentA: loadCurrent }
        : loadR !== undefined
          ? { kind: 'resistance', resistanceOhm: loadR }
          : null,
    bleederOhm: quantityFlag(flags, 'bleeder', 'Ohm') ?? null,
    seriesOutputResistanceOhm: quantityFlag(flags, 'series-r', 'Ohm') ?? 0,
  };
  return { input, safeVoltageV: quantityFlag(flags, 'safe-voltage', 'V') };
}
