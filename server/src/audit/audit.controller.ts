import { Controller, Get, Query } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import { RequiresAppAction } from '../common/decorators/requires-permission.decorator';
import { AuditService } from './audit.service';
import type { AuditEntry } from './audit.types';
import { ListAuditEntriesDto } from './dto/list-audit-entries.dto';

@ApiTags('audit')
@ApiCookieAuth()
@RequiresAppAction('audit.read')
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Get()
  list(@Query() query: ListAuditEntriesDto): Promise<AuditEntry[]> {
    return this.audit.list(query);
  }
}
