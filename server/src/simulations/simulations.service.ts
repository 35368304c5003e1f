import { Inject, Injectable, Logger } from '@nestjs/common';
import { Op } from 'sequelize';
import type { SimulationJob, SimulationKind, StartSimulationResponse } from '@ladderwright/shared/api';
import { type Design, validateDesign } from '@ladderwright/shared/designs';
import { DomainError, isDomainError } from '@ladderwright/shared/errors';
import { APP_ENV, type AppEnv } from '../config/env';
import { isUuid } from '../common/uuid';
import { RevisionsService } from '../revisions/revisions.service';
import { SIMULATION_KINDS, type StartSimulationDto } from './dto/start-simulation.dto';
import { SimulationJobModel } from './simulation-job.model';
import { SimulationQueueService } from './simulation-queue.service';
import { SimulationRunnerService } from './simulation-runner.service';
import { FAULT_KINDS } from './simulation-task.types';

/** The request side of simulation jobs: validate and queue, read, cancel. */
@Injectable()
export class SimulationsService {
  private readonly logger = new Logger('Simulations');

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    private readonly queue: SimulationQueueService,
    private readonly runner: SimulationRunnerService,
    private readonly revisions: RevisionsService,
  ) {}

  async start(projectId: string, userId: string, body: StartSimulationDto): Promise<StartSimulationResponse> {
    const kind = this.checkKind(body.kind);
    const source = await this.resolveSource(projectId, body);
    const job = await SimulationJobModel.create({
      projectId,
      requestedBy: userId,
      kind,
      input: { document: source.document, options: { ...body.options } },
      designId: source.designId,
      revisionNumber: source.revisionNumber,
    });
    try {
      const queueJobId = await this.queue.send({ simulationJobId: job.id });
      await SimulationJobModel.update({ queueJobId }, { where: { id: job.id } });
    } catch (error) {
      this.logger.error(
        `queueing simulation ${job.id} failed: ${error instanceof Error ? error.message : String(error)}`,
      );
      await SimulationJobModel.update(
        {
          status: 'failed',
          errorCode: 'queue_unavailable',
          errorMessage: 'The job queue is not reachable; try again',
          finishedAt: new Date(),
        },
        { where: { id: job.id } },
      );
      throw error;
    }
    return { jobId: job.id, status: 'queued' };
  }

  async get(projectId: string, jobId: string): Promise<SimulationJob> {
    return toResponse(await this.find(projectId, jobId));
  }

  /** Cancels a queued or running job; a finished one is answered as it is. */
  async cancel(projectId: string, jobId: string): Promise<SimulationJob> {
    const job = await this.find(projectId, jobId);
    const [count] = await SimulationJobModel.update(
      { status: 'cancelled', finishedAt: new Date() },
      { where: { id: job.id, status: { [Op.in]: ['queued', 'running'] } } },
    );
    if (count > 0) {
      this.runner.cancelLocal(job.id);
      if (job.queueJobId) await this.queue.cancel(job.queueJobId).catch(() => undefined);
    }
    return toResponse(await this.find(projectId, jobId));
  }

  private async find(projectId: string, jobId: string): Promise<SimulationJobModel> {
    const job = isUuid(jobId) ? await SimulationJobModel.findOne({ where: { id: jobId, projectId } }) : null;
    if (!job) throw new DomainError('not_found', 'Simulation job not found', 'jobId');
    return job;
  }

  private checkKind(kind: string): SimulationKind {
    const allowed: readonly string[] = this.env.simulationFaultKinds
      ? [...SIMULATION_KINDS, ...FAULT_KINDS]
      : SIMULATION_KINDS;
    if (!allowed.includes(kind)) {
      throw new DomainError('invalid_argument', `kind must be one of ${SIMULATION_KINDS.join(', ')}`, 'kind');
    }
    return kind as SimulationKind;
  }

  /** The document to simulate: the one sent, or the stored revision (its design must be of this project, else 404). */
  private async resolveSource(
    projectId: string,
    body: StartSimulationDto,
  ): Promise<{ document: Design; designId: string | null; revisionNumber: number | null }> {
    const hasRevision = body.designId !== undefined || body.revisionNumber !== undefined;
    if (body.document === undefined && !hasRevision) {
      throw new DomainError('invalid_argument', 'document is required (or designId with revisionNumber)', 'document');
    }
    if (body.document !== undefined && hasRevision) {
      throw new DomainError(
        'invalid_argument',
        'give either document or designId with revisionNumber, not both',
        'document',
      );
    }
    if (body.document === undefined) {
      if (body.designId === undefined)
        throw new DomainError('invalid_argument', 'designId is required with revisionNumber', 'designId');
      if (body.revisionNumber === undefined)
        throw new DomainError('invalid_argument', 'revisionNumber is required with designId', 'revisionNumber');
      const revision = await this.revisions.get({
        projectId,
        designId: body.designId,
        revisionNumber: body.revisionNumber,
      });
      return { document: revision.document, designId: revision.designId, revisionNumber: revision.number };
    }
    try {
      return { document: validateDesign(body.document), designId: null, revisionNumber: null };
    } catch (error) {
      if (!isDomainError(error)) throw error;
      const issues = error.issues.map((issue) => ({ path: `document.${issue.path}`, message: issue.message }));
      const first = issues[0];
      throw new DomainError(
        error.code,
        first ? `${first.path}: ${first.message}` : error.message,
        first?.path ?? 'document',
        issues,
      );
    }
  }
}

function toResponse(job: SimulationJobModel): SimulationJob {
  const response: SimulationJob = {
    id: job.id,
    projectId: job.projectId,
    kind: job.kind,
    status: job.status,
    progressPct: job.progressPct,
    designId: job.designId,
    revisionNumber: job.revisionNumber,
    requestedBy: job.requestedBy,
    createdAt: job.createdAt.toISOString(),
    startedAt: job.startedAt?.toISOString() ?? null,
    finishedAt: job.finishedAt?.toISOString() ?? null,
  };
  if (job.status === 'failed')
    response.error = { code: job.errorCode ?? 'failed', message: job.errorMessage ?? 'The simulation failed' };
  if (job.status === 'succeeded' && job.result) response.result = job.result;
  return response;
}
