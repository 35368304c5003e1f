import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, UserSummary } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { RequiresAppAction } from '../common/decorators/requires-permission.decorator';
import { CreateUserDto } from './dto/create-user.dto';
import { ResetPasswordDto } from './dto/reset-password.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@ApiCookieAuth()
@RequiresAppAction('users.manage')
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  list(): Promise<UserSummary[]> {
    return this.users.list();
  }

  @Post()
  create(@CurrentUser() actor: SessionUser, @Body() body: CreateUserDto): Promise<UserSummary> {
    return this.users.create(body, actor);
  }

  @Post(':userId/password')
  @HttpCode(204)
  async resetPassword(
    @CurrentUser() actor: SessionUser,
    @Param('userId') userId: string,
    @Body() body: ResetPasswordDto,
  ): Promise<void> {
    await this.users.resetPassword(userId, body.password, actor);
  }
}
