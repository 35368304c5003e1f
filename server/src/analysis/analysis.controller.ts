import { Body, Controller, Get, Header, HttpCode, Post } from '@nestjs/common';
import { ApiBadRequestResponse, ApiCookieAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { DesignTemplate } from '@ladderwright/shared/api';
import { designDocumentSchema } from '@ladderwright/shared/designs';
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
  @Header('Content-Type', 'application/json; charset=utf-8')
  @ApiOkResponse({ description: "The engine's report for the document, with the engine version." })
  @ApiBadRequestResponse({ description: 'The document is not valid; `issues[]` names every field, under `document.`.' })
  evaluate(@Body() body: EvaluateDesignDto): Promise<string> {
    return this.analysis.evaluateJson(body.document, 'document');
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
