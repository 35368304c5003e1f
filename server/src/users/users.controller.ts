import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiCreatedResponse, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, PasswordResetLink, UserPage, UserSummary } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { RequiresAppAction } from '../common/decorators/requires-permission.decorator';
import { CreatePasswordResetDto } from './dto/create-password-reset.dto';
import { CreateUserDto } from './dto/create-user.dto';
import { ListUsersDto } from './dto/list-users.dto';
import { ResetPasswordDto } from './dto/reset-password.dto';
import { UpdateUserDto } from './dto/update-user.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@ApiCookieAuth()
@RequiresAppAction('users.manage')
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  list(@Query() query: ListUsersDto): Promise<UserPage> {
    return this.users.list(query);
  }

  @Patch(':userId')
  update(
    @CurrentUser() actor: SessionUser,
    @Param('userId') userId: string,
    @Body() body: UpdateUserDto,
  ): Promise<UserSummary> {
    return this.users.update(userId, body, actor);
  }

  @Post(':userId/password-reset')
  @ApiCreatedResponse({ description: 'A one-time link: returned once (show) or mailed to the user (mail).' })
  createResetLink(
    @CurrentUser() actor: SessionUser,
    @Param('userId') userId: string,
    @Body() body: CreatePasswordResetDto,
  ): Promise<PasswordResetLink> {
    return this.users.createResetLink(userId, body.delivery, actor, new Date());
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
