import { Controller, Get } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Inbox, CurrentUser as SessionUser } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { InboxService } from './inbox.service';

@ApiTags('sign-off')
@ApiCookieAuth()
@Controller('inbox')
export class InboxController {
  constructor(private readonly inbox: InboxService) {}

  @Get()
  @ApiOkResponse({
    description: 'Revisions submitted to me and waiting, and revisions I submitted, each with its state.',
  })
  get(@CurrentUser() user: SessionUser): Promise<Inbox> {
    return this.inbox.forUser(user.id);
  }
}
