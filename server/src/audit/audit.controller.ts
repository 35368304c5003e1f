import { Controller, Get, Query, Res } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { AuditPage } from '@ladderwright/shared/api';
import { RequiresAppAction } from '../common/decorators/requires-permission.decorator';
import { AuditService } from './audit.service';
import { ListAuditEntriesDto } from './dto/list-audit-entries.dto';

@ApiTags('audit')
@ApiCookieAuth()
@RequiresAppAction('audit.read')
@Controller('audit')
export class AuditController {
  constructor(private readonly audit: AuditService) {}

  @Get()
  list(@Query() query: ListAuditEntriesDto): Promise<AuditPage> {
    return this.audit.list(query);
  }

  @Get('export.csv')
  @ApiProduces('text/csv')
  @ApiOkResponse({ description: 'The entries the filters select, newest first, as CSV (attachment).' })
  async exportCsv(@Query() query: ListAuditEntriesDto, @Res() response: Response): Promise<void> {
    const body = await this.audit.exportCsv(query);
    response.setHeader('Content-Type', 'text/csv; charset=utf-8');
    response.setHeader('Content-Disposition', 'attachment; filename="audit-log.csv"');
    response.send(body);
  }
}
