import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  ArrayMaxSize,
  ArrayMinSize,
  IsArray,
  IsDefined,
  IsInt,
  IsNumber,
  IsObject,
  IsOptional,
  IsString,
  Max,
  MaxLength,
  Min,
  ValidateNested,
} from 'class-validator';
import type { SimulationKind, StartSimulationBatchRequest } from '@ladderwright/shared/api';
import { BATCH_MAX_MEMBERS } from '@ladderwright/shared/sizing';
import { SIMULATION_KINDS, SimulationSourceDto } from './start-simulation.dto';

/** Longest field path a sweep may name (the document's deepest paths are well under it). */
const SWEEP_PATH_MAX_LENGTH = 200;

export class SweepDto {
  @ApiProperty({ example: 'load.resistanceOhm', description: 'Field path of a number in the design document.' })
  @IsString({ message: 'sweep.path must be text (a field path such as multiplier.capacitors[0].valueF)' })
  @MaxLength(SWEEP_PATH_MAX_LENGTH, { message: `sweep.path must be at most ${SWEEP_PATH_MAX_LENGTH} characters` })
  path!: string;

  @ApiProperty({ type: [Number], description: `One member per value, 1 to ${BATCH_MAX_MEMBERS}.` })
  @IsArray({ message: 'sweep.values must be a list of numbers' })
  @ArrayMinSize(1, { message: 'sweep.values must hold at least one value' })
  @ArrayMaxSize(BATCH_MAX_MEMBERS, { message: `sweep.values must hold at most ${BATCH_MAX_MEMBERS} values` })
  @IsNumber({ allowNaN: false, allowInfinity: false }, { each: true, message: 'sweep.values must be numbers' })
  values!: number[];
}

export class MonteCarloDto {
  @ApiProperty({ example: 64, description: `Members, 1 to ${BATCH_MAX_MEMBERS}.` })
  @IsInt({ message: 'monteCarlo.trials must be an integer' })
  @Min(1, { message: 'monteCarlo.trials must be at least 1' })
  @Max(BATCH_MAX_MEMBERS, { message: `monteCarlo.trials must be at most ${BATCH_MAX_MEMBERS}` })
  trials!: number;

  @ApiProperty({ example: 1, description: 'Seed of the draws: the same seed gives the same members.' })
  @IsInt({ message: 'monteCarlo.seed must be an integer' })
  @Min(0, { message: 'monteCarlo.seed must be 0 or more' })
  @Max(0xffffffff, { message: 'monteCarlo.seed must be at most 4294967295' })
  seed!: number;
}

/** The kind is checked by the service (the list depends on the environment); each member's document by validateDesign. */
export class StartSimulationBatchDto extends SimulationSourceDto implements StartSimulationBatchRequest {
  @ApiProperty({ enum: SIMULATION_KINDS, description: 'The simulation every member runs.' })
  @IsDefined({ message: 'simulationKind is required' })
  @IsString({ message: 'simulationKind must be text' })
  simulationKind!: SimulationKind;

  @ApiPropertyOptional({ type: SweepDto })
  @IsOptional()
  @IsObject({ message: 'sweep must be an object' })
  @ValidateNested()
  @Type(() => SweepDto)
  sweep?: SweepDto;

  @ApiPropertyOptional({ type: MonteCarloDto })
  @IsOptional()
  @IsObject({ message: 'monteCarlo must be an object' })
  @ValidateNested()
  @Type(() => MonteCarloDto)
  monteCarlo?: MonteCarloDto;
}
