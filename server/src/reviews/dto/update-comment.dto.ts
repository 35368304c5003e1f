import { ApiProperty } from '@nestjs/swagger';
import { IsBoolean, IsDefined } from 'class-validator';
import type { UpdateCommentRequest } from '@ladderwright/shared/api';

export class UpdateCommentDto implements UpdateCommentRequest {
  @ApiProperty({ description: 'true resolves the thread, false reopens it.' })
  @IsDefined({ message: 'isResolved is required' })
  @IsBoolean({ message: 'isResolved must be true or false' })
  isResolved!: boolean;
}
