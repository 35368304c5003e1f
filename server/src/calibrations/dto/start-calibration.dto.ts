import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsDefined,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  Max,
  Min,
  ValidateNested,
} from 'class-validator';
import type { StartCalibrationRequest } from '@ladderwright/shared/api';
import {
  MAX_CALIBRATION_RUNS,
  uncertainParameters,
  type CalibrationDataUse,
  type CalibrationParameterId,
} from '@ladderwright/shared/calibration';

const PARAMETER_IDS = uncertainParameters.map((parameter) => parameter.id);
const USES: readonly CalibrationDataUse[] = [
  'load-sweep',
  'start-up',
  'discharge',
  'collector-waveform',
  'secondary-waveform',
];
/** Most parameters one calibration fits: each adds a model evaluation per step. */
export const MAX_CALIBRATION_PARAMETERS = 6;

export class PriorRangeDto {
  @ApiProperty()
  @IsNumber({}, { message: 'prior.min must be a number' })
  min!: number;

  @ApiProperty()
  @IsNumber({}, { message: 'prior.max must be a number' })
  max!: number;
}

export class ChosenParameterDto {
  @ApiProperty({ enum: PARAMETER_IDS })
  @IsIn(PARAMETER_IDS, { message: `parameters[].id must be one of ${PARAMETER_IDS.join(', ')}` })
  id!: CalibrationParameterId;

  @ApiPropertyOptional({ type: PriorRangeDto, description: 'Within the declared range; the declared one if absent.' })
  @IsOptional()
  @ValidateNested()
  @Type(() => PriorRangeDto)
  prior?: PriorRangeDto;
}

export class CalibrationRunDto {
  @ApiProperty()
  @IsString({ message: 'runs[].benchRunId must be text' })
  benchRunId!: string;

  @ApiProperty({
    enum: USES,
    description: 'A load sweep is fitted as one; a scope capture as a start-up or a discharge.',
  })
  @IsIn(USES, { message: `runs[].use must be one of ${USES.join(', ')}` })
  use!: CalibrationDataUse;
}

export class StartCalibrationDto implements StartCalibrationRequest {
  @ApiProperty({ type: [ChosenParameterDto] })
  @IsDefined({ message: 'parameters is required' })
  @IsArray({ message: 'parameters must be a list' })
  @ArrayMinSize(1, { message: 'parameters: choose at least one parameter' })
  @ArrayMaxSize(MAX_CALIBRATION_PARAMETERS, {
    message: `parameters: at most ${MAX_CALIBRATION_PARAMETERS} parameters per calibration`,
  })
  @ValidateNested({ each: true })
  @Type(() => ChosenParameterDto)
  parameters!: ChosenParameterDto[];

  @ApiProperty({ type: [CalibrationRunDto] })
  @IsDefined({ message: 'runs is required' })
  @IsArray({ message: 'runs must be a list' })
  @ArrayMinSize(1, { message: 'runs: choose at least one bench run' })
  @ArrayMaxSize(MAX_CALIBRATION_RUNS, { message: `runs: at most ${MAX_CALIBRATION_RUNS} bench runs per calibration` })
  @ValidateNested({ each: true })
  @Type(() => CalibrationRunDto)
  runs!: CalibrationRunDto[];

  @ApiPropertyOptional({ example: 0.95 })
  @IsOptional()
  @IsNumber({}, { message: 'confidence must be a number' })
  @Min(0.5, { message: 'confidence must be at least 0.5' })
  @Max(0.999, { message: 'confidence must be at most 0.999' })
  confidence?: number;
}
