import { ApiProperty } from '@nestjs/swagger';
import { IsString, MaxLength } from 'class-validator';
import type { ResetPasswordRequest } from '@ladderwright/shared/api';
import { MeetsPasswordPolicy } from '../../common/decorators/meets-password-policy.decorator';

export class ResetPasswordDto implements ResetPasswordRequest {
  @ApiProperty({ description: 'At least 10 characters with a letter and a digit' })
  @IsString()
  @MaxLength(200)
  @MeetsPasswordPolicy()
  password!: string;
}
