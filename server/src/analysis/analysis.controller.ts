import { Body, Controller, Get, HttpCode, Post, Res } from '@nestjs/common';
import type { Response } from 'express';
import { ApiBadRequestResponse, ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { DesignTemplate } from '@ladderwright/shared/api';
import { designDocumentSchema } from '@ladderwright/shared/designs';
import { sendJsonBytes } from '../common/json-bytes';
import { AnalysisService } from './analysis.service';
import { EvaluateDesignDto } from './dto/evaluate-design.dto';

/** Routes for any signed-in account: no project, no stored data. */
@ApiTags('analysis')
@ApiCookieAuth()
@Controller()
export class AnalysisController {
  constructor(private readonly analysis: AnalysisService) {}

  @Post('analysis/evaluate')
  @HttpCode(200)
  @ApiOkResponse({
    description:
      "The engine's report for the document, with the engine version. Each check names its rule by `ruleKey`, the texts once in `report.checkRules`.",
  })
  @ApiBadRequestResponse({ description: 'The document is not valid; `issues[]` names every field, under `document.`.' })
  async evaluate(@Body() body: EvaluateDesignDto, @Res() response: Response): Promise<void> {
    sendJsonBytes(response, await this.analysis.evaluateJsonBytes(body.document, 'document'));
  }

  @Get('design-schema')
  @ApiOkResponse({ description: 'JSON Schema (draft 2020-12) of the design document.' })
  schema(): typeof designDocumentSchema {
    return designDocumentSchema;
  }

  @Get('design-templates')
  templates(): DesignTemplate[] {
    return this.analysis.templates();
  }
}
