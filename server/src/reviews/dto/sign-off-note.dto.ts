import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength } from 'class-validator';
import type { SignOffNoteRequest } from '@ladderwright/shared/api';

export class SignOffNoteDto implements SignOffNoteRequest {
  @ApiPropertyOptional({ example: 'Checks pass; margins as agreed.' })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(2000, { message: 'note must be at most 2000 characters' })
  note?: string;
}
