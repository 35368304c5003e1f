export {
  normalizePart,
  partFieldsFor,
  PART_KINDS,
  PART_FIELDS,
  REQUIRED_PART_FIELDS,
  PART_CODE_PATTERN,
  PART_DESCRIPTION_MAX_LENGTH,
} from './validate-part';
export type { PartField } from './validate-part';
export {
  KIND_MAGNETICS,
  MAGNETICS_FIELDS,
  MAGNETICS_FIELD_SPECS,
  parseMagneticsValue,
  magneticsValueIssue,
  magneticsOf,
} from './part-magnetics';
export type { MagneticsField } from './part-magnetics';
export { csvCellNeedsQuotes, neutraliseCsvCell } from './csv-cell';
export { fillPartRatings, partReferences } from './fill-part-ratings';
export type { ShelfPart } from './fill-part-ratings';
export { bomCost } from './bom-cost';
export type { BomCost, BomLine } from './bom-cost';
export { shelfForSizer } from './shelf-for-sizer';
export type { SizerPartsList, DiodeModelParameters } from './shelf-for-sizer';
export { analyzeWithShelf } from './analyze-with-shelf';
export type { ShelfDesignReport } from './analyze-with-shelf';
export { coreKindOf, wireKindOf, tapeKindOf, shelfMagnetics } from './shelf-magnetics';
