import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiCookieAuth, ApiTags } from '@nestjs/swagger';
import type { CurrentUser as SessionUser, SimulationJob, StartSimulationResponse } from '@ladderwright/shared/api';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { ProjectMembership } from '../common/decorators/project-membership.decorator';
import { RequiresProjectAction } from '../common/decorators/requires-permission.decorator';
import type { ProjectMembership as Membership } from '../common/request.types';
import { StartSimulationDto } from './dto/start-simulation.dto';
import { SimulationsService } from './simulations.service';

@ApiTags('simulations')
@ApiCookieAuth()
@Controller('projects/:projectId/simulations')
export class SimulationsController {
  constructor(private readonly simulations: SimulationsService) {}

  /** Queues the run; poll the job for progress and the Waveforms. */
  @Post()
  @HttpCode(202)
  @RequiresProjectAction('design.write')
  start(
    @ProjectMembership() membership: Membership,
    @CurrentUser() user: SessionUser,
    @Body() body: StartSimulationDto,
  ): Promise<StartSimulationResponse> {
    return this.simulations.start(membership.projectId, user.id, body);
  }

  @Get(':jobId')
  get(@ProjectMembership() membership: Membership, @Param('jobId') jobId: string): Promise<SimulationJob> {
    return this.simulations.get(membership.projectId, jobId);
  }

  @Post(':jobId/cancel')
  @HttpCode(200)
  @RequiresProjectAction('design.write')
  cancel(@ProjectMembership() membership: Membership, @Param('jobId') jobId: string): Promise<SimulationJob> {
    return this.simulations.cancel(membership.projectId, jobId);
  }
}
