export { parseQuantity, parseQuantityWithUnit } from './parse-quantity';
export { formatQuantity } from './format-quantity';
export { roundStep } from './round-step';
export { nearestPreferred, preferredValuesBetween, seriesMantissas } from './e-series';
export type { ESeriesName } from './e-series';
export type { QuantityUnit, ParsedQuantity, ParseQuantityOptions } from './quantity.types';
