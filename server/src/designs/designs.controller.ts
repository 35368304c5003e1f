import { Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import { ApiBadRequestResponse, ApiBody, ApiCookieAuth, ApiParam, ApiTags } from '@nestjs/swagger';
import type {
  CurrentUser as SessionUser,
  DesignDetail,
  DesignPage,
  RevisionComparison,
} from '@ladderwright/shared/api';
import { DESIGN_DOCUMENT_COMPONENT } from '../analysis/design-schema-components';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { RevisionsService } from '../revisions/revisions.service';
import { DesignsService } from './designs.service';
import { CompareRevisionsDto } from './dto/compare-revisions.dto';
import { CreateDesignDto } from './dto/create-design.dto';
import { ListDesignsDto } from './dto/list-designs.dto';

@ApiTags('designs')
@ApiCookieAuth()
@ApiParam({ name: 'projectId', format: 'uuid', description: 'A project the caller is a member of.' })
@Controller('projects/:projectId/designs')
export class DesignsController {
  constructor(
    private readonly designs: DesignsService,
    private readonly revisions: RevisionsService,
  ) {}

  @Get()
  list(@ProjectMembership() membership: Membership, @Query() query: ListDesignsDto): Promise<DesignPage> {
    return this.designs.list(membership.projectId, query);
  }

  @Post()
  @RequiresProjectAction('design.write')
  create(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: CreateDesignDto,
  ): Promise<DesignDetail> {
    return this.designs.create(membership.projectId, body, user.id);
  }

  @Post('import')
  @RequiresProjectAction('design.write')
  @ApiBody({
    description: 'A ladderwright-design export file, or a bare design document.',
    schema: {
      oneOf: [
        {
          type: 'object',
          required: ['format', 'formatVersion', 'design'],
          properties: {
            format: { type: 'string', enum: ['ladderwright-design'] },
            formatVersion: { type: 'integer', enum: [1] },
            exportedAt: { type: 'string', format: 'date-time' },
            engineVersion: { type: 'string' },
            design: { $ref: `#/components/schemas/${DESIGN_DOCUMENT_COMPONENT}` },
          },
        },
        { $ref: `#/components/schemas/${DESIGN_DOCUMENT_COMPONENT}` },
      ],
    },
  })
  @ApiBadRequestResponse({ description: 'The file is not valid; `issues[]` lists every offending field path.' })
  importDesign(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: unknown,
  ): Promise<DesignDetail> {
    return this.designs.import(membership.projectId, body, user.id);
  }

  @Get(':designId')
  detail(@ProjectMembership() membership: Membership, @Param('designId') designId: string): Promise<DesignDetail> {
    return this.designs.detail(membership.projectId, designId);
  }

  @Get(':designId/compare')
  compare(
    @ProjectMembership() membership: Membership,
    @Param('designId') designId: string,
    @Query() query: CompareRevisionsDto,
  ): Promise<RevisionComparison> {
    return this.revisions.compare(membership.projectId, designId, query.a, query.b, query.bDesignId);
  }
}
