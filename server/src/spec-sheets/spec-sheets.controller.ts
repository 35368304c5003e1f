import { Controller, Get, Param, Res } from '@nestjs/common';
import { ApiCookieAuth, ApiOkResponse, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { CurrentUser as SessionUser } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { SpecSheetsService } from './spec-sheets.service';

@ApiTags('spec-sheets')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber')
export class SpecSheetsController {
  constructor(private readonly specSheets: SpecSheetsService) {}

  @Get('spec-sheet.pdf')
  @ApiProduces('application/pdf')
  @ApiOkResponse({
    description:
      'Supplier spec sheet; released revisions for leads, other states for engineers and leads, marked NOT RELEASED.',
  })
  async download(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Param('designId') designId: string,
    @Param('revisionNumber') revisionNumber: string,
    @Res() response: Response,
  ): Promise<void> {
    const file = await this.specSheets.render(
      membership.projectId,
      designId,
      revisionNumber,
      user,
      membership,
      new Date(),
    );
    response.setHeader('Content-Type', 'application/pdf');
    response.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    response.send(file.body);
  }
}
