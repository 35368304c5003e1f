export { layoutSchematic, labelBox, LABEL_SIZE_PX } from './schematic-layout';
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
