import type { Part } from '@ladderwright/shared/api';
import type { SpacingEnvironment } from '@ladderwright/shared/designs';
import { estimateBlockingOscillator, type DriverStage } from '@ladderwright/shared/driver';
import { shelfMagnetics } from '@ladderwright/shared/parts';
import {
  demoCoreKinds,
  demoTapeKinds,
  demoWireKinds,
  endMarginForCreepageM,
  type CoreKind,
  type TapeKind,
  type TransformerSection,
  type WireKind,
} from '@ladderwright/shared/transformer';

/** The cores, wires and tapes a transformer may be built from: the shelf's, or the demo kinds on an empty shelf. */
export function magneticsChoices(parts: readonly Part[]): { cores: CoreKind[]; wires: WireKind[]; tapes: TapeKind[] } {
  const shelf = shelfMagnetics(parts);
  return {
    cores: shelf.cores.length > 0 ? shelf.cores : [...demoCoreKinds],
    wires: shelf.wires.length > 0 ? shelf.wires : [...demoWireKinds],
    tapes: shelf.tapes.length > 0 ? shelf.tapes : [...demoTapeKinds],
  };
}

/**
 * A first transformer section for a driver stage that has none: the given turns and primary inductance (as
 * the gap's target) on the first core offered, the thickest wire on the primary and the thinnest on the
 * secondary, the thinnest tape between layers and the thickest between windings, and, given the design's
 * spacing, end margins for the flange creepage at the estimate's secondary peak (else 1.5 mm); the user edits
 * from there.
 */
export function startingSection(
  driver: DriverStage,
  parts: readonly Part[],
  spacing?: SpacingEnvironment,
): TransformerSection {
  const { cores, wires, tapes } = magneticsChoices(parts);
  const byDiameter = [...wires].sort((a, b) => a.copperDiameterM - b.copperDiameterM);
  const byThickness = [...tapes].sort((a, b) => a.thicknessM - b.thicknessM);
  const thinnest = byDiameter[0];
  const thickest = byDiameter[byDiameter.length - 1];
  const middle = byDiameter[Math.floor((byDiameter.length - 1) / 2)];
  const core = cores[0];
  const thinTape = byThickness[0];
  const thickTape = byThickness[byThickness.length - 1];
  if (!core || !thinnest || !thickest || !middle || !thinTape || !thickTape) {
    throw new Error('the demo kinds always offer a core, a wire and a tape');
  }
  const given = driver.transformer;
  return {
    core,
    gap: { kind: 'primary-inductance', primaryInductanceH: given.primaryInductanceH },
    windings: [
      { role: 'primary', turns: given.primaryTurns, wire: thickest, startPin: 1, endPin: 2 },
      { role: 'feedback', turns: given.feedbackTurns, wire: middle, startPin: 3, endPin: 4 },
      { role: 'secondary', turns: given.secondaryTurns, wire: thinnest, layerTapeWraps: 1, startPin: 5, endPin: 6 },
    ],
    layerTape: thinTape,
    windingTape: thickTape,
    windingTapeWraps: 3,
    endMarginM: startingEndMarginM(driver, spacing),
    inductanceTolerance: 0.1,
  };
}

/** End margin for the flange creepage at the driver estimate's larger secondary peak; 1.5 mm without one. */
function startingEndMarginM(driver: DriverStage, spacing: SpacingEnvironment | undefined): number {
  if (!spacing) return 1.5e-3;
  try {
    const estimate = estimateBlockingOscillator(driver);
    const peakV = Math.max(estimate.forwardSecondaryPeakV.value, estimate.flybackSecondaryPeakV.value);
    return Number.isFinite(peakV) && peakV > 0 ? endMarginForCreepageM(peakV, spacing) : 1.5e-3;
  } catch {
    // A stage the estimate refuses (its fields are being typed): the plain margin, the Checks say the rest.
    return 1.5e-3;
  }
}
