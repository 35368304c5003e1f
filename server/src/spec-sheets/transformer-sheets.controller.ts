import { Controller, Get, Res } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { CurrentUser as SessionUser } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { RevisionRef } from '../revisions/revision-ref.decorator';
import { TransformerSheetsService } from './transformer-sheets.service';

@ApiTags('spec-sheets')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber')
export class TransformerSheetsController {
  constructor(private readonly transformerSheets: TransformerSheetsService) {}

  @Get('transformer-sheet.pdf')
  @ApiProduces('application/pdf')
  @ApiOkResponse({
    description:
      'Transformer sheet for the magnetics supplier (designed transformers only); released revisions for leads, other states for engineers and leads, marked NOT RELEASED.',
  })
  async download(
    @RevisionRef() ref: RevisionRef,
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Res() response: Response,
  ): Promise<void> {
    const file = await this.transformerSheets.render({ ref, user, membership, now: new Date() });
    response.setHeader('Content-Type', 'application/pdf');
    response.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    response.send(file.body);
  }
}
