import { readDesignFile } from '../design-file';
import { DomainError } from '../../src/errors';
import { ladderInputOf, resolveDrive } from '../../src/analysis/analyze-design';
import { toleranceSpread } from '../../src/sizing/tolerance-spread';
import { formatQuantity } from '../../src/units/format-quantity';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { quantityFlag, TEXT_OPTION } from '../ladder-flags';

export const spreadSyntax: CommandSyntax = {
  command: 'spread',
  options: {
    trials: { type: 'string', value: 'N', help: 'Monte Carlo trials (default 1000)' },
    seed: { type: 'string', value: 'S', help: 'random seed, an integer (default 1)' },
    'drive-variation': { type: 'string', value: 'FRACTION', help: 'drive amplitude variation (default 0.05)' },
    ...TEXT_OPTION,
  },
  positionals: ['DESIGN.json'],
};
export const spreadSummary = "seeded tolerance spread over the design's capacitor tolerances and drive variation";

/** `ladderwright spread DESIGN.json`: Monte Carlo spread over the design's capacitor tolerances and drive variation. */
export function spreadCommand(argv: ReadonlyArray<string>): string {
  const { positional, flags } = parseCommandArguments(argv, spreadSyntax);
  const path = positional[0];
  if (!path) throw new DomainError('invalid_argument', 'a design file is required', 'DESIGN.json');
  const design = readDesignFile(path);
  const { drive, currentLimitA } = resolveDrive(design);
  const trials = Number(flags.get('trials') ?? 1000);
  const seed = Number(flags.get('seed') ?? 1);
  if (!Number.isInteger(seed)) throw new DomainError('invalid_argument', 'seed must be an integer', 'seed');
  const result = toleranceSpread({
    input: ladderInputOf(design, drive, currentLimitA),
    capacitorTolerance: design.multiplier.capacitors.map((c) => c.tolerance),
    driveVariation: quantityFlag(flags, 'drive-variation', 'V') ?? 0.05,
    trials,
    seed,
    spec: { outputMinV: Math.abs(design.targets.outputV), rippleMaxV: design.targets.rippleMaxV },
  });
  if (!flags.has('text')) return JSON.stringify(result, null, 2);
  const o = result.outputV;
  return [
    `Tolerance spread of "${design.name}", ${result.trials} trials, seed ${result.seed}`,
    `  output mean ${formatQuantity(o.mean, 'V', 4)}, sd ${formatQuantity(o.sd, 'V')}, 5 % ${formatQuantity(o.p5, 'V', 4)}, 95 % ${formatQuantity(o.p95, 'V', 4)}`,
    `  ripple mean ${formatQuantity(result.rippleV.mean, 'V')}, 95 % ${formatQuantity(result.rippleV.p95, 'V')}`,
    `  within spec: ${(result.fractionWithinSpec * 100).toFixed(1)} %`,
  ].join('\n');
}
