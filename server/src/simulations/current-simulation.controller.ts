import { Controller, Get } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { CurrentSimulationResponse } from '@ladderwright/shared/api';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import { RevisionRef } from '../revisions/revision-ref.decorator';
import { CurrentSimulationService } from './current-simulation.service';

@ApiTags('simulations')
@ApiCookieAuth()
@Controller('projects/:projectId/designs/:designId/revisions/:revisionNumber')
export class CurrentSimulationController {
  constructor(
    private readonly lookup: RevisionLookupService,
    private readonly current: CurrentSimulationService,
  ) {}

  /** The revision's current full simulation (same document and engine version), whose figures stand for the estimate. */
  @Get('simulated-figures')
  async simulatedFigures(@RevisionRef() ref: RevisionRef): Promise<CurrentSimulationResponse> {
    const { revision } = await this.lookup.find(ref);
    return this.current.find(revision.designId, revision.number, revision.document, revision.engineVersion);
  }
}
