import { registerDecorator, type ValidationArguments } from 'class-validator';
import { passwordPolicyProblem } from '@ladderwright/shared/auth';

/** class-validator rule for account passwords: the policy in `@ladderwright/shared/auth`. */
export function MeetsPasswordPolicy(): PropertyDecorator {
  return (target: object, propertyName: string | symbol) => {
    registerDecorator({
      name: 'meetsPasswordPolicy',
      target: target.constructor,
      propertyName: String(propertyName),
      validator: {
        validate: (value: unknown) => typeof value === 'string' && passwordPolicyProblem(value) === null,
        defaultMessage: (args?: ValidationArguments) =>
          typeof args?.value === 'string'
            ? `${args.property} ${passwordPolicyProblem(args.value) ?? 'is not acceptable'}`
            : `${args?.property ?? 'password'} must be a string`,
      },
    });
  };
}
