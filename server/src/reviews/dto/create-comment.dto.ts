import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsDefined, IsIn, IsNotEmpty, IsOptional, IsString, IsUUID, MaxLength, ValidateNested } from 'class-validator';
import type { CommentAnchor, CreateCommentRequest } from '@ladderwright/shared/api';

export class CommentAnchorDto implements CommentAnchor {
  @ApiProperty({ enum: ['input', 'result'] })
  @IsDefined({ message: 'kind is required' })
  @IsIn(['input', 'result'], { message: "kind must be 'input' or 'result'" })
  kind!: 'input' | 'result';

  @ApiProperty({ example: 'multiplier.capacitors[0].valueF' })
  @IsDefined({ message: 'path is required' })
  @IsString({ message: 'path must be text' })
  @IsNotEmpty({ message: 'path must not be empty' })
  @MaxLength(300, { message: 'path must be at most 300 characters' })
  path!: string;
}

export class CreateCommentDto implements CreateCommentRequest {
  @ApiProperty({ example: 'Why 2.2 nF here and not 4.7 nF?' })
  @IsDefined({ message: 'body is required' })
  @IsString({ message: 'body must be text' })
  @IsNotEmpty({ message: 'body must not be empty' })
  @MaxLength(10000, { message: 'body must be at most 10000 characters' })
  body!: string;

  @ApiPropertyOptional({ description: 'The comment this one answers.' })
  @IsOptional()
  @IsUUID('all', { message: 'parentId must be a comment id' })
  parentId?: string;

  @ApiPropertyOptional({ type: CommentAnchorDto })
  @IsOptional()
  @ValidateNested()
  @Type(() => CommentAnchorDto)
  anchor?: CommentAnchorDto;
}
