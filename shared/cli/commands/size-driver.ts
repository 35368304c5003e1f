import { DomainError } from '../../src/errors';
import type { DriverStage } from '../../src/designs/driver-stage.types';
import { DRIVER_SIZER_DEFAULTS, sizeDriverSupply } from '../../src/sizing/size-driver-supply';
import { formatQuantity } from '../../src/units/format-quantity';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { quantityFlag, TEXT_OPTION } from '../ladder-flags';
import { sizeSyntax } from './size';

export const sizeDriverSyntax: CommandSyntax = {
  command: 'size-driver',
  options: {
    target: sizeSyntax.options.target!,
    'load-current': sizeSyntax.options['load-current']!,
    ripple: sizeSyntax.options.ripple!,
    dc: { type: 'string', value: 'V', help: 'a DC supply of this voltage instead of cells' },
    count: { type: 'string', value: 'N', help: 'supplies listed, 1 to 100' },
    ...TEXT_OPTION,
  },
  positionals: [],
};
export const sizeDriverSummary = 'Sizer for a whole driver-fed supply (cells by default)';

function required(value: number | undefined, name: string): number {
  if (value === undefined) throw new DomainError('invalid_argument', `--${name} is required`, name);
  return value;
}

/**
 * `ladderwright size-driver ...`: ranked whole supplies (cells, turns ratio, ladder cells, capacitors,
 * bleeder) from the driver Sizer, starting from the same stage and candidate lists as the Sizer's form.
 */
export function sizeDriverCommand(argv: ReadonlyArray<string>): string {
  const { flags } = parseCommandArguments(argv, sizeDriverSyntax);
  const dcV = quantityFlag(flags, 'dc', 'V');
  const base = DRIVER_SIZER_DEFAULTS.stage;
  const stage: DriverStage =
    dcV === undefined ? base : { ...base, supply: { kind: 'dc', voltageV: dcV, sourceResistanceOhm: 0.1 } };
  const countText = flags.get('count');
  const resultCount = countText === undefined ? DRIVER_SIZER_DEFAULTS.resultCount : Number(countText);
  if (!Number.isInteger(resultCount) || resultCount < 1 || resultCount > 100)
    throw new DomainError('invalid_argument', '--count needs an integer from 1 to 100', 'count');
  const result = sizeDriverSupply({
    targetOutputV: required(quantityFlag(flags, 'target', 'V'), 'target'),
    loadCurrentA: required(quantityFlag(flags, 'load-current', 'A'), 'load-current'),
    rippleMaxV: required(quantityFlag(flags, 'ripple', 'V'), 'ripple'),
    stage,
    resultCount,
  });
  if (!flags.has('text')) return JSON.stringify(result, null, 2);
  const lines = [
    `Driver Sizer: ${result.evaluatedCount} combinations, ${result.meetingSpecCount} within ±${DRIVER_SIZER_DEFAULTS.tolerance * 100} % of the target`,
  ];
  for (const c of result.candidates) {
    lines.push(
      `  #${c.rank} ${c.cellsInSeries === null ? 'DC' : `${c.cellsInSeries} cell${c.cellsInSeries === 1 ? '' : 's'}`}, 1:${c.turnsRatio.toFixed(1)} (${c.secondaryTurns} turns), ` +
        `${c.ladderCells} ladder cells of ${formatQuantity(c.capacitorF, 'F')}, ` +
        `bleeder ${c.bleederOhm === null ? 'none' : formatQuantity(c.bleederOhm, 'Ohm')}: ${formatQuantity(c.outputMeanV, 'V', 4)}, ` +
        `ripple ${formatQuantity(c.ripplePeakToPeakV, 'V')}, draws ${formatQuantity(c.supplyCurrentA, 'A')}, ` +
        `η ${(c.efficiency * 100).toFixed(1)} %` +
        (c.batteryLifeS !== null ? `, battery ${(c.batteryLifeS / 3600).toFixed(1)} h` : '') +
        `, worst check ${c.worstCheck.id} ${c.worstCheck.verdict} (${c.worstCheck.marginPct.toFixed(1)} %)`,
    );
  }
  return lines.join('\n');
}
