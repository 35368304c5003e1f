import { Type } from '@sinclair/typebox';
import { designLimits as L } from './design-limits';

/**
 * Building blocks of the design schema. Each returns a TypeBox schema (plain JSON Schema, draft 2020-12)
 * with its bounds, so the TypeScript type, the published schema and the validator read the same limits.
 * `errorMessage` (the ajv-errors keyword) replaces the generic message for a node when given.
 */

/** A quantity > 0, at most `max`, in the SI base unit its name carries. */
export const positive = (max: number, description?: string) =>
  Type.Number({ exclusiveMinimum: 0, maximum: max, ...(description ? { description } : {}) });

/** A quantity ≥ 0, at most `max`. */
export const nonNegative = (max: number, description?: string) =>
  Type.Number({ minimum: 0, maximum: max, ...(description ? { description } : {}) });

/** A quantity in [min, max]. */
export const between = (min: number, max: number, description?: string) =>
  Type.Number({ minimum: min, maximum: max, ...(description ? { description } : {}) });

/** A fraction in [0, 1] with either end open. */
export const fraction = (openLow: boolean, openHigh: boolean, description?: string) =>
  Type.Number({
    ...(openLow ? { exclusiveMinimum: 0 } : { minimum: 0 }),
    ...(openHigh ? { exclusiveMaximum: 1 } : { maximum: 1 }),
    ...(description ? { description } : {}),
  });

/** A junction's built-in potential (SPICE VJ, VJE, VJC), V. */
export const junctionPotential = (description: string) =>
  between(L.minJunctionPotentialV, L.maxJunctionPotentialV, description);

/** A junction's grading coefficient (SPICE M, MJE, MJC), in (0, maxGradingCoefficient]. */
export const gradingCoefficient = (description: string) =>
  Type.Number({ exclusiveMinimum: 0, maximum: L.maxGradingCoefficient, description });

/**
 * A diode's depletion charge (SPICE CJO, VJ, M; the defaults are SPICE's) and breakdown current (IBV), for the
 * ladder's and the clamp's diodes.
 */
export const diodeJunctionFields = () => ({
  junctionCapacitanceF: Type.Optional(
    nonNegative(L.maxCapacitanceF, 'Zero-bias junction capacitance (SPICE CJO); none if absent.'),
  ),
  junctionPotentialV: Type.Optional(junctionPotential('Junction potential (SPICE VJ); 1 V if absent.')),
  gradingCoefficient: Type.Optional(gradingCoefficient('Junction grading coefficient (SPICE M); 0.5 if absent.')),
  breakdownCurrentA: Type.Optional(
    positive(L.maxCurrentA, 'Reverse current at the breakdown voltage (SPICE IBV); 1 mA if absent.'),
  ),
});

/** A whole count in [min, max]. */
export const count = (min: number, max: number, description?: string) =>
  Type.Integer({ minimum: min, maximum: max, ...(description ? { description } : {}) });

/**
 * Text without control characters (tab, line feed and carriage return allowed) or unpaired UTF-16
 * surrogates, which PostgreSQL and JSON consumers refuse. Written without the `u` flag so that it reads
 * the same in TypeBox (no flag) and in Ajv (`u` flag).
 */
export const TEXT_PATTERN =
  '^(?:[^\\u0000-\\u0008\\u000B\\u000C\\u000E-\\u001F\\uD800-\\uDFFF]|[\\uD800-\\uDBFF][\\uDC00-\\uDFFF])*$';

/** Text of at most `maxLength` UTF-16 code units. */
export const text = (maxLength: number, description?: string) =>
  Type.String({
    maxLength,
    pattern: TEXT_PATTERN,
    ...(description ? { description } : {}),
  });

/** An object that refuses keys it does not name. */
export const closedObject: typeof Type.Object = (properties, options) =>
  Type.Object(properties, { additionalProperties: false, ...options });

/** A plain JSON Schema object, as published. */
export interface PublishedSchema {
  [keyword: string]: unknown;
  required?: string[];
  $defs: Record<string, unknown>;
}

/**
 * A plain JSON Schema of `root` in which each named sub-schema (found by identity) becomes a
 * `$ref: '#/$defs/<name>'`, its body listed once under `$defs`; so the published document reads as a
 * set of named parts while the definition stays one nested TypeBox value.
 */
export function withDefinitions(root: object, named: Record<string, object>): PublishedSchema {
  const names = new Map(Object.entries(named).map(([name, schema]) => [schema, name]));
  const plain = (node: unknown, self: object | null): unknown => {
    if (Array.isArray(node)) return node.map((item) => plain(item, null));
    if (typeof node !== 'object' || node === null) return node;
    const name = node === self ? undefined : names.get(node);
    if (name) return { $ref: `#/$defs/${name}` };
    return Object.fromEntries(Object.entries(node).map(([key, value]) => [key, plain(value, null)]));
  };
  const $defs = Object.fromEntries(Object.entries(named).map(([name, schema]) => [name, plain(schema, schema)]));
  return { ...(plain(root, root) as Record<string, unknown>), $defs };
}
