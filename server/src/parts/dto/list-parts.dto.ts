import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsNumber, IsOptional, IsString, MaxLength, Min } from 'class-validator';
import type { PartKind, PartListQuery } from '@ladderwright/shared/api';
import { PART_KINDS } from '@ladderwright/shared/parts';

export class ListPartsDto implements PartListQuery {
  @ApiPropertyOptional({ enum: PART_KINDS })
  @IsOptional()
  @IsIn(PART_KINDS, { message: `kind must be one of ${PART_KINDS.join(', ')}` })
  kind?: PartKind;

  @ApiPropertyOptional({ description: 'Part of the code or description (case-insensitive).' })
  @IsOptional()
  @IsString({ message: 'q must be text' })
  @MaxLength(100, { message: 'q must be at most 100 characters' })
  q?: string;

  @ApiPropertyOptional({ description: 'Only parts rated at least this voltage (V).' })
  @IsOptional()
  @Type(() => Number)
  @IsNumber({}, { message: 'minVoltageV must be a number of volts' })
  @Min(0, { message: 'minVoltageV must not be negative' })
  minVoltageV?: number;
}
