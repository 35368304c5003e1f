import { buildDriverCircuit } from './build-driver-circuit';
import type { Design } from '../designs/design.types';
import { buildLadderCircuit, ladderPartFromDesign, ladderSpecFromDesign } from './build-ladder-circuit';
import type { Circuit } from '../sim/circuit.types';
import { withEffectiveTransformer } from '../transformer/given-numbers';

/**
 * Circuit of a design document: the multiplier with its drive, output network and load. A sine or pulse
 * drive is an ideal source behind its resistance; a driver drive is the full transistor stage with its
 * transformer (shared/src/driver/build-driver-circuit.ts), its secondary feeding the ladder.
 */
export function buildCircuit(givenDesign: Design): Circuit {
  const design = withEffectiveTransformer(givenDesign);
  if (design.drive.kind === 'driver')
    return buildDriverCircuit(design.drive.driver, { ladder: ladderPartFromDesign(design) });
  return buildLadderCircuit(ladderSpecFromDesign(design));
}
