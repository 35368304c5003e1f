import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsEmail, IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { type CreateMemberRequestRequest, MEMBER_REQUEST_NOTE_MAX } from '@ladderwright/shared/api';
import { PROJECT_ROLES, type ProjectRole } from '@ladderwright/shared/auth';

export class CreateMemberRequestDto implements CreateMemberRequestRequest {
  @ApiProperty({ example: 'technician@northfold.test', maxLength: 254 })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ enum: PROJECT_ROLES, description: 'The project role proposed for the person.' })
  @IsIn(PROJECT_ROLES, { message: `role must be one of ${PROJECT_ROLES.join(', ')}` })
  role!: ProjectRole;

  @ApiPropertyOptional({
    description: 'Why the person should join, for the leads.',
    maxLength: MEMBER_REQUEST_NOTE_MAX,
  })
  @IsOptional()
  @IsString({ message: 'note must be text' })
  @MaxLength(MEMBER_REQUEST_NOTE_MAX, { message: `note must be at most ${MEMBER_REQUEST_NOTE_MAX} characters` })
  note?: string;
}
