import { DomainError } from '../src/errors';
import { designLimits } from '../src/designs/design-limits';
import type { PulseDrive, SineDrive, Topology } from '../src/designs/design.types';
import type { LadderInput } from '../src/multiplier/ladder.types';
import { parseQuantity } from '../src/units/parse-quantity';
import type { QuantityUnit } from '../src/units/quantity.types';

/** `--name value` pairs and bare `--flag`s, plus positional arguments. */
export interface ParsedArguments {
  positional: string[];
  flags: Map<string, string | true>;
}

export function parseArguments(argv: ReadonlyArray<string>): ParsedArguments {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i] as string;
    if (!arg.startsWith('--')) {
      positional.push(arg);
      continue;
    }
    const [name, inline] = arg.slice(2).split('=', 2) as [string, string | undefined];
    const next = argv[i + 1];
    if (inline !== undefined) flags.set(name, inline);
    // A value may itself start with "-" (e.g. --peak -6k is not allowed, but "-6 kV" as --target is).
    else if (next !== undefined && (!next.startsWith('--') || /^--?\d/.test(next))) {
      flags.set(name, next);
      i += 1;
    } else flags.set(name, true);
  }
  return { positional, flags };
}

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

export const LADDER_FLAGS_HELP = `  --topology half-wave|full-wave|bridge   (default half-wave)
  --stages N | --cells K                  half-wave stage = 2 cells; full-wave stage = 3 capacitors; bridge has 2 cells
  --peak V --freq F                       secondary peak (not rms) and frequency
  [--flyback V --duty D]                  pulse drive: forward peak --peak for duty D, flyback peak --flyback
  --cap C | --caps C1,C2,...              capacitors from the source upward (C1 oscillating stage 1, C2 smoothing stage 1 ...)
  [--rs R]                                source resistance (default 0)
  [--load-current I | --load-r R]         external load (default none)
  [--diode-is IS --diode-n N --diode-rs R] Shockley diode (default 1n, 2, 1)
  [--bleeder R] [--series-r R]            bleeder string total and series output resistor
  [--safe-voltage V] [--negative]         discharge target; build a negative ladder
  values accept SI prefixes: 4.7n, 4n7, 2k2, 25 kHz, 1.5 kV`;

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
