import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsDefined, IsInt, IsOptional, IsUUID, Min } from 'class-validator';

export class CompareRevisionsDto {
  @ApiProperty({ example: 1, description: 'Revision number shown on the left.' })
  @IsDefined({ message: 'a is required' })
  @Type(() => Number)
  @IsInt({ message: 'a must be a revision number (an integer)' })
  @Min(1, { message: 'a must be 1 or more' })
  a!: number;

  @ApiProperty({ example: 2, description: 'Revision number shown on the right; deltas are b − a.' })
  @IsDefined({ message: 'b is required' })
  @Type(() => Number)
  @IsInt({ message: 'b must be a revision number (an integer)' })
  @Min(1, { message: 'b must be 1 or more' })
  b!: number;

  @ApiPropertyOptional({
    format: 'uuid',
    description: 'Another design of the same project that revision b belongs to; the design in the path when absent.',
  })
  @IsOptional()
  @IsUUID('all', { message: 'bDesignId must be a design id (a UUID)' })
  bDesignId?: string;
}
