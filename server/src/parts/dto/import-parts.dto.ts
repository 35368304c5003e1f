import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';

export class ImportPartsQueryDto {
  @ApiPropertyOptional({
    enum: ['true', 'false'],
    default: 'true',
    description: 'true: preview only, nothing is written.',
  })
  @IsOptional()
  @IsIn(['true', 'false'], { message: 'dryRun must be true or false' })
  dryRun?: 'true' | 'false';
}
