import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength } from 'class-validator';
import { type DeclineMemberRequestRequest, MEMBER_REQUEST_NOTE_MAX } from '@ladderwright/shared/api';

export class DeclineMemberRequestDto implements DeclineMemberRequestRequest {
  @ApiPropertyOptional({ description: 'Told to the requester.', maxLength: MEMBER_REQUEST_NOTE_MAX })
  @IsOptional()
  @IsString({ message: 'reason must be text' })
  @MaxLength(MEMBER_REQUEST_NOTE_MAX, { message: `reason must be at most ${MEMBER_REQUEST_NOTE_MAX} characters` })
  reason?: string;
}
