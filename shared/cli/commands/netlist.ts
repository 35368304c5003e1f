import { readDesignFile } from '../design-file';
import { estimateBlockingOscillator } from '../../src/driver/blocking-oscillator';
import { buildLadderCircuit } from '../../src/circuits/build-ladder-circuit';
import { buildCircuit } from '../../src/circuits/design-circuit';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { effectiveDriverStage } from '../../src/transformer/given-numbers';
import { parseCommandArguments, type CommandSyntax } from '../arguments';
import { LADDER_OPTIONS } from '../ladder-flags';
import { ladderFromArguments, refuseDesignWithLadderOptions } from './simulate';

export const netlistSyntax: CommandSyntax = {
  command: 'netlist',
  options: LADDER_OPTIONS,
  positionals: ['DESIGN.json'],
  positionalsOptional: true,
};
export const netlistSummary = 'SPICE netlist (.cir) of a design or a bare ladder, with a .tran of 200 periods';

/**
 * `ladderwright netlist DESIGN.json | <bare-ladder flags>`: the SPICE netlist (.cir text) of the ladder with
 * its drive and load (a driver drive: the transistor stage and transformer), with a `.tran` of 200 periods
 * (the estimated oscillation period for a driver) at 1/200 of a period.
 */
export function netlistCommand(argv: ReadonlyArray<string>): string {
  const parsed = parseCommandArguments(argv, netlistSyntax);
  refuseDesignWithLadderOptions(parsed);
  const { positional } = parsed;
  if (positional[0]) {
    const design = readDesignFile(positional[0]);
    if (design.drive.kind === 'driver') {
      const periodS = 1 / estimateBlockingOscillator(effectiveDriverStage(design.drive.driver)).frequencyHz.value;
      return toSpiceNetlist(buildCircuit(design), { transient: { stopTimeS: 200 * periodS, maxStepS: periodS / 200 } });
    }
  }
  const { spec } = ladderFromArguments(parsed);
  const periodS = 1 / spec.drive.frequencyHz;
  return toSpiceNetlist(buildLadderCircuit(spec), { transient: { stopTimeS: 200 * periodS, maxStepS: periodS / 200 } });
}
