import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength, MinLength } from 'class-validator';
import type { CreateProjectRequest } from '@ladderwright/shared/api';
import { IsNotBlank } from '../../common/decorators/is-not-blank.decorator';

export class CreateProjectDto implements CreateProjectRequest {
  @ApiProperty({ example: 'Cleanroom ionizer bar' })
  @IsString()
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(120)
  @IsNotBlank()
  name!: string;

  @ApiProperty({ example: 'Ionizers' })
  @IsString()
  @MinLength(1, { message: 'productLine must not be empty' })
  @MaxLength(120)
  @IsNotBlank()
  productLine!: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(2000)
  description?: string;
}
