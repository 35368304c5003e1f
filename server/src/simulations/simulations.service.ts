import { Inject, Injectable, Logger } from '@nestjs/common';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type {
  SimulationJob,
  SimulationKind,
  SimulationOptions,
  StartSimulationResponse,
} from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { DomainError } from '@ladderwright/shared/errors';
import { APP_ENV, type AppEnv } from '../config/env';
import { RetryLaterException } from '../common/filters/domain-error.filter';
import { isUuid } from '../common/uuid';
import { AnalysisService } from '../analysis/analysis.service';
import { RevisionsService } from '../revisions/revisions.service';
import { SIMULATION_KINDS, type StartSimulationDto } from './dto/start-simulation.dto';
import { SimulationBatchEndsService } from './simulation-batch-ends.service';
import { SimulationJobModel, type SimulationJobKind } from './simulation-job.model';
import { SimulationQueueService } from './simulation-queue.service';
import { SimulationRunnerService } from './simulation-runner.service';
import { FAULT_KINDS } from './simulation-task.types';

/** Drive cycles a run without `options.cycles` may take before it gives up settling (the simulator's cap). */
const UNTIL_STEADY_MAX_CYCLES = 20_000;
const DEFAULT_STEPS_PER_PERIOD = 100;
/** Retry-After of a refusal over a quota: a short run ends in about this long. */
const QUOTA_RETRY_AFTER_S = 30;

/** A job's size: cells × drive cycles × time steps per cycle (the transient's work grows with each). */
export function simulationWork(document: Design, options: SimulationOptions): number {
  const cycles = options.cycles ?? UNTIL_STEADY_MAX_CYCLES;
  return document.multiplier.cellCount * cycles * (options.maxStepPerPeriod ?? DEFAULT_STEPS_PER_PERIOD);
}

/**
 * The request side of simulation jobs: validate and queue, read, cancel. Each start is checked against a
 * size limit and the per-user and per-project quotas of queued and running jobs, under a per-project
 * advisory lock so that concurrent starts cannot both slip under a quota. Jobs are queued with a priority
 * that falls with the project's jobs already waiting, so a project with one job goes ahead of another's
 * fiftieth (fair between projects; pg-boss takes higher priority first, then the oldest).
 */
@Injectable()
export class SimulationsService {
  private readonly logger = new Logger('Simulations');

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    private readonly queue: SimulationQueueService,
    private readonly runner: SimulationRunnerService,
    private readonly revisions: RevisionsService,
    private readonly analysis: AnalysisService,
    private readonly sequelize: Sequelize,
    private readonly batchEnds: SimulationBatchEndsService,
  ) {}

  async start(projectId: string, userId: string, body: StartSimulationDto): Promise<StartSimulationResponse> {
    const kind = this.checkKind(body.kind);
    const source = await this.resolveSource(projectId, body);
    const options = { ...body.options };
    this.checkSize(source.document, options);
    const job = await this.enqueue({ projectId, userId, kind, ...source, options });
    return { jobId: job.id, status: 'queued' };
  }

  /**
   * Creates a job row and queues it, within the per-user and per-project quotas (429 past them), under the
   * project's advisory lock; `withJob` runs in the same transaction (a calibration writes its own row
   * there). A queue that cannot be reached fails the job with a reason and rethrows.
   */
  async enqueue(
    input: {
      projectId: string;
      userId: string;
      kind: SimulationJobKind;
      document: Design;
      options: SimulationOptions;
      designId: string | null;
      revisionNumber: number | null;
    },
    withJob?: (job: SimulationJobModel, transaction: Transaction) => Promise<void>,
  ): Promise<SimulationJobModel> {
    const { projectId, userId } = input;
    const { job, priority } = await this.sequelize.transaction(async (transaction) => {
      const priority = await this.holdQuota(projectId, userId, transaction);
      const created = await SimulationJobModel.create(
        {
          projectId,
          requestedBy: userId,
          kind: input.kind,
          input: { document: input.document, options: input.options },
          designId: input.designId,
          revisionNumber: input.revisionNumber,
        },
        { transaction },
      );
      await withJob?.(created, transaction);
      return { job: created, priority };
    });
    await this.queueJob(job.id, priority);
    return job;
  }

  /**
   * Takes the project's advisory lock in `transaction` and checks the per-user and per-project quotas (429 past
   * them); returns the queue priority of the project's next job. A batch counts once, its members not at all.
   */
  async holdQuota(projectId: string, userId: string, transaction: Transaction): Promise<number> {
    await this.sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:projectId))', {
      replacements: { projectId },
      transaction,
    });
    const [active] = await this.sequelize.query<{ mine: number; project: number }>(
      `SELECT count(*) FILTER (WHERE requested_by = :userId)::int AS mine, count(*)::int AS project
       FROM simulation_jobs
       WHERE project_id = :projectId AND status IN ('queued', 'running') AND parent_job_id IS NULL`,
      { replacements: { projectId, userId }, type: QueryTypes.SELECT, transaction },
    );
    this.checkQuotas(active?.mine ?? 0, active?.project ?? 0);
    return -(active?.project ?? 0);
  }

  /** Sends a created job to the queue; a queue that cannot be reached fails the job with a reason and rethrows. */
  async queueJob(jobId: string, priority: number): Promise<void> {
    try {
      const queueJobId = await this.queue.send({ simulationJobId: jobId }, priority);
      await SimulationJobModel.update({ queueJobId }, { where: { id: jobId } });
    } catch (error) {
      this.logger.error(
        `queueing simulation ${jobId} failed: ${error instanceof Error ? error.message : String(error)}`,
      );
      await SimulationJobModel.update(
        {
          status: 'failed',
          errorCode: 'queue_unavailable',
          errorMessage: 'The job queue is not reachable; try again',
          finishedAt: new Date(),
        },
        { where: { id: jobId } },
      );
      throw error;
    }
  }

  /** Cancels a queued or running job of any kind; true when this call cancelled it. */
  async cancelJob(job: SimulationJobModel): Promise<boolean> {
    const [count] = await SimulationJobModel.update(
      { status: 'cancelled', finishedAt: new Date() },
      { where: { id: job.id, status: { [Op.in]: ['queued', 'running'] } } },
    );
    if (count > 0) {
      this.runner.cancelLocal(job.id);
      if (job.queueJobId) await this.queue.cancel(job.queueJobId).catch(() => undefined);
      if (job.parentJobId) await this.batchEnds.memberEnded(job.parentJobId);
    }
    return count > 0;
  }

  async get(projectId: string, jobId: string): Promise<SimulationJob> {
    return toResponse(await this.find(projectId, jobId));
  }

  /** Cancels a queued or running job; a finished one is answered as it is. */
  async cancel(projectId: string, jobId: string): Promise<SimulationJob> {
    await this.cancelJob(await this.find(projectId, jobId));
    return toResponse(await this.find(projectId, jobId));
  }

  private async find(projectId: string, jobId: string): Promise<SimulationJobModel> {
    // A calibration's job is read and cancelled through its calibration, a batch through its own routes.
    const job = isUuid(jobId)
      ? await SimulationJobModel.findOne({
          where: { id: jobId, projectId, kind: { [Op.notIn]: ['calibration', 'batch'] } },
        })
      : null;
    if (!job) throw new DomainError('not_found', 'Simulation job not found', 'jobId');
    return job;
  }

  checkSize(document: Design, options: SimulationOptions): void {
    const work = simulationWork(document, options);
    if (work <= this.env.simulationMaxWork) return;
    const field = options.cycles === undefined ? 'options' : 'options.cycles';
    throw new DomainError(
      'invalid_argument',
      `${field}: the run would take ${work.toExponential(2)} cell-steps (cells × cycles × steps per cycle, ` +
        `${UNTIL_STEADY_MAX_CYCLES} cycles when none are given); at most ${this.env.simulationMaxWork.toExponential(2)}: ` +
        'give fewer cycles or steps per cycle',
      field,
    );
  }

  private checkQuotas(mine: number, project: number): void {
    if (mine >= this.env.simulationMaxActivePerUser) {
      throw new RetryLaterException(
        `You have ${mine} simulations queued or running, the most one person may have; wait for one to end or cancel one`,
        QUOTA_RETRY_AFTER_S,
      );
    }
    if (project >= this.env.simulationMaxActivePerProject) {
      throw new RetryLaterException(
        `This project has ${project} simulations queued or running, the most one project may have; wait for one to end`,
        QUOTA_RETRY_AFTER_S,
      );
    }
  }

  checkKind(kind: string, field = 'kind'): SimulationKind {
    const allowed: readonly string[] = this.env.simulationFaultKinds
      ? [...SIMULATION_KINDS, ...FAULT_KINDS]
      : SIMULATION_KINDS;
    if (!allowed.includes(kind)) {
      throw new DomainError('invalid_argument', `${field} must be one of ${SIMULATION_KINDS.join(', ')}`, field);
    }
    return kind as SimulationKind;
  }

  /** The document to simulate: the one sent, or the stored revision (its design must be of this project, else 404). */
  async resolveSource(
    projectId: string,
    body: Pick<StartSimulationDto, 'document' | 'designId' | 'revisionNumber'>,
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
    return { document: this.analysis.parseDocument(body.document, 'document'), designId: null, revisionNumber: null };
  }
}

function toResponse(job: SimulationJobModel): SimulationJob {
  const response: SimulationJob = {
    id: job.id,
    projectId: job.projectId,
    kind: job.kind as SimulationKind,
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
