import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsDefined,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  IsUUID,
  Max,
  Min,
  ValidateNested,
} from 'class-validator';
import { START_UP_WINDOW_S } from '@ladderwright/shared/api';
import type { SimulationKind, SimulationOptions, StartSimulationRequest } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';

export const SIMULATION_KINDS: readonly SimulationKind[] = ['startup', 'steady-state', 'discharge', 'full'];

export class SimulationOptionsDto implements SimulationOptions {
  @ApiPropertyOptional({
    example: 100,
    description: 'Time steps per drive period at least (largest step = period / this).',
  })
  @IsOptional()
  @IsInt({ message: 'options.maxStepPerPeriod must be an integer (steps per drive period)' })
  @Min(8, { message: 'options.maxStepPerPeriod must be at least 8' })
  @Max(5000, { message: 'options.maxStepPerPeriod must be at most 5000' })
  maxStepPerPeriod?: number;

  @ApiPropertyOptional({
    example: 200,
    description: 'Drive periods of the start-up transient; without it, until the output settles.',
  })
  @IsOptional()
  @IsInt({ message: 'options.cycles must be an integer' })
  @Min(1, { message: 'options.cycles must be at least 1' })
  @Max(20000, { message: 'options.cycles must be at most 20000' })
  cycles?: number;

  @ApiPropertyOptional({
    example: 0.002,
    description: 'Driver designs: seconds of the push-button start-up from an empty ladder.',
  })
  @IsOptional()
  @IsNumber({}, { message: 'options.startUpWindowS must be a number (seconds)' })
  @Min(START_UP_WINDOW_S.min, {
    message: `options.startUpWindowS must be at least ${START_UP_WINDOW_S.min.toExponential()} s`,
  })
  @Max(START_UP_WINDOW_S.max, { message: `options.startUpWindowS must be at most ${START_UP_WINDOW_S.max} s` })
  startUpWindowS?: number;
}

/** The design a simulation or a batch starts from, and the run's options. */
export class SimulationSourceDto {
  @ApiPropertyOptional({
    description: 'A design document (schemaVersion 1); or give designId and revisionNumber.',
    type: 'object',
    additionalProperties: true,
  })
  @IsOptional()
  @IsObject({ message: 'document must be a design document object' })
  document?: Design;

  @ApiPropertyOptional({ format: 'uuid' })
  @IsOptional()
  @IsUUID('all', { message: 'designId must be a UUID' })
  designId?: string;

  @ApiPropertyOptional({ example: 1 })
  @IsOptional()
  @IsInt({ message: 'revisionNumber must be an integer' })
  @Min(1, { message: 'revisionNumber must be 1 or more' })
  revisionNumber?: number;

  @ApiPropertyOptional({ type: SimulationOptionsDto })
  @IsOptional()
  @IsObject({ message: 'options must be an object' })
  @ValidateNested()
  @Type(() => SimulationOptionsDto)
  options?: SimulationOptionsDto;
}

/** The kind is checked by the service (the list depends on the environment); the document by validateDesign. */
export class StartSimulationDto extends SimulationSourceDto implements StartSimulationRequest {
  @ApiProperty({ enum: SIMULATION_KINDS })
  @IsDefined({ message: 'kind is required' })
  @IsString({ message: 'kind must be text' })
  kind!: SimulationKind;
}
