import { Controller, Get } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Outbox } from '@ladderwright/shared/api';
import { RequiresAppAction } from '../common/decorators/requires-permission.decorator';
import { MailService } from './mail.service';

@ApiTags('outbox')
@ApiCookieAuth()
@Controller('outbox')
export class OutboxController {
  constructor(private readonly mail: MailService) {}

  @Get()
  @RequiresAppAction('outbox.read')
  @ApiOkResponse({ description: 'Mail the local fake SMTP server captured, newest first, and the queue counts.' })
  list(): Promise<Outbox> {
    return this.mail.outbox();
  }
}
