export { layoutSchematic } from './schematic-layout';
export { labelBox, LABEL_SIZE_PX } from './schematic-sheet';
export { partChecksOf, verdictText } from './part-checks';
export type {
  Box,
  PartCheck,
  PartVerdict,
  Point,
  SchematicLabel,
  SchematicLayout,
  SchematicStroke,
} from './schematic.types';
