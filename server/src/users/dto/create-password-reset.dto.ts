import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsIn } from 'class-validator';
import type { CreatePasswordResetRequest } from '@ladderwright/shared/api';

export class CreatePasswordResetDto implements CreatePasswordResetRequest {
  @ApiProperty({ enum: ['show', 'mail'], description: 'show: the link comes back once; mail: it goes to the user.' })
  @IsDefined({ message: 'delivery is required' })
  @IsIn(['show', 'mail'], { message: "delivery must be 'show' or 'mail'" })
  delivery!: 'show' | 'mail';
}
