import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsObject, IsOptional, IsString, MaxLength, ValidateNested } from 'class-validator';
import type { SignOffNoteRequest } from '@ladderwright/shared/api';
import { OverrideDto } from './override.dto';

export class SignOffNoteDto implements SignOffNoteRequest {
  @ApiPropertyOptional({ example: 'Checks pass; margins as agreed.' })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(2000, { message: 'note must be at most 2000 characters' })
  note?: string;

  @ApiPropertyOptional({ type: OverrideDto, description: 'Goes past closed gates; recorded and audited.' })
  @IsOptional()
  @IsObject({ message: 'override must be an object with a reason' })
  @ValidateNested()
  @Type(() => OverrideDto)
  override?: OverrideDto;
}
