import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  Patch,
  Post,
  Query,
  Res,
  UploadedFile,
  UseFilters,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiCookieAuth, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { Part, PartImportResult } from '@ladderwright/shared/api';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { requireCsvText } from '../storage/upload-checks';
import { UploadLimitFilter } from '../storage/upload-limit.filter';
import type { UploadedFileData } from '../storage/storage.types';
import { ImportPartsQueryDto } from './dto/import-parts.dto';
import { ListPartsDto } from './dto/list-parts.dto';
import { PARTS_CSV_MAX_BYTES, PartsCsvService } from './parts-csv.service';
import { PartsService } from './parts.service';

@ApiTags('parts')
@ApiCookieAuth()
@Controller('projects/:projectId/parts')
export class PartsController {
  constructor(
    private readonly parts: PartsService,
    private readonly csv: PartsCsvService,
  ) {}

  @Get()
  list(@ProjectMembership() membership: Membership, @Query() query: ListPartsDto): Promise<Part[]> {
    return this.parts.list(membership.projectId, query);
  }

  @Get('export.csv')
  @ApiProduces('text/csv')
  async exportCsv(@ProjectMembership() membership: Membership, @Res() response: Response): Promise<void> {
    const text = await this.csv.export(membership.projectId);
    response.setHeader('Content-Type', 'text/csv; charset=utf-8');
    response.setHeader('Content-Disposition', 'attachment; filename="parts-shelf.csv"');
    response.send(text);
  }

  @Post('import')
  @HttpCode(200)
  @RequiresProjectAction('parts.manage')
  @ApiConsumes('multipart/form-data')
  @UseFilters(new UploadLimitFilter({ file: PARTS_CSV_MAX_BYTES }))
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: PARTS_CSV_MAX_BYTES, files: 1, fields: 5 } }))
  importCsv(
    @ProjectMembership() membership: Membership,
    @Query() query: ImportPartsQueryDto,
    @UploadedFile() file: UploadedFileData | undefined,
  ): Promise<PartImportResult> {
    return this.csv.import(membership.projectId, requireCsvText(file, 'file'), query.dryRun !== 'false');
  }

  @Post()
  @RequiresProjectAction('parts.manage')
  create(@ProjectMembership() membership: Membership, @Body() body: Record<string, unknown>): Promise<Part> {
    return this.parts.create(membership.projectId, body);
  }

  @Patch(':partId')
  @RequiresProjectAction('parts.manage')
  update(
    @ProjectMembership() membership: Membership,
    @Param('partId') partId: string,
    @Body() body: Record<string, unknown>,
  ): Promise<Part> {
    return this.parts.update(membership.projectId, partId, body);
  }

  @Delete(':partId')
  @HttpCode(204)
  @RequiresProjectAction('parts.manage')
  async remove(@ProjectMembership() membership: Membership, @Param('partId') partId: string): Promise<void> {
    await this.parts.remove(membership.projectId, partId);
  }
}
