import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsIn, MaxLength } from 'class-validator';
import type { AddMemberRequest } from '@ladderwright/shared/api';
import { PROJECT_ROLES, type ProjectRole } from '@ladderwright/shared/auth';

export class AddMemberDto implements AddMemberRequest {
  @ApiProperty({ example: 'reviewer@northfold.test' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(254)
  email!: string;

  @ApiProperty({ enum: PROJECT_ROLES })
  @IsIn(PROJECT_ROLES, { message: `role must be one of ${PROJECT_ROLES.join(', ')}` })
  role!: ProjectRole;
}
