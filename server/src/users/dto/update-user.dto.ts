import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsBoolean, IsIn, IsOptional } from 'class-validator';
import type { UpdateUserRequest } from '@ladderwright/shared/api';
import { USER_ROLES, type UserRole } from '@ladderwright/shared/auth';

export class UpdateUserDto implements UpdateUserRequest {
  @ApiPropertyOptional({ enum: USER_ROLES })
  @IsOptional()
  @IsIn(USER_ROLES, { message: `role must be one of ${USER_ROLES.join(', ')}` })
  role?: UserRole;

  @ApiPropertyOptional({ description: 'false deactivates the account and ends its sessions; true reactivates it.' })
  @IsOptional()
  @IsBoolean({ message: 'isActive must be true or false' })
  isActive?: boolean;
}
