import { ApiProperty } from '@nestjs/swagger';
import { IsDefined, IsIn } from 'class-validator';
import type { ChangeMemberRoleRequest } from '@ladderwright/shared/api';
import { PROJECT_ROLES, type ProjectRole } from '@ladderwright/shared/auth';

export class ChangeMemberRoleDto implements ChangeMemberRoleRequest {
  @ApiProperty({ enum: PROJECT_ROLES })
  @IsDefined({ message: 'role is required' })
  @IsIn(PROJECT_ROLES, { message: `role must be one of ${PROJECT_ROLES.join(', ')}` })
  role!: ProjectRole;
}
