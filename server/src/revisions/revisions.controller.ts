import { Body, Controller, Get, Param, Post, Res, UseFilters } from '@nestjs/common';
import { ApiConflictResponse, ApiCookieAuth, ApiOkResponse, ApiParam, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { CurrentUser as SessionUser, RevisionDetailBody, RevisionSummary } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { sendJsonBytes } from '../common/json-bytes';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { RevisionRef } from './revision-ref.decorator';
import { toRevisionDetailBody } from './revision-shapes';
import { SaveRevisionDto } from './dto/save-revision.dto';
import type { DownloadFile } from './revisions.service';
import { RevisionsService } from './revisions.service';
import { StaleBaseFilter } from './stale-base.filter';

function sendDownload(response: Response, file: DownloadFile, contentType: string): void {
  response.setHeader('Content-Type', contentType);
  response.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  response.send(file.body);
}

@ApiTags('revisions')
@ApiCookieAuth()
@ApiParam({ name: 'projectId', format: 'uuid', description: 'A project the caller is a member of.' })
@Controller('projects/:projectId/designs/:designId/revisions')
@UseFilters(StaleBaseFilter)
export class RevisionsController {
  constructor(private readonly revisions: RevisionsService) {}

  @Get()
  list(@ProjectMembership() membership: Membership, @Param('designId') designId: string): Promise<RevisionSummary[]> {
    return this.revisions.list(membership.projectId, designId);
  }

  @Post()
  @RequiresProjectAction('design.write')
  @ApiConflictResponse({ description: 'stale_base: the base is not the latest revision; body lists changedFields.' })
  async save(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Body() body: SaveRevisionDto,
  ): Promise<RevisionDetailBody> {
    const saved = await this.revisions.save({
      projectId: membership.projectId,
      designId,
      request: body,
      authorId: user.id,
    });
    return toRevisionDetailBody(saved);
  }

  /** The detail as JSON bytes: the stored document and report go out as PostgreSQL holds them, unparsed. */
  @Get(':revisionNumber')
  @ApiProduces('application/json')
  @ApiOkResponse({
    description:
      'The revision: summary, designId, projectId, the stored document and its report; each check names its rule by ruleKey, the texts once in report.checkRules.',
  })
  async detail(@RevisionRef() ref: RevisionRef, @Res() response: Response): Promise<void> {
    sendJsonBytes(response, await this.revisions.getJsonBytes(ref));
  }

  @Get(':revisionNumber/export')
  @ApiProduces('application/json')
  @ApiOkResponse({ description: 'The revision as a ladderwright-design file (attachment).' })
  async exportFile(@RevisionRef() ref: RevisionRef, @Res() response: Response): Promise<void> {
    const file = await this.revisions.exportFile(ref, new Date());
    sendDownload(response, file, 'application/json; charset=utf-8');
  }

  @Get(':revisionNumber/netlist')
  @ApiProduces('text/plain')
  @ApiOkResponse({ description: 'The revision circuit as a SPICE netlist (.cir attachment).' })
  async netlist(@RevisionRef() ref: RevisionRef, @Res() response: Response): Promise<void> {
    const file = await this.revisions.netlist(ref);
    sendDownload(response, file, 'text/plain; charset=utf-8');
  }
}
