import { Body, Controller, HttpCode, Post, Res } from '@nestjs/common';
import type { Response } from 'express';
import { ApiBadRequestResponse, ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { AllowedWhenArchived } from '../common/decorators/allowed-when-archived.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { PartsService } from '../parts/parts.service';
import { sendJsonBytes } from '../common/json-bytes';
import { AnalysisService } from './analysis.service';
import { EvaluateDesignDto } from './dto/evaluate-design.dto';

/** Live evaluation inside a project: the Checks use the project's Parts shelf, as a saved revision does. */
@ApiTags('analysis')
@ApiCookieAuth()
@Controller('projects/:projectId/analysis')
export class ProjectAnalysisController {
  constructor(
    private readonly analysis: AnalysisService,
    private readonly parts: PartsService,
  ) {}

  @Post('evaluate')
  @HttpCode(200)
  @AllowedWhenArchived()
  @ApiOkResponse({
    description:
      "The engine's report with the shelf's ratings filled in by partCode; unknown codes in `report.partIssues`. Each check names its rule by `ruleKey`, the texts once in `report.checkRules`.",
  })
  @ApiBadRequestResponse({ description: 'The document is not valid; `issues[]` names every field, under `document.`.' })
  async evaluate(
    @ProjectMembership() membership: Membership,
    @Body() body: EvaluateDesignDto,
    @Res() response: Response,
  ): Promise<void> {
    sendJsonBytes(
      response,
      await this.analysis.evaluateJsonBytes(body.document, 'document', await this.parts.shelf(membership.projectId)),
    );
  }
}
