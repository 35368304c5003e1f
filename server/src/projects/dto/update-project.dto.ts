import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import {
  IsDefined,
  IsIn,
  IsNumber,
  IsOptional,
  IsString,
  Max,
  MaxLength,
  Min,
  MinLength,
  NotEquals,
  ValidateNested,
} from 'class-validator';
import type { DefaultTargets, UpdateProjectRequest } from '@ladderwright/shared/api';
import { NAMED_DISCHARGE_RULES } from '@ladderwright/shared/designs';
import {
  ACCEPTANCE_COVERAGES,
  type AcceptanceCoverage,
  type AcceptanceSettings,
  BENCH_ALLOWANCE_MAX,
} from '@ladderwright/shared/reviews';
import { IsNotBlank } from '../../common/decorators/is-not-blank.decorator';

// Bounds: the product's supported range (up to 100 kV, 1 A load; common practice, no source).
export class DefaultTargetsDto implements DefaultTargets {
  @ApiPropertyOptional({ description: 'Signed output target (V).', example: -6000 })
  @IsOptional()
  @IsNumber({}, { message: 'outputV must be a number' })
  @NotEquals(0, { message: 'outputV must not be 0' })
  @Min(-100_000, { message: 'outputV must be at least -100000 V' })
  @Max(100_000, { message: 'outputV must be at most 100000 V' })
  outputV?: number;

  @ApiPropertyOptional({ description: 'Ripple target, peak-to-peak (V).' })
  @IsOptional()
  @IsNumber({}, { message: 'rippleMaxV must be a number' })
  @Min(1e-6, { message: 'rippleMaxV must be more than 0' })
  @Max(10_000, { message: 'rippleMaxV must be at most 10000 V' })
  rippleMaxV?: number;

  @ApiPropertyOptional({ description: 'Rated load current (A).' })
  @IsOptional()
  @IsNumber({}, { message: 'loadCurrentA must be a number' })
  @Min(0, { message: 'loadCurrentA must be at least 0' })
  @Max(1, { message: 'loadCurrentA must be at most 1 A' })
  loadCurrentA?: number;

  @ApiPropertyOptional({ description: 'Voltage considered safe to touch after discharge (V).' })
  @IsOptional()
  @IsNumber({}, { message: 'safeVoltageV must be a number' })
  @Min(1, { message: 'safeVoltageV must be at least 1 V' })
  @Max(1000, { message: 'safeVoltageV must be at most 1000 V' })
  safeVoltageV?: number;

  @ApiPropertyOptional({ enum: NAMED_DISCHARGE_RULES })
  @IsOptional()
  @IsIn(NAMED_DISCHARGE_RULES, { message: `dischargeRule must be one of ${NAMED_DISCHARGE_RULES.join(', ')}` })
  dischargeRule?: (typeof NAMED_DISCHARGE_RULES)[number];
}

export class AcceptanceSettingsDto implements AcceptanceSettings {
  @ApiPropertyOptional({ enum: ACCEPTANCE_COVERAGES, description: 'Coverage probability of the output window.' })
  @IsDefined({ message: 'coverage is required' })
  @IsIn(ACCEPTANCE_COVERAGES, { message: `coverage must be one of ${ACCEPTANCE_COVERAGES.join(', ')}` })
  coverage!: AcceptanceCoverage;

  @ApiPropertyOptional({ minimum: 0, maximum: BENCH_ALLOWANCE_MAX, description: 'Fraction of the target, e.g. 0.01.' })
  @IsDefined({ message: 'benchAllowanceFraction is required' })
  @IsNumber({}, { message: 'benchAllowanceFraction must be a number' })
  @Min(0, { message: 'benchAllowanceFraction must be at least 0' })
  @Max(BENCH_ALLOWANCE_MAX, { message: `benchAllowanceFraction must be at most ${BENCH_ALLOWANCE_MAX}` })
  benchAllowanceFraction!: number;
}

export class UpdateProjectDto implements UpdateProjectRequest {
  @ApiPropertyOptional()
  @IsOptional()
  @IsString({ message: 'name must be text' })
  @MinLength(1, { message: 'name must not be empty' })
  @MaxLength(120, { message: 'name must be at most 120 characters' })
  @IsNotBlank()
  name?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString({ message: 'description must be text' })
  @MaxLength(2000, { message: 'description must be at most 2000 characters' })
  description?: string;

  @ApiPropertyOptional({ type: DefaultTargetsDto })
  @IsOptional()
  @ValidateNested()
  @Type(() => DefaultTargetsDto)
  defaultTargets?: DefaultTargetsDto;

  @ApiPropertyOptional({ type: AcceptanceSettingsDto })
  @IsOptional()
  @ValidateNested()
  @Type(() => AcceptanceSettingsDto)
  acceptance?: AcceptanceSettingsDto;
}
