import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsString, Matches, MaxLength } from 'class-validator';
import type { CompletePasswordResetRequest } from '@ladderwright/shared/api';
import { MeetsPasswordPolicy } from '../../common/decorators/meets-password-policy.decorator';

export class CompletePasswordResetDto implements CompletePasswordResetRequest {
  @ApiProperty({ description: 'The token from the one-time link.' })
  @IsDefined({ message: 'token is required' })
  @IsString({ message: 'token must be text' })
  @Matches(/^[A-Za-z0-9_-]{43}$/, { message: 'token is not a password-reset token' })
  token!: string;

  @ApiProperty({ description: 'At least 10 characters with a letter and a digit' })
  @IsString()
  @MaxLength(200)
  @MeetsPasswordPolicy()
  password!: string;
}
