import { buildLadderCircuit } from '../../src/sim/build-circuit';
import { toSpiceNetlist } from '../../src/sim/to-spice-netlist';
import { ladderFromArguments } from './simulate';

/** `ladderwright netlist DESIGN.json | <bare-ladder flags>`: the SPICE netlist (.cir text) of the ladder with its drive and load. */
export function netlistCommand(argv: ReadonlyArray<string>): string {
  const { spec } = ladderFromArguments(argv);
  const periodS = 1 / spec.drive.frequencyHz;
  return toSpiceNetlist(buildLadderCircuit(spec), { transient: { stopTimeS: 200 * periodS, maxStepS: periodS / 200 } });
}
