import { Body, Controller, Get, Put } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, NotificationSettings } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { UpdateNotificationSettingsDto } from './dto/update-notification-settings.dto';
import { UsersService } from './users.service';

/** The signed-in user's own mail choices: one switch per event type, honoured when mail is queued. */
@ApiTags('users')
@ApiCookieAuth()
@Controller('me/notifications')
export class NotificationSettingsController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @ApiOkResponse({ description: 'For each mail kind, whether the user receives it.' })
  get(@CurrentUser() user: SessionUser): Promise<NotificationSettings> {
    return this.users.notificationSettings(user.id);
  }

  @Put()
  put(@CurrentUser() user: SessionUser, @Body() body: UpdateNotificationSettingsDto): Promise<NotificationSettings> {
    return this.users.setNotificationSettings(user.id, body);
  }
}
