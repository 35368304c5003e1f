import { DomainError } from '../../src/errors';
import type { PulseDrive, SineDrive, Topology } from '../../src/designs/design.types';
import { sizeLadder } from '../../src/sizing/size-ladder';
import type { ESeriesName } from '../../src/units/e-series';
import { formatQuantity } from '../../src/units/format-quantity';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { LADDER_OPTIONS, quantityFlag, TEXT_OPTION } from '../ladder-flags';

export const sizeSyntax: CommandSyntax = {
  command: 'size',
  options: {
    target: { type: 'string', value: 'V', help: 'output the ladder must reach at the load (required)' },
    'load-current': { type: 'string', value: 'I', help: 'load current (required)' },
    ripple: { type: 'string', value: 'V', help: 'largest peak-to-peak ripple (required)' },
    peak: LADDER_OPTIONS.peak!,
    freq: LADDER_OPTIONS.freq!,
    rs: LADDER_OPTIONS.rs!,
    flyback: LADDER_OPTIONS.flyback!,
    duty: LADDER_OPTIONS.duty!,
    topology: { type: 'string', value: 'half-wave|full-wave|bridge', help: 'only this topology (default all)' },
    series: { type: 'string', value: 'E6|E12|E24|E48|E96', help: 'preferred-value series of the capacitors' },
    'safe-voltage': LADDER_OPTIONS['safe-voltage']!,
    count: { type: 'string', value: 'N', help: 'candidates listed (default 10)' },
    ...TEXT_OPTION,
  },
  positionals: [],
};
export const sizeSummary = 'Sizer: ranked candidate ladders for a target output, load and ripple';

function required(value: number | undefined, name: string): number {
  if (value === undefined) throw new DomainError('invalid_argument', `--${name} is required`, name);
  return value;
}

function countFlag(value: string | true | undefined): number {
  if (value === undefined) return 10;
  const n = Number(value);
  if (value === true || !Number.isInteger(n) || n < 1)
    throw new DomainError('invalid_argument', '--count needs an integer ≥ 1', 'count');
  return n;
}

/** `ladderwright size ...`: ranked candidate ladders from the Sizer. */
export function sizeCommand(argv: ReadonlyArray<string>): string {
  const { flags } = parseCommandArguments(argv, sizeSyntax);
  const peakV = required(quantityFlag(flags, 'peak', 'V'), 'peak');
  const frequencyHz = required(quantityFlag(flags, 'freq', 'Hz'), 'freq');
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
  const topologyText = flags.get('topology');
  const topologies: Topology[] | undefined =
    typeof topologyText === 'string'
      ? [topologyText === 'bridge' ? 'bridge-doubler' : (topologyText as Topology)]
      : undefined;
  if (topologies && !['half-wave', 'full-wave', 'bridge-doubler'].includes(topologies[0] as string)) {
    throw new DomainError('invalid_argument', 'expected half-wave, full-wave or bridge', 'topology');
  }
  const series = flags.get('series');
  if (series !== undefined && !['E6', 'E12', 'E24', 'E48', 'E96'].includes(String(series))) {
    throw new DomainError('invalid_argument', 'expected E6, E12, E24, E48 or E96', 'series');
  }
  const safeVoltageV = quantityFlag(flags, 'safe-voltage', 'V');
  const result = sizeLadder({
    targetOutputV: required(quantityFlag(flags, 'target', 'V'), 'target'),
    loadCurrentA: required(quantityFlag(flags, 'load-current', 'A'), 'load-current'),
    rippleMaxV: required(quantityFlag(flags, 'ripple', 'V'), 'ripple'),
    drive,
    ...(topologies ? { topologies } : {}),
    ...(series !== undefined ? { series: series as ESeriesName } : {}),
    ...(safeVoltageV !== undefined ? { safeVoltageV } : {}),
    resultCount: countFlag(flags.get('count')),
  });
  if (!flags.has('text')) return JSON.stringify(result, null, 2);
  const lines = [`Sizer: ${result.evaluatedCount} candidates evaluated, ${result.meetingSpecCount} meet the spec`];
  for (const c of result.candidates) {
    lines.push(
      `  #${c.rank} ${c.topology} ${c.cellCount} cells ${c.grading}, C from ${formatQuantity(Math.max(...c.capacitorsF), 'F')}: ` +
        `${formatQuantity(c.outputMeanV, 'V', 4)}, ripple ${formatQuantity(c.ripplePeakToPeakV, 'V')}, ` +
        `${formatQuantity(c.storedEnergyJ, 'J')}, ${c.partCount} parts, worst margin ${c.worstMarginPct.toFixed(1)} %` +
        (c.bleeder ? `, bleeder ${c.bleeder.count} × ${formatQuantity(c.bleeder.resistor.valueOhm, 'Ohm')}` : ''),
    );
  }
  return lines.join('\n');
}
