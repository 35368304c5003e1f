import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsDefined,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  MaxLength,
  ValidateNested,
} from 'class-validator';
import type { SubmitRevisionRequest } from '@ladderwright/shared/api';
import { OverrideDto } from './override.dto';

export class SubmitRevisionDto implements SubmitRevisionRequest {
  @ApiProperty({ type: [String], description: 'Project members with the reviewer or lead role (not the author).' })
  @IsDefined({ message: 'reviewerIds is required' })
  @IsArray({ message: 'reviewerIds must be a list of user ids' })
  @ArrayMinSize(1, { message: 'reviewerIds must name at least one reviewer' })
  @ArrayMaxSize(20, { message: 'reviewerIds may name at most 20 reviewers' })
  @IsUUID('all', { each: true, message: 'reviewerIds must contain user ids' })
  reviewerIds!: string[];

  @ApiPropertyOptional({ example: 'Ready for review: raised C2 for lower ripple.' })
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
