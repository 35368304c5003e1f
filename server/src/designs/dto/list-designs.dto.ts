import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, IsUUID, Max, MaxLength, Min } from 'class-validator';
import type { DesignListQuery, DesignSortKey } from '@ladderwright/shared/api';
import { REVISION_STATES, type RevisionState } from '@ladderwright/shared/reviews';

const SORT_KEYS: readonly DesignSortKey[] = ['name', 'updatedAt', 'state'];
const ORDERS = ['asc', 'desc'] as const;

export class ListDesignsDto implements DesignListQuery {
  @ApiPropertyOptional({ description: 'Part of the design name (case-insensitive).' })
  @IsOptional()
  @IsString({ message: 'q must be text' })
  @MaxLength(200, { message: 'q must be at most 200 characters' })
  q?: string;

  @ApiPropertyOptional({ enum: REVISION_STATES, description: "State of the design's latest revision." })
  @IsOptional()
  @IsIn(REVISION_STATES, { message: `state must be one of ${REVISION_STATES.join(', ')}` })
  state?: RevisionState;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'ownerId must be a user id (UUID)' })
  ownerId?: string;

  @ApiPropertyOptional({ enum: SORT_KEYS, default: 'updatedAt' })
  @IsOptional()
  @IsIn(SORT_KEYS, { message: `sort must be one of ${SORT_KEYS.join(', ')}` })
  sort?: DesignSortKey;

  @ApiPropertyOptional({ enum: ORDERS, description: 'Default: asc for name and state, desc for updatedAt.' })
  @IsOptional()
  @IsIn(ORDERS, { message: 'order must be asc or desc' })
  order?: 'asc' | 'desc';

  @ApiPropertyOptional({ default: 1, minimum: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be an integer' })
  @Min(1, { message: 'page must be 1 or more' })
  @Max(100_000, { message: 'page must be at most 100000' })
  page?: number;

  @ApiPropertyOptional({ default: 20, minimum: 1, maximum: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be an integer' })
  @Min(1, { message: 'pageSize must be 1 or more' })
  @Max(100, { message: 'pageSize must be at most 100' })
  pageSize?: number;
}
