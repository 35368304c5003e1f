import { ValidateBy, type ValidationOptions } from 'class-validator';

/** A name must hold more than white space (it is stored trimmed; a blank one would be stored empty). */
export function IsNotBlank(options?: ValidationOptions): PropertyDecorator {
  return ValidateBy(
    {
      name: 'isNotBlank',
      validator: {
        validate: (value: unknown) => typeof value !== 'string' || /\S/u.test(value),
        defaultMessage: (args) => `${args?.property ?? 'value'} must not be blank (it holds only spaces)`,
      },
    },
    options,
  );
}
