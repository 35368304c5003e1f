import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, Max, Min } from 'class-validator';
import { AUDIT_ACTIONS, type AuditAction } from '../audit.types';

export const AUDIT_PAGE_MAX = 500;

export class ListAuditEntriesDto {
  @ApiPropertyOptional({ enum: AUDIT_ACTIONS })
  @IsOptional()
  @IsIn(AUDIT_ACTIONS, { message: `action must be one of ${AUDIT_ACTIONS.join(', ')}` })
  action?: AuditAction;

  @ApiPropertyOptional({ minimum: 1, maximum: AUDIT_PAGE_MAX, default: 100 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'limit must be a whole number' })
  @Min(1, { message: 'limit must be at least 1' })
  @Max(AUDIT_PAGE_MAX, { message: `limit must be at most ${AUDIT_PAGE_MAX}` })
  limit?: number;
}
