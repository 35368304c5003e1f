import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import type { UserListQuery } from '@ladderwright/shared/api';

export const USER_PAGE_MAX = 100;

export class ListUsersDto implements UserListQuery {
  @ApiPropertyOptional({ description: 'Part of the e-mail or the display name.' })
  @IsOptional()
  @IsString({ message: 'q must be text' })
  @MaxLength(254, { message: 'q must be at most 254 characters' })
  q?: string;

  @ApiPropertyOptional({ enum: ['active', 'deactivated'] })
  @IsOptional()
  @IsIn(['active', 'deactivated'], { message: "status must be 'active' or 'deactivated'" })
  status?: 'active' | 'deactivated';

  @ApiPropertyOptional({ minimum: 1, default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'page must be a whole number' })
  @Min(1, { message: 'page must be at least 1' })
  @Max(100_000, { message: 'page must be at most 100000' })
  page?: number;

  @ApiPropertyOptional({ minimum: 1, maximum: USER_PAGE_MAX, default: 25 })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'pageSize must be a whole number' })
  @Min(1, { message: 'pageSize must be at least 1' })
  @Max(USER_PAGE_MAX, { message: `pageSize must be at most ${USER_PAGE_MAX}` })
  pageSize?: number;
}
