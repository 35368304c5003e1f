import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type {
  CurrentUser as SessionUser,
  SimulationBatch,
  StartSimulationBatchResponse,
} from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { StartSimulationBatchDto } from './dto/start-simulation-batch.dto';
import { SimulationBatchesService } from './simulation-batches.service';

@ApiTags('simulations')
@ApiCookieAuth()
@Controller('projects/:projectId/simulation-batches')
export class SimulationBatchesController {
  constructor(private readonly batches: SimulationBatchesService) {}

  /** Queues one simulation job per member; poll the batch for its members' figures and their spread. */
  @Post()
  @HttpCode(202)
  @RequiresProjectAction('design.write')
  start(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: StartSimulationBatchDto,
  ): Promise<StartSimulationBatchResponse> {
    return this.batches.start(membership.projectId, user.id, body);
  }

  @Get(':batchId')
  get(@ProjectMembership() membership: Membership, @Param('batchId') batchId: string): Promise<SimulationBatch> {
    return this.batches.get(membership.projectId, batchId);
  }

  @Post(':batchId/cancel')
  @HttpCode(200)
  @RequiresProjectAction('design.write')
  cancel(@ProjectMembership() membership: Membership, @Param('batchId') batchId: string): Promise<SimulationBatch> {
    return this.batches.cancel(membership.projectId, batchId);
  }
}
