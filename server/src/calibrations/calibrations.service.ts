import { Injectable } from '@nestjs/common';
import { Op } from 'sequelize';
import type { CalibratedRevisionResponse, Calibration, CalibrationParameterOption } from '@ladderwright/shared/api';
import {
  applicableParameters,
  applyParameterValues,
  checkCalibrationData,
  checkChosenParameters,
  DEFAULT_CONFIDENCE,
  preparedDatasets,
  uncertainParameter,
  usesOfBenchKind,
  type CalibrationDataset,
  type CalibrationResult,
} from '@ladderwright/shared/calibration';
import { DomainError } from '@ladderwright/shared/errors';
import { formatQuantity, type QuantityUnit } from '@ladderwright/shared/units';
import { BenchRunModel } from '../bench-runs/bench-run.model';
import { isUuid } from '../common/uuid';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { RevisionsService } from '../revisions/revisions.service';
import { SimulationJobModel } from '../simulations/simulation-job.model';
import { SimulationsService } from '../simulations/simulations.service';
import { UserModel } from '../users/user.model';
import { CalibrationModel } from './calibration.model';
import type { StartCalibrationDto } from './dto/start-calibration.dto';

function toResponse(calibration: CalibrationModel): Calibration {
  const job = calibration.job as SimulationJobModel;
  const response: Calibration = {
    id: calibration.id,
    jobId: calibration.simulationJobId,
    designId: calibration.designId,
    revisionNumber: calibration.revisionNumber,
    status: job.status,
    progressPct: job.progressPct,
    input: {
      parameters: calibration.input.parameters,
      runs: calibration.input.datasets.map((dataset) => ({
        benchRunId: dataset.benchRunId,
        use: dataset.use,
        label: dataset.label,
        pointCount: dataset.points.length,
      })),
      confidence: calibration.input.confidence,
    },
    requestedBy: calibration.requestedBy,
    requestedByName: calibration.requester?.displayName ?? '',
    createdAt: calibration.createdAt.toISOString(),
    finishedAt: job.finishedAt?.toISOString() ?? null,
    draftRevisionNumber: calibration.draftRevisionNumber,
  };
  if (job.status === 'failed')
    response.error = { code: job.errorCode ?? 'failed', message: job.errorMessage ?? 'The calibration failed' };
  if (job.status === 'succeeded' && calibration.result) response.result = calibration.result;
  return response;
}

/** A value with its unit for a change note: SI prefixes where the unit has them. */
function describeValue(value: number, unit: string): string {
  const known: Record<string, QuantityUnit> = { Ω: 'Ohm', A: 'A', F: 'F' };
  const quantityUnit = known[unit];
  return quantityUnit ? formatQuantity(value, quantityUnit) : value.toPrecision(3);
}

/**
 * Calibrations of a revision: the parameters it may fit, starting one (inputs checked here, so bad data are
 * a 400 naming the run and the column, never a failed job), reading, cancelling, and starting the next
 * revision from the calibrated model.
 */
@Injectable()
export class CalibrationsService {
  constructor(
    private readonly lookup: RevisionLookupService,
    private readonly revisions: RevisionsService,
    private readonly simulations: SimulationsService,
  ) {}

  async parameters(ref: RevisionRef): Promise<CalibrationParameterOption[]> {
    const { revision } = await this.lookup.find(ref);
    return applicableParameters(revision.document);
  }

  async start(ref: RevisionRef, userId: string, body: StartCalibrationDto): Promise<Calibration> {
    const { revision } = await this.lookup.find(ref);
    const document = revision.document;
    const parameters = checkChosenParameters(
      document,
      body.parameters.map((choice, i) => {
        const declared = uncertainParameter(choice.id, `parameters[${i}].id`).prior(document);
        if (!declared) {
          throw new DomainError(
            'invalid_argument',
            `${uncertainParameter(choice.id).label} does not apply to this design`,
            `parameters[${i}].id`,
          );
        }
        return { id: choice.id, prior: choice.prior ?? declared };
      }),
    );
    const seen = new Set<string>();
    const datasets: CalibrationDataset[] = [];
    for (const [i, choice] of body.runs.entries()) {
      const field = `runs[${i}].benchRunId`;
      const run = isUuid(choice.benchRunId)
        ? await BenchRunModel.findOne({
            where: {
              id: choice.benchRunId,
              projectId: ref.projectId,
              designId: revision.designId,
              revisionNumber: revision.number,
              deletedAt: null,
            },
          })
        : null;
      if (!run) throw new DomainError('invalid_argument', 'no bench run of this revision has this id', field);
      if (seen.has(run.id)) throw new DomainError('invalid_argument', 'the bench run is chosen twice', field);
      seen.add(run.id);
      if (!usesOfBenchKind(run.kind).includes(choice.use)) {
        throw new DomainError(
          'invalid_argument',
          `a ${run.kind} run can be fitted as ${usesOfBenchKind(run.kind).join(' or ')}, not as ${choice.use}`,
          `runs[${i}].use`,
        );
      }
      datasets.push({
        benchRunId: run.id,
        label: run.title || `${run.kind} of ${run.createdAt.toISOString().slice(0, 10)}`,
        use: choice.use,
        points: run.points,
      });
    }
    const prepared = preparedDatasets(datasets);
    checkCalibrationData(document, prepared, parameters.length);
    const confidence = body.confidence ?? DEFAULT_CONFIDENCE;
    let calibrationId = '';
    await this.simulations.enqueue(
      {
        projectId: ref.projectId,
        userId,
        kind: 'calibration',
        document,
        options: {},
        designId: revision.designId,
        revisionNumber: revision.number,
      },
      async (job, transaction) => {
        const created = await CalibrationModel.create(
          {
            projectId: ref.projectId,
            designId: revision.designId,
            revisionNumber: revision.number,
            simulationJobId: job.id,
            requestedBy: userId,
            input: { parameters, datasets: prepared, confidence },
          },
          { transaction },
        );
        calibrationId = created.id;
      },
    );
    return this.get(ref, calibrationId);
  }

  async list(ref: RevisionRef): Promise<Calibration[]> {
    const { revision } = await this.lookup.find(ref);
    return this.listForRevision(revision.designId, revision.number);
  }

  /** The calibrations of a revision, newest first (for Sign-off and the spec sheet). */
  async listForRevision(designId: string, revisionNumber: number): Promise<Calibration[]> {
    const rows = await CalibrationModel.findAll({
      where: { designId, revisionNumber },
      include: [SimulationJobModel, { model: UserModel, as: 'requester' }],
      order: [['createdAt', 'DESC']],
      limit: 50,
    });
    return rows.map(toResponse);
  }

  async get(ref: RevisionRef, calibrationId: string): Promise<Calibration> {
    return toResponse(await this.find(ref, calibrationId));
  }

  async cancel(ref: RevisionRef, calibrationId: string): Promise<Calibration> {
    const calibration = await this.find(ref, calibrationId);
    await this.simulations.cancelJob(calibration.job as SimulationJobModel);
    return this.get(ref, calibrationId);
  }

  /**
   * Saves the design's next revision (on its latest) with the fitted values written in and a change note
   * naming the calibrated revision, the bench runs and each value with its former one.
   */
  async startRevision(ref: RevisionRef, calibrationId: string, userId: string): Promise<CalibratedRevisionResponse> {
    const calibration = await this.find(ref, calibrationId);
    const result: CalibrationResult | null = calibration.result;
    if ((calibration.job as SimulationJobModel).status !== 'succeeded' || !result) {
      throw new DomainError('invalid_argument', 'The calibration has no result yet', 'calibrationId');
    }
    const design = await this.lookup.findDesign(ref.projectId, ref.designId);
    const latest = await this.revisions.get({ ...ref, revisionNumber: design.latestRevisionNumber });
    const ids = result.parameters.map((parameter) => parameter.id);
    const document = applyParameterValues(
      latest.document,
      ids,
      result.parameters.map((parameter) => parameter.value),
    );
    const runs = calibration.input.datasets.map((dataset) => `'${dataset.label}'`).join(', ');
    const values = result.parameters
      .map(
        (parameter) =>
          `${parameter.label} ${describeValue(parameter.value, parameter.unit)} (was ${describeValue(parameter.initialValue, parameter.unit)})`,
      )
      .join('; ');
    const changeNote =
      `Calibrated model from revision ${calibration.revisionNumber}, bench runs ${runs}: ${values}.`.slice(0, 2000);
    const saved = await this.revisions.save({
      projectId: ref.projectId,
      designId: design.id,
      request: { baseRevisionNumber: design.latestRevisionNumber, document, changeNote },
      authorId: userId,
    });
    await CalibrationModel.update({ draftRevisionNumber: saved.number }, { where: { id: calibration.id } });
    return { designId: design.id, revisionNumber: saved.number, changeNote };
  }

  private async find(ref: RevisionRef, calibrationId: string): Promise<CalibrationModel> {
    const { revision } = await this.lookup.find(ref);
    const calibration = isUuid(calibrationId)
      ? await CalibrationModel.findOne({
          where: {
            id: calibrationId,
            projectId: ref.projectId,
            designId: revision.designId,
            revisionNumber: { [Op.eq]: revision.number },
          },
          include: [SimulationJobModel, { model: UserModel, as: 'requester' }],
        })
      : null;
    if (!calibration) throw new DomainError('not_found', 'Calibration not found', 'calibrationId');
    return calibration;
  }
}
