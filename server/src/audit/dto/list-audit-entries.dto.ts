import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsISO8601, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import type { AuditQuery } from '@ladderwright/shared/api';
import { AUDIT_ACTIONS, type AuditAction } from '../audit.types';

export const AUDIT_PAGE_MAX = 500;

export class ListAuditEntriesDto implements AuditQuery {
  @ApiPropertyOptional({ description: 'Part of the actor e-mail, or an account id.' })
  @IsOptional()
  @IsString({ message: 'actor must be text' })
  @MaxLength(254, { message: 'actor must be at most 254 characters' })
  actor?: string;

  @ApiPropertyOptional({ enum: AUDIT_ACTIONS })
  @IsOptional()
  @IsIn(AUDIT_ACTIONS, { message: `action must be one of ${AUDIT_ACTIONS.join(', ')}` })
  action?: AuditAction;

  @ApiPropertyOptional({ description: 'ISO 8601: entries at or after this instant.' })
  @IsOptional()
  @IsISO8601({ strict: true }, { message: 'from must be an ISO 8601 date or date-time' })
  from?: string;

  @ApiPropertyOptional({ description: 'ISO 8601: entries before this instant.' })
  @IsOptional()
  @IsISO8601({ strict: true }, { message: 'to must be an ISO 8601 date or date-time' })
  to?: string;

  @ApiPropertyOptional({ minimum: 1, default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be at least 1' })
  @Max(100_000, { message: 'page must be at most 100000' })
  page?: number;

  @ApiPropertyOptional({ minimum: 1, maximum: AUDIT_PAGE_MAX, default: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be at least 1' })
  @Max(AUDIT_PAGE_MAX, { message: `pageSize must be at most ${AUDIT_PAGE_MAX}` })
  pageSize?: number;

  @ApiPropertyOptional({ minimum: 1, maximum: AUDIT_PAGE_MAX, description: 'Alias of pageSize.' })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'limit must be a whole number' })
  @Min(1, { message: 'limit must be at least 1' })
  @Max(AUDIT_PAGE_MAX, { message: `limit must be at most ${AUDIT_PAGE_MAX}` })
  limit?: number;
}
