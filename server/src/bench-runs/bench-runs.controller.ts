import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  Post,
  Res,
  UploadedFiles,
  UseFilters,
  UseInterceptors,
} from '@nestjs/common';
import { FileFieldsInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { BenchRunDetail, BenchRunSummary, CurrentUser as SessionUser } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import { RevisionRef } from '../revisions/revision-ref.decorator';
import { UploadLimitFilter } from '../storage/upload-limit.filter';
import { BENCH_FILE_MAX_BYTES, BENCH_MAX_PHOTOS, type BenchUpload, BenchRunsService } from './bench-runs.service';
import { UploadBenchRunDto } from './dto/upload-bench-run.dto';

@ApiTags('bench-runs')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber/bench-runs')
export class BenchRunsController {
  constructor(private readonly benchRuns: BenchRunsService) {}

  @Post()
  @RequiresProjectAction('bench.upload')
  @ApiConsumes('multipart/form-data')
  @UseFilters(new UploadLimitFilter({ 'each file': BENCH_FILE_MAX_BYTES }))
  @UseInterceptors(
    FileFieldsInterceptor(
      [
        { name: 'data', maxCount: 1 },
        { name: 'photos', maxCount: BENCH_MAX_PHOTOS },
      ],
      { limits: { fileSize: BENCH_FILE_MAX_BYTES, files: 1 + BENCH_MAX_PHOTOS, fields: 10 } },
    ),
  )
  upload(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Body() body: UploadBenchRunDto,
    @UploadedFiles() files: BenchUpload | undefined,
  ): Promise<BenchRunDetail> {
    return this.benchRuns.upload({ ref, fields: body, upload: files ?? {}, userId: user.id });
  }

  @Get()
  list(@RevisionRef() ref: RevisionRef): Promise<BenchRunSummary[]> {
    return this.benchRuns.list(ref);
  }

  @Get(':benchRunId')
  detail(@RevisionRef() ref: RevisionRef, @Param('benchRunId') benchRunId: string): Promise<BenchRunDetail> {
    return this.benchRuns.get(ref, benchRunId);
  }

  @Get(':benchRunId/files/:fileId')
  async file(
    @RevisionRef() ref: RevisionRef,
    @Param('benchRunId') benchRunId: string,
    @Param('fileId') fileId: string,
    @Res() response: Response,
  ): Promise<void> {
    const file = await this.benchRuns.file(ref, benchRunId, fileId);
    response.setHeader('Content-Type', file.contentType);
    response.setHeader('X-Content-Type-Options', 'nosniff');
    response.setHeader('Content-Disposition', `inline; filename="${file.fileName.replace(/[^\w.-]/g, '_')}"`);
    response.send(file.body);
  }

  @Delete(':benchRunId')
  @HttpCode(204)
  @RequiresProjectAction('bench.upload')
  async remove(
    @RevisionRef() ref: RevisionRef,
    @CurrentUser() user: SessionUser,
    @Param('benchRunId') benchRunId: string,
  ): Promise<void> {
    await this.benchRuns.remove(ref, benchRunId, user.id);
  }
}
