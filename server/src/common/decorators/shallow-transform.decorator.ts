import type { Type, ValidationPipeOptions } from '@nestjs/common';
import { type ClassTransformOptions, classToPlain, plainToInstance } from 'class-transformer';

type TransformerPackage = NonNullable<ValidationPipeOptions['transformerPackage']>;

const SHALLOW_BODIES = new WeakSet<object>();

/**
 * On a request body class whose nested values are JSON documents checked elsewhere (a design document is
 * validated by the engine's own schema) and which uses no class-transformer decorators: the validation pipe
 * copies only the body's top level into the class instead of walking the whole document. class-validator checks
 * the same top-level fields and the whitelist either way.
 */
export function ShallowTransform(): ClassDecorator {
  return (target) => {
    SHALLOW_BODIES.add(target);
  };
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) return false;
  const prototype: unknown = Object.getPrototypeOf(value);
  return prototype === Object.prototype || prototype === null;
}

/** class-transformer for the global ValidationPipe, with the top-level copy for `@ShallowTransform()` classes. */
export const bodyTransformer: TransformerPackage = {
  plainToInstance<T>(cls: Type<T>, plain: unknown, options?: ClassTransformOptions): T | T[] {
    if (SHALLOW_BODIES.has(cls) && isPlainObject(plain)) return Object.assign(new cls() as object, plain) as T;
    return plainToInstance(cls, plain, options);
  },
  classToPlain: (object: unknown, options?: ClassTransformOptions) => classToPlain(object, options),
};
