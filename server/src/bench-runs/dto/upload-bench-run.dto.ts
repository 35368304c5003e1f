import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, Matches, MaxLength } from 'class-validator';
import type { UploadBenchRunFields } from '@ladderwright/shared/api';
import type { BenchKind } from '@ladderwright/shared/bench';

export const BENCH_KINDS: readonly BenchKind[] = ['load-sweep', 'scope-capture'];

/** The text fields of the multipart upload; the files are `data` (one CSV) and `photos` (PNG/JPEG). */
export class UploadBenchRunDto implements UploadBenchRunFields {
  @ApiProperty({ enum: BENCH_KINDS })
  @IsIn(BENCH_KINDS, { message: `kind must be one of ${BENCH_KINDS.join(', ')}` })
  kind!: BenchKind;

  @ApiPropertyOptional({ example: 'Prototype 2, bench supply 12.0 V' })
  @IsOptional()
  @IsString({ message: 'title must be text' })
  @MaxLength(120, { message: 'title must be at most 120 characters' })
  title?: string;

  @ApiPropertyOptional({ example: '5%', description: 'Fraction (0.05) or percent ("5%"); default 5 %.' })
  @IsOptional()
  @IsString({ message: 'tolerance must be text' })
  @Matches(/^\s*(\d+(\.\d*)?|\.\d+)\s*%?\s*$/, {
    message: 'tolerance must be a fraction such as 0.05 or a percent such as 5%',
  })
  tolerance?: string;
}
