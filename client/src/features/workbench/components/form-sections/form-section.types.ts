import type { Part } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import type { Edit } from '../../document-path';
import type { PartSlot } from '../../shelf-picks';

/** What every form section gets: the document, the edit that changes a copy of it, and issues by document path. */
export interface SectionProps {
  document: Design;
  edit: Edit<Design>;
  issue: (path: string) => string | null;
}

/** A section with part-code fields: the shelf, and what a pick from it does (fills value and ratings). */
export interface ShelfProps {
  parts: readonly Part[];
  onPickPart: (slot: PartSlot, part: Part) => void;
}

/** The form sections in order, with the names the Form index and the section headings use. */
export const FORM_SECTIONS = [
  { id: 'design', title: 'Design' },
  { id: 'drive', title: 'Drive' },
  { id: 'transformer', title: 'Transformer' },
  { id: 'transistor', title: 'Transistor' },
  { id: 'ladder', title: 'Ladder' },
  { id: 'output', title: 'Output network' },
  { id: 'targets', title: 'Targets' },
] as const;

export type FormSectionId = (typeof FORM_SECTIONS)[number]['id'];

/** The section that holds a document path (for issue counts in the Form index). */
export function sectionOfPath(path: string): FormSectionId {
  if (path.startsWith('drive.driver.transformer')) return 'transformer';
  if (/^drive\.driver\.(transistor|baseResistorOhm|collectorResistorOhm|clamp)/.test(path)) return 'transistor';
  if (path.startsWith('drive')) return 'drive';
  if (path.startsWith('multiplier')) return 'ladder';
  if (path.startsWith('outputNetwork') || path.startsWith('load')) return 'output';
  if (path.startsWith('targets')) return 'targets';
  return 'design';
}
