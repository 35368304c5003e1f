import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import Papa from 'papaparse';
import { Sequelize } from 'sequelize-typescript';
import type { BenchFile, BenchRunDetail, BenchRunSummary } from '@ladderwright/shared/api';
import {
  benchTextIssue,
  compareBenchRun,
  predictionFromReport,
  readMeasurementTable,
  type MeasuredPoint,
} from '@ladderwright/shared/bench';
import { DomainError } from '@ladderwright/shared/errors';
import { isUuid } from '../common/uuid';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import type { RevisionRef } from '../revisions/revision-ref.decorator';
import { requireCsvText, requirePhoto } from '../storage/upload-checks';
import { BLOB_STORE, type BlobStore, type UploadedFileData } from '../storage/storage.types';
import { UserModel } from '../users/user.model';
import type { UploadBenchRunDto } from './dto/upload-bench-run.dto';
import { BenchRunEventModel } from './bench-run-event.model';
import { BenchRunFileModel } from './bench-run-file.model';
import { BenchRunModel } from './bench-run.model';

export const BENCH_FILE_MAX_BYTES = 4 * 1024 * 1024;
export const BENCH_MAX_PHOTOS = 4;
const DEFAULT_TOLERANCE = 0.05;

export interface BenchUpload {
  data?: UploadedFileData[];
  photos?: UploadedFileData[];
}

function parseTolerance(text: string | undefined): number {
  if (text === undefined || text.trim() === '') return DEFAULT_TOLERANCE;
  const trimmed = text.trim();
  const value = trimmed.endsWith('%') ? Number(trimmed.slice(0, -1)) / 100 : Number(trimmed);
  if (!(value > 0 && value < 1)) {
    throw new DomainError(
      'invalid_argument',
      'tolerance must be between 0 and 1 (e.g. 0.05) or 0 % and 100 %',
      'tolerance',
    );
  }
  return value;
}

function toFile(file: BenchRunFileModel): BenchFile & { id: string } {
  return {
    id: file.id,
    role: file.role,
    originalName: file.originalName,
    contentType: file.contentType,
    sizeBytes: file.sizeBytes,
    sha256: file.sha256,
  };
}

function toSummary(run: BenchRunModel): BenchRunSummary {
  return {
    id: run.id,
    designId: run.designId,
    revisionNumber: run.revisionNumber,
    kind: run.kind,
    title: run.title,
    tolerance: run.tolerance,
    pointCount: run.points.length,
    verdict: run.verdict,
    marginPct: run.marginPct,
    worstDeviation: run.worstDeviation,
    files: (run.files ?? []).sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime()).map(toFile),
    uploadedById: run.uploadedBy,
    uploadedByName: run.uploader?.displayName ?? '',
    createdAt: run.createdAt.toISOString(),
  };
}

/** Bench runs of a revision: upload (parse, compare, store), list, read, soft delete with an audit event. */
@Injectable()
export class BenchRunsService {
  constructor(
    @InjectModel(BenchRunModel) private readonly runs: typeof BenchRunModel,
    @InjectModel(BenchRunFileModel) private readonly files: typeof BenchRunFileModel,
    @InjectModel(BenchRunEventModel) private readonly events: typeof BenchRunEventModel,
    private readonly lookup: RevisionLookupService,
    @Inject(BLOB_STORE) private readonly blobs: BlobStore,
    private readonly sequelize: Sequelize,
  ) {}

  async upload(input: {
    ref: RevisionRef;
    fields: UploadBenchRunDto;
    upload: BenchUpload;
    userId: string;
  }): Promise<BenchRunDetail> {
    const { ref, fields, upload, userId } = input;
    const { projectId } = ref;
    const { revision } = await this.lookup.find(ref);
    const tolerance = parseTolerance(fields.tolerance);
    const dataFile = upload.data?.[0];
    const text = requireCsvText(dataFile, 'data');
    const tooLarge = benchTextIssue(text);
    if (tooLarge) throw new DomainError('invalid_argument', tooLarge.message, tooLarge.path, [tooLarge]);
    const rows = Papa.parse<string[]>(text, { header: false, skipEmptyLines: false }).data;
    const table = readMeasurementTable(rows, fields.kind);
    const comparison = compareBenchRun(fields.kind, table.points, predictionFromReport(revision.report), tolerance);
    const photos = (upload.photos ?? []).map((photo, i) => ({ photo, type: requirePhoto(photo, `photos[${i}]`) }));

    // Bytes first (content-addressed, never overwritten), then the metadata in one transaction.
    const dataBlob = await this.blobs.put((dataFile as UploadedFileData).buffer);
    const photoBlobs = await Promise.all(photos.map(async ({ photo }) => this.blobs.put(photo.buffer)));
    const id = await this.sequelize.transaction(async (transaction) => {
      const run = await this.runs.create(
        {
          projectId,
          designId: revision.designId,
          revisionNumber: revision.number,
          kind: fields.kind,
          title: fields.title?.trim() ?? '',
          tolerance,
          points: table.points,
          metadata: table.metadata,
          comparison,
          verdict: comparison.verdict,
          marginPct: comparison.marginPct,
          worstDeviation: comparison.worstDeviation,
          uploadedBy: userId,
        },
        { transaction },
      );
      const stored = [
        { role: 'data' as const, file: dataFile as UploadedFileData, type: 'text/csv', blob: dataBlob },
        ...photos.map(({ photo, type }, i) => ({ role: 'photo' as const, file: photo, type, blob: photoBlobs[i] })),
      ];
      for (const entry of stored) {
        if (!entry.blob) throw new Error('photo blob missing after upload');
        await this.files.create(
          {
            benchRunId: run.id,
            role: entry.role,
            originalName: entry.file.originalname.slice(0, 200),
            contentType: entry.type,
            sizeBytes: entry.blob.sizeBytes,
            sha256: entry.blob.sha256,
            storageKey: entry.blob.key,
          },
          { transaction },
        );
      }
      await this.events.create(
        {
          benchRunId: run.id,
          action: 'uploaded',
          actorId: userId,
          detail: { kind: fields.kind, sha256: dataBlob.sha256 },
        },
        { transaction },
      );
      return run.id;
    });
    return this.get(ref, id);
  }

  async list(ref: RevisionRef): Promise<BenchRunSummary[]> {
    const { revision } = await this.lookup.find(ref);
    return this.listForRevision(revision.designId, revision.number);
  }

  /** The live bench runs of a revision with their verdicts, newest first (for Sign-off and the spec sheet). */
  async listForRevision(designId: string, revisionNumber: number): Promise<BenchRunSummary[]> {
    return (await this.liveRuns(designId, revisionNumber)).map(toSummary);
  }

  /** As `listForRevision`, with each run's measured points (the spec sheet overlays load sweeps on its plot). */
  async listForRevisionWithPoints(
    designId: string,
    revisionNumber: number,
  ): Promise<(BenchRunSummary & { points: MeasuredPoint[] })[]> {
    return (await this.liveRuns(designId, revisionNumber)).map((run) => ({ ...toSummary(run), points: run.points }));
  }

  async get(ref: RevisionRef, benchRunId: string): Promise<BenchRunDetail> {
    const run = await this.findRun(ref, benchRunId);
    return { ...toSummary(run), points: run.points, comparison: run.comparison, metadata: run.metadata };
  }

  /** The bytes of one file of a live bench run, with its stored type and name. */
  async file(
    ref: RevisionRef,
    benchRunId: string,
    fileId: string,
  ): Promise<{ body: Buffer; contentType: string; fileName: string }> {
    const run = await this.findRun(ref, benchRunId);
    const file = (run.files ?? []).find((candidate) => candidate.id === fileId);
    if (!file) throw new DomainError('not_found', 'File not found in this bench run', 'fileId');
    return { body: await this.blobs.get(file.storageKey), contentType: file.contentType, fileName: file.originalName };
  }

  /** Soft delete: the run leaves the lists, its rows and bytes stay, and a `deleted` event records who and what. */
  async remove(ref: RevisionRef, benchRunId: string, userId: string): Promise<void> {
    const run = await this.findRun(ref, benchRunId);
    await this.sequelize.transaction(async (transaction) => {
      await run.update({ deletedAt: new Date(), deletedBy: userId }, { transaction });
      await this.events.create(
        {
          benchRunId: run.id,
          action: 'deleted',
          actorId: userId,
          detail: {
            kind: run.kind,
            title: run.title,
            files: (run.files ?? []).map((file) => ({ name: file.originalName, sha256: file.sha256 })),
          },
        },
        { transaction },
      );
    });
  }

  private async liveRuns(designId: string, revisionNumber: number): Promise<BenchRunModel[]> {
    return this.runs.findAll({
      where: { designId, revisionNumber, deletedAt: null },
      include: [BenchRunFileModel, { model: UserModel, as: 'uploader' }],
      order: [['createdAt', 'DESC']],
    });
  }

  private async findRun(ref: RevisionRef, benchRunId: string): Promise<BenchRunModel> {
    const { projectId } = ref;
    const { revision } = await this.lookup.find(ref);
    const run = isUuid(benchRunId)
      ? await this.runs.findOne({
          where: {
            id: benchRunId,
            projectId,
            designId: revision.designId,
            revisionNumber: revision.number,
            deletedAt: null,
          },
          include: [BenchRunFileModel, { model: UserModel, as: 'uploader' }],
        })
      : null;
    if (!run) throw new DomainError('not_found', 'Bench run not found', 'benchRunId');
    return run;
  }
}
