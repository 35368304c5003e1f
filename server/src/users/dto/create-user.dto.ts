import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsIn, IsString, MaxLength, MinLength } from 'class-validator';
import type { CreateUserRequest } from '@ladderwright/shared/api';
import { USER_ROLES, type UserRole } from '@ladderwright/shared/auth';
import { MeetsPasswordPolicy } from '../../common/decorators/meets-password-policy.decorator';
import { IsNotBlank } from '../../common/decorators/is-not-blank.decorator';

export class CreateUserDto implements CreateUserRequest {
  @ApiProperty({ example: 'new.engineer@northfold.test' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ example: 'New Engineer' })
  @IsString()
  @MinLength(1, { message: 'displayName must not be empty' })
  @MaxLength(120)
  @IsNotBlank()
  displayName!: string;

  @ApiProperty({ enum: USER_ROLES })
  @IsIn(USER_ROLES, { message: `role must be one of ${USER_ROLES.join(', ')}` })
  role!: UserRole;

  @ApiProperty({ description: 'At least 10 characters with a letter and a digit' })
  @IsString()
  @MaxLength(200)
  @MeetsPasswordPolicy()
  password!: string;
}
