import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsString, MaxLength } from 'class-validator';
import type { OverrideRequest } from '@ladderwright/shared/api';
import { OVERRIDE_REASON_MIN_LENGTH } from '@ladderwright/shared/reviews';

/** A decision to go past closed Sign-off gates; the length rule is checked by the service (shared rule). */
export class OverrideDto implements OverrideRequest {
  @ApiProperty({
    minLength: OVERRIDE_REASON_MIN_LENGTH,
    example: 'C3 margin accepted: the bench run at 40 °C shows 12 % headroom.',
  })
  @IsDefined({ message: 'override.reason is required' })
  @IsString({ message: 'reason must be text' })
  @MaxLength(2000, { message: 'reason must be at most 2000 characters' })
  reason!: string;
}
