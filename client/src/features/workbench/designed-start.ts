import { startingTransformer } from '@ladderwright/shared/analysis';
import type { Part } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { shelfMagnetics } from '@ladderwright/shared/parts';
import type { TransformerSection } from '@ladderwright/shared/transformer';
import { magneticsChoices, startingSection } from './transformer-start';

/** A first designed transformer and what to tell the person who switched to it. */
export interface DesignedStart {
  section: TransformerSection;
  /** Which core was taken and why, in words. */
  note: string;
}

/**
 * The first transformer section of a design switching to a designed transformer: the transformer Sizer's choice
 * for its driver (`startingTransformer`: the given inductance and turns ratios kept on the best-ranked core that
 * fits); when no core fits (or the engine refuses the design as it stands), the given turns on the first core
 * (`startingSection`), and the note says so.
 */
export function startDesignedTransformer(design: Design, parts: readonly Part[]): DesignedStart | null {
  if (design.drive.kind !== 'driver') return null;
  const driver = design.drive.driver;
  const kinds = magneticsChoices(parts);
  const source =
    parts.length > 0 && shelfMagnetics(parts).cores.length > 0 ? 'on the Parts shelf' : 'of the demo kinds';
  let isRefused = false;
  try {
    const started = startingTransformer(design, kinds);
    if (started) return { section: started.section, note: started.reason };
  } catch {
    // A design the engine refuses as it stands (a field being typed): the given turns below.
    isRefused = true;
  }
  const section = startingSection(driver, parts, design.targets.spacing);
  const why = isRefused
    ? 'The driver cannot be estimated as it stands'
    : `No core ${source} fits this driver with its given inductance and turns ratios`;
  return {
    section,
    note:
      `${why}, so the section starts on ${section.core.code} with the given turns; the core Sizer on the ` +
      `Transformer tab says why each core is refused.`,
  };
}
