import { Injectable, Logger } from '@nestjs/common';
import { Op, QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type {
  SimulationBatch,
  SimulationBatchFigureSpread,
  SimulationBatchKind,
  SimulationBatchMember,
  SimulationJobStatus,
  SimulationSummary,
  StartSimulationBatchResponse,
} from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { type DesignVariant, monteCarloDesigns, spreadStatistics, sweepDesigns } from '@ladderwright/shared/sizing';
import { isUuid } from '../common/uuid';
import type { StartSimulationBatchDto } from './dto/start-simulation-batch.dto';
import { SimulationJobModel } from './simulation-job.model';
import { SimulationsService } from './simulations.service';

interface MemberRow {
  id: string;
  member_index: number;
  status: SimulationJobStatus;
  variant: Record<string, number> | null;
  summary: SimulationSummary | null;
  error_code: string | null;
  error_message: string | null;
}

function figureSpread(values: number[]): SimulationBatchFigureSpread | null {
  if (values.length === 0) return null;
  const { mean, sd, min, max, p5, p50, p95 } = spreadStatistics(Float64Array.from(values), 1);
  return { count: values.length, mean, sd, min, max, p5, p50, p95 };
}

/**
 * Batches of simulations: a parameter sweep or a Monte Carlo over the part tolerances, each member a whole
 * simulation job on the shared PostgreSQL queue. The batch is one row that is never queued; its members are
 * created with it in one transaction (under the project's quota, where the batch counts as one job) and queued
 * one by one with falling priority, so another project's single job still goes ahead of the batch's later
 * members. Every app instance with simulation workers takes members; the last member to end ends the batch
 * (`SimulationBatchEndsService`). Members' figures are read from their rows, so the batch stores no copy.
 */
@Injectable()
export class SimulationBatchesService {
  private readonly logger = new Logger('SimulationBatches');

  constructor(
    private readonly simulations: SimulationsService,
    private readonly sequelize: Sequelize,
  ) {}

  async start(projectId: string, userId: string, body: StartSimulationBatchDto): Promise<StartSimulationBatchResponse> {
    const simulationKind = this.simulations.checkKind(body.simulationKind, 'simulationKind');
    const source = await this.simulations.resolveSource(projectId, body);
    const options = { ...body.options };
    const { kind, members } = this.members(source.document, body);
    for (const member of members) this.simulations.checkSize(member.document, options);
    const { batch, jobs, priority } = await this.sequelize.transaction(async (transaction) => {
      const priority = await this.simulations.holdQuota(projectId, userId, transaction);
      const batch = await SimulationJobModel.create(
        {
          projectId,
          requestedBy: userId,
          kind: 'batch',
          status: 'running',
          input: {
            document: source.document,
            options,
            batch: { kind, simulationKind, memberCount: members.length },
          },
          designId: source.designId,
          revisionNumber: source.revisionNumber,
        },
        { transaction },
      );
      // Members simulate variants, not the revision: they carry no design or revision of their own.
      const jobs = await SimulationJobModel.bulkCreate(
        members.map((member, index) => ({
          projectId,
          requestedBy: userId,
          kind: simulationKind,
          input: { document: member.document, options, variant: member.variant },
          parentJobId: batch.id,
          memberIndex: index,
        })),
        { transaction, returning: true },
      );
      return { batch, jobs, priority };
    });
    try {
      for (const [index, job] of jobs.entries()) await this.simulations.queueJob(job.id, priority - index);
    } catch (error) {
      await this.cancelMembers(batch.id, 'failed');
      throw error;
    }
    return { batchId: batch.id, status: 'running', memberCount: jobs.length };
  }

  async get(projectId: string, batchId: string): Promise<SimulationBatch> {
    const batch = await this.find(projectId, batchId);
    const rows = await this.sequelize.query<MemberRow>(
      `SELECT id, member_index, status, input->'variant' AS variant, result->'summary' AS summary,
              error_code, error_message
       FROM simulation_jobs WHERE parent_job_id = :batchId ORDER BY member_index`,
      { replacements: { batchId: batch.id }, type: QueryTypes.SELECT },
    );
    const members: SimulationBatchMember[] = rows.map((row) => ({
      index: row.member_index,
      jobId: row.id,
      status: row.status,
      variant: row.variant ?? {},
      summary: row.status === 'succeeded' ? row.summary : null,
      ...(row.status === 'failed'
        ? { error: { code: row.error_code ?? 'failed', message: row.error_message ?? 'The simulation failed' } }
        : {}),
    }));
    const isOpen = (status: SimulationJobStatus) => status === 'queued' || status === 'running';
    const figures = (pick: (summary: SimulationSummary) => number | null): number[] =>
      members.flatMap((member) => {
        const value = member.summary ? pick(member.summary) : null;
        return value === null ? [] : [value];
      });
    const batchInput = batch.input.batch;
    return {
      id: batch.id,
      projectId: batch.projectId,
      kind: batchInput?.kind ?? 'sweep',
      simulationKind: batchInput?.simulationKind ?? 'full',
      status: batch.status,
      progressPct: batch.progressPct,
      memberCount: members.length,
      membersEnded: members.filter((member) => !isOpen(member.status)).length,
      createdAt: batch.createdAt.toISOString(),
      finishedAt: batch.finishedAt?.toISOString() ?? null,
      members,
      spread: isOpen(batch.status)
        ? null
        : {
            outputMeanV: figureSpread(figures((summary) => summary.outputMeanV)),
            ripplePeakToPeakV: figureSpread(figures((summary) => summary.ripplePeakToPeakV)),
          },
    };
  }

  /** Cancels the batch and every member still queued or running; an ended batch is answered as it is. */
  async cancel(projectId: string, batchId: string): Promise<SimulationBatch> {
    const batch = await this.find(projectId, batchId);
    await this.cancelMembers(batch.id, 'cancelled');
    return this.get(projectId, batchId);
  }

  private async cancelMembers(batchId: string, status: 'cancelled' | 'failed'): Promise<void> {
    const [count] = await SimulationJobModel.update(
      {
        status,
        finishedAt: new Date(),
        ...(status === 'failed'
          ? { errorCode: 'queue_unavailable', errorMessage: 'The job queue is not reachable; try again' }
          : {}),
      },
      { where: { id: batchId, status: 'running' } },
    );
    if (count === 0) return;
    const open = await SimulationJobModel.findAll({
      where: { parentJobId: batchId, status: { [Op.in]: ['queued', 'running'] } },
    });
    for (const member of open) {
      await this.simulations.cancelJob(member).catch((error: unknown) => {
        this.logger.warn(`cancelling member ${member.id}: ${error instanceof Error ? error.message : String(error)}`);
      });
    }
  }

  private members(
    document: DesignVariant['document'],
    body: StartSimulationBatchDto,
  ): { kind: SimulationBatchKind; members: DesignVariant[] } {
    if ((body.sweep === undefined) === (body.monteCarlo === undefined)) {
      throw new DomainError('invalid_argument', 'give either sweep or monteCarlo', 'sweep');
    }
    if (body.sweep) return { kind: 'sweep', members: sweepDesigns(document, body.sweep.path, body.sweep.values) };
    const { trials, seed } = body.monteCarlo as { trials: number; seed: number };
    return { kind: 'monte-carlo', members: monteCarloDesigns(document, trials, seed) };
  }

  private async find(projectId: string, batchId: string): Promise<SimulationJobModel> {
    const batch = isUuid(batchId)
      ? await SimulationJobModel.findOne({ where: { id: batchId, projectId, kind: 'batch' } })
      : null;
    if (!batch) throw new DomainError('not_found', 'Simulation batch not found', 'batchId');
    return batch;
  }
}
