import { Kind } from '@sinclair/typebox';
import type { TSchema } from '@sinclair/typebox';
import { ValueErrorType } from '@sinclair/typebox/errors';
import type { ValueError } from '@sinclair/typebox/errors';
import { Value } from '@sinclair/typebox/value';
import { fieldPath } from '../errors';
import type { FieldIssue } from '../errors';

/**
 * Field-level issues of a value against a TypeBox schema, in our notation (`multiplier.capacitors[3].valueF`)
 * and with our messages. A union is resolved to the variant the value was meant as (its type and its
 * `kind`-like literal field match), so errors come from that variant alone; a value that fits no variant
 * gets one issue listing what is allowed. One issue per path, the first found.
 */
export function schemaIssues(schema: TSchema, value: unknown): FieldIssue[] {
  const byPath = new Map<string, string>();
  collect([...Value.Errors(schema, value)], byPath);
  return [...byPath].map(([path, message]) => ({ path, message }));
}

function collect(errors: ValueError[], byPath: Map<string, string>): void {
  for (const error of errors) {
    const resolved = error.type === ValueErrorType.Union ? resolveUnion(error) : null;
    if (resolved && resolved.length > 0) {
      collect(resolved, byPath);
      continue;
    }
    const issue = resolved ? unionMismatch(error) : { path: toFieldPath(error.path), message: messageOf(error) };
    if (!byPath.has(issue.path)) byPath.set(issue.path, issue.message);
  }
}

/** From a JSON pointer (`/multiplier/capacitors/3/valueF`) to our notation. */
function toFieldPath(pointer: string): string {
  if (pointer === '') return '(document)';
  return pointer
    .slice(1)
    .split('/')
    .map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'))
    .reduce<string>((path, s) => fieldPath(path, /^(0|[1-9]\d*)$/.test(s) ? Number(s) : s), '');
}

/** The literal field every object variant of a union has (e.g. `kind`), if any. */
function discriminatorOf(variants: TSchema[]): string | null {
  const first = variants[0];
  if (!first || first[Kind] !== 'Object') return null;
  const key = Object.keys(first.properties as object).find((k) =>
    variants.every(
      (v) => v[Kind] === 'Object' && (v.properties as Record<string, TSchema | undefined>)[k]?.[Kind] === 'Literal',
    ),
  );
  return key ?? null;
}

/** Errors of the variant the value was meant as; empty when the value fits none. */
function resolveUnion(error: ValueError): ValueError[] {
  const variants = error.schema.anyOf as TSchema[];
  const key = discriminatorOf(variants.filter((v) => v[Kind] === 'Object'));
  const discriminatorPath = key ? `${error.path}/${key}` : null;
  let best: ValueError[] | null = null;
  error.errors.forEach((iterator) => {
    const found = [...iterator];
    const fits = found.every(
      (e) => e.path !== error.path && !(e.path === discriminatorPath && e.type === ValueErrorType.Literal),
    );
    if (fits && (best === null || found.length < best.length)) best = found;
  });
  return best ?? [];
}

/** One issue for a value that fits no variant: at the discriminator when the value has one. */
function unionMismatch(error: ValueError): FieldIssue {
  const variants = error.schema.anyOf as TSchema[];
  const objects = variants.filter((v) => v[Kind] === 'Object');
  const key = objects.length === variants.length ? discriminatorOf(objects) : null;
  const value = error.value;
  if (key && typeof value === 'object' && value !== null && !Array.isArray(value)) {
    const allowed = objects.map((v) => JSON.stringify((v.properties as Record<string, TSchema>)[key]!.const));
    return { path: toFieldPath(`${error.path}/${key}`), message: `expected one of ${allowed.join(', ')}` };
  }
  const allowed = variants.every((v) => v[Kind] === 'Literal')
    ? `one of ${variants.map(describe).join(', ')}`
    : variants.map(describe).join(' or ');
  const message = error.value === undefined ? `is required: ${allowed}` : `expected ${allowed}`;
  return { path: toFieldPath(error.path), message };
}

function describe(schema: TSchema): string {
  switch (schema[Kind]) {
    case 'Literal':
      return JSON.stringify(schema.const);
    case 'Number':
      return 'a finite number in SI base units';
    case 'Integer':
      return 'a whole number';
    case 'String':
      return 'text';
    case 'Boolean':
      return 'true or false';
    case 'Null':
      return 'null';
    case 'Array':
      return 'a list';
    case 'Object':
      return 'an object';
    case 'Union':
      return (schema.anyOf as TSchema[]).map(describe).join(' or ');
    default:
      return 'a value of another kind';
  }
}

const fmt = (x: number): string => String(x);

/** The bounds of a number as one phrase, e.g. "must lie in (0, 1)" or "must be greater than zero". */
function rangeMessage(schema: TSchema, value: number): string {
  const lo = schema.exclusiveMinimum ?? schema.minimum;
  const hi = schema.exclusiveMaximum ?? schema.maximum;
  const loOpen = schema.exclusiveMinimum !== undefined;
  const hiOpen = schema.exclusiveMaximum !== undefined;
  if (lo === 0 && hi !== undefined && hi <= 1) {
    return `must lie in ${loOpen ? '(' : '['}0, ${fmt(hi)}${hiOpen ? ')' : ']'}`;
  }
  const belowLow = lo !== undefined && (loOpen ? !(value > lo) : !(value >= lo));
  if (belowLow) {
    if (lo === 0) return loOpen ? 'must be greater than zero' : 'must not be negative';
    return loOpen ? `must be greater than ${fmt(lo)}` : `must be at least ${fmt(lo)}`;
  }
  return hiOpen ? `must be less than ${fmt(hi)}` : `must not exceed ${fmt(hi)} (a limit of the domain)`;
}

function messageOf(error: ValueError): string {
  const { schema } = error;
  if (typeof schema.errorMessage === 'string') return schema.errorMessage;
  switch (error.type) {
    case ValueErrorType.ObjectRequiredProperty:
      return `is required: ${describe(schema)}`;
    case ValueErrorType.ObjectAdditionalProperties:
      return 'is not a field here (unknown key); remove it';
    case ValueErrorType.Object:
      return 'expected an object';
    case ValueErrorType.Array:
      return 'expected a list';
    case ValueErrorType.ArrayMinItems:
      return `expected at least ${schema.minItems} item${schema.minItems === 1 ? '' : 's'}`;
    case ValueErrorType.ArrayMaxItems:
      return `expected at most ${schema.maxItems} items (a limit of the domain)`;
    case ValueErrorType.Number:
      return 'expected a finite number in SI base units';
    case ValueErrorType.Integer:
      return 'expected a whole number';
    case ValueErrorType.NumberExclusiveMinimum:
    case ValueErrorType.NumberMinimum:
    case ValueErrorType.NumberExclusiveMaximum:
    case ValueErrorType.NumberMaximum:
    case ValueErrorType.IntegerExclusiveMinimum:
    case ValueErrorType.IntegerMinimum:
    case ValueErrorType.IntegerExclusiveMaximum:
    case ValueErrorType.IntegerMaximum:
      return rangeMessage(schema, error.value as number);
    case ValueErrorType.String:
      return 'expected text';
    case ValueErrorType.StringMaxLength:
      return `must be at most ${schema.maxLength} characters long`;
    case ValueErrorType.StringPattern:
      return 'must not contain control characters or unpaired surrogates';
    case ValueErrorType.Boolean:
      return 'expected true or false';
    case ValueErrorType.Null:
      return 'expected null';
    case ValueErrorType.Literal:
      return `expected ${JSON.stringify(schema.const)}`;
    default:
      return `is not valid here (expected ${describe(schema)})`;
  }
}
