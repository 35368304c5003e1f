import { Inject, Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { QueryTypes, type Transaction } from 'sequelize';
import pLimit, { type Limit } from 'p-limit';
import { Sequelize } from 'sequelize-typescript';
import type {
  DesignExport,
  EvaluateResponse,
  RevisionComparison,
  RevisionDetail,
  RevisionSummary,
  SaveRevisionRequest,
} from '@ladderwright/shared/api';
import { packCheckLists } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { DomainError } from '@ladderwright/shared/errors';
import { buildCircuit } from '@ladderwright/shared/circuits';
import { capacitorRoleChanges } from '@ladderwright/shared/multiplier';
import { toSpiceNetlist } from '@ladderwright/shared/sim';
import { AnalysisService } from '../analysis/analysis.service';
import { APP_ENV, type AppEnv } from '../config/env';
import { PartsService } from '../parts/parts.service';
import { differences } from './document-diff';
import { UserModel } from '../users/user.model';
import { RevisionLookupService } from './revision-lookup.service';
import { revisionNotFound, type RevisionRef } from './revision-ref.decorator';
import { RevisionContentCache } from './revision-content-cache';
import {
  fileStem,
  revisionContentTail,
  revisionDetailBytes,
  toRevisionDetail,
  toRevisionDetailBody,
  toRevisionSummary,
  type RevisionDetailHeadRow,
} from './revision-shapes';
import { RevisionModel } from './revision.model';
import { StaleBaseException } from './stale-base.filter';

/**
 * Writes in flight at once: one per engine thread plus one (so that a thread never idles while a write reads or
 * commits), at most half of the pool. Each write's requests to PostgreSQL queue with everyone else's, so
 * fewer writes in flight keep the queue a bystander's query waits in short; more would not finish a burst
 * sooner, since the engine threads are its bottleneck.
 */
export function writeSlotCount(env: Pick<AppEnv, 'databasePoolMax' | 'engineWorkers'>): number {
  return Math.max(1, Math.min(Math.floor(env.databasePoolMax / 2), env.engineWorkers + 1));
}

/** A revision to write; the report is computed here, from the document, with the shared engine. */
export interface NewRevision {
  designId: string;
  number: number;
  document: Design;
  authorId: string;
  changeNote: string;
  baseRevisionNumber: number | null;
}

export interface DownloadFile {
  fileName: string;
  body: string;
}

@Injectable()
export class RevisionsService {
  private readonly writeSlots: Limit;
  private readonly contents = new RevisionContentCache();

  constructor(
    @InjectModel(RevisionModel) private readonly revisions: typeof RevisionModel,
    private readonly lookup: RevisionLookupService,
    private readonly analysis: AnalysisService,
    private readonly parts: PartsService,
    private readonly sequelize: Sequelize,
    @Inject(APP_ENV) env: AppEnv,
  ) {
    this.writeSlots = pLimit(writeSlotCount(env));
  }

  /**
   * Runs a revision write (the engine's report, its transaction and the read of its answer) in one of
   * `writeSlotCount` slots; the others wait without using the event loop or a connection. A burst of saves so
   * keeps most of the pool and of the event loop free for every other request.
   */
  inWriteSlot<T>(write: () => Promise<T>): Promise<T> {
    return this.writeSlots(write);
  }

  /**
   * The engine's report for `document`, computed with the ratings of `projectId`'s Parts shelf for the part
   * codes the document references. A code the shelf does not hold is a warning in `report.partIssues`, not a
   * refusal: templates and imported designs carry codes of other shelves, and a lead may retire a part that
   * older designs still name. Called before the write's transaction opens, so that a transaction never waits
   * for a second pooled connection (the shelf read) nor holds its own through the engine's work.
   */
  async evaluate(projectId: string, document: Design): Promise<EvaluateResponse> {
    const shelf = await this.parts.shelf(projectId);
    return this.analysis.evaluate(document, 'document', shelf);
  }

  /** Inserts one revision with its report from `evaluate`. The caller holds the design row lock. */
  async write(revision: NewRevision, evaluated: EvaluateResponse, transaction: Transaction): Promise<RevisionModel> {
    const { engineVersion, report } = evaluated;
    return this.revisions.create({ ...revision, engineVersion, report }, { transaction });
  }

  async list(projectId: string, designId: string): Promise<RevisionSummary[]> {
    const design = await this.lookup.findDesign(projectId, designId);
    return this.listOf(design.id);
  }

  async listOf(designId: string): Promise<RevisionSummary[]> {
    const rows = await this.revisions.findAll({
      where: { designId },
      attributes: { exclude: ['document', 'report'] },
      include: [UserModel],
      order: [['number', 'DESC']],
    });
    return rows.map(toRevisionSummary);
  }

  async get(ref: RevisionRef): Promise<RevisionDetail> {
    const { revision } = await this.lookup.find(ref);
    return toRevisionDetail(revision, ref.projectId);
  }

  /**
   * `get` as the UTF-8 bytes of its JSON text. The summary is read in one query; the stored document and report
   * come as PostgreSQL prints them (never parsed here) from `RevisionContentCache`, read by a second query the
   * first time this instance serves the revision. When the row is not there, `lookup.find` answers the 404
   * naming the field, as `get` does.
   */
  async getJsonBytes(ref: RevisionRef): Promise<Buffer> {
    const rows = await this.sequelize.query<RevisionDetailHeadRow>(
      `SELECT r.id, r.number, r.state, r.author_id AS "authorId", u.display_name AS "authorName",
              r.created_at AS "createdAt", r.change_note AS "changeNote",
              r.base_revision_number AS "baseRevisionNumber", r.engine_version AS "engineVersion",
              r.design_id AS "designId"
         FROM designs d
         JOIN revisions r ON r.design_id = d.id AND r.number = :revisionNumber
         JOIN users u ON u.id = r.author_id
        WHERE d.id = :designId AND d.project_id = :projectId`,
      { replacements: { ...ref }, type: QueryTypes.SELECT },
    );
    const row = rows[0];
    if (!row) return Buffer.from(JSON.stringify(toRevisionDetailBody(await this.get(ref))), 'utf8');
    return revisionDetailBytes(row, ref.projectId, await this.contentTail(row.id, ref.revisionNumber));
  }

  private async contentTail(revisionId: string, revisionNumber: number): Promise<Buffer> {
    const cached = this.contents.get(revisionId);
    if (cached) return cached;
    const [content] = await this.sequelize.query<{ document: string; report: string }>(
      'SELECT document::text AS document, report::text AS report FROM revisions WHERE id = :revisionId',
      { replacements: { revisionId }, type: QueryTypes.SELECT },
    );
    if (!content) throw revisionNotFound('revisionNumber', String(revisionNumber));
    const tail = revisionContentTail(content.document, content.report);
    this.contents.set(revisionId, tail);
    return tail;
  }

  /**
   * Saves the document as revision latest+1. Refuses with 409 stale_base (and writes nothing) when the
   * base is not the latest revision, listing the fields changed since the base. The design row is locked
   * for the numbering, so two concurrent saves on the same base cannot both succeed.
   */
  async save(input: {
    projectId: string;
    designId: string;
    request: SaveRevisionRequest;
    authorId: string;
  }): Promise<RevisionDetail> {
    const { projectId, designId, request, authorId } = input;
    const document = this.analysis.parseDocument(request.document, 'document');
    return this.inWriteSlot(async () => {
      const evaluated = await this.evaluate(projectId, document);
      const number = await this.sequelize.transaction(async (transaction) => {
        const design = await this.lookup.findDesign(projectId, designId, transaction);
        const latest = design.latestRevisionNumber;
        if (request.baseRevisionNumber > latest) {
          throw new DomainError(
            'invalid_argument',
            `baseRevisionNumber ${request.baseRevisionNumber} does not exist; the latest revision is ${latest}`,
            'baseRevisionNumber',
          );
        }
        if (request.baseRevisionNumber !== latest) {
          const [base, newest] = await Promise.all([
            this.load(design.id, request.baseRevisionNumber, 'baseRevisionNumber', transaction),
            this.load(design.id, latest, 'baseRevisionNumber', transaction),
          ]);
          throw new StaleBaseException(
            latest,
            differences(base.document, newest.document).map((difference) => difference.path),
          );
        }
        await this.write(
          {
            designId: design.id,
            number: latest + 1,
            document,
            authorId,
            changeNote: request.changeNote.trim(),
            baseRevisionNumber: request.baseRevisionNumber,
          },
          evaluated,
          transaction,
        );
        await design.update({ latestRevisionNumber: latest + 1 }, { transaction });
        return latest + 1;
      });
      return this.get({ projectId, designId, revisionNumber: number });
    });
  }

  /**
   * Inputs that differ, every headline result with b − a, the capacitors that change place in the ladder and both
   * sides' Checks: revision a of `designId` beside revision b of the same design or of `bDesignId` (same project).
   */
  async compare(
    projectId: string,
    designId: string,
    a: number,
    b: number,
    bDesignId?: string,
  ): Promise<RevisionComparison> {
    const designA = await this.lookup.findDesign(projectId, designId);
    const designB = bDesignId && bDesignId !== designId ? await this.lookup.findDesign(projectId, bDesignId) : designA;
    const [revisionA, revisionB] = await Promise.all([this.load(designA.id, a, 'a'), this.load(designB.id, b, 'b')]);
    const ladder = (document: Design) => ({
      topology: document.multiplier.topology,
      capacitorCount: document.multiplier.capacitors.length,
    });
    return {
      a: toRevisionSummary(revisionA),
      b: toRevisionSummary(revisionB),
      designs: { a: { id: designA.id, name: designA.name }, b: { id: designB.id, name: designB.name } },
      inputs: differences(revisionA.document, revisionB.document),
      results: this.analysis.compareFigures(revisionA.report, revisionB.report),
      roleChanges: capacitorRoleChanges(ladder(revisionA.document), ladder(revisionB.document)),
      checks: packCheckLists(revisionA.report.checks, revisionB.report.checks),
    };
  }

  async exportFile(ref: RevisionRef, now: Date): Promise<DownloadFile> {
    const { design, revision } = await this.lookup.find(ref);
    const file: DesignExport = {
      format: 'ladderwright-design',
      formatVersion: 1,
      exportedAt: now.toISOString(),
      engineVersion: revision.engineVersion,
      design: revision.document,
    };
    return {
      fileName: `${fileStem(design.name)}-r${revision.number}.ladderwright.json`,
      body: `${JSON.stringify(file, null, 2)}\n`,
    };
  }

  /**
   * The revision's circuit as a SPICE netlist, from the simulator's own export. A driver-stage design is
   * exported with the secondary the engine resolves from its driver (the pulse estimate the report uses).
   */
  async netlist(ref: RevisionRef): Promise<DownloadFile> {
    const { design, revision } = await this.lookup.find(ref);
    const circuit = buildCircuit(this.analysis.withResolvedDrive(revision.document));
    const title = `${design.name}, revision ${revision.number}`.replace(/[\r\n]+/g, ' ');
    return {
      fileName: `${fileStem(design.name)}-r${revision.number}.cir`,
      body: toSpiceNetlist({ ...circuit, title }),
    };
  }

  /** A revision named in a request body or query (a base, a side of a comparison): 404 naming `field`. */
  private async load(
    designId: string,
    number: number,
    field: string,
    transaction?: Transaction,
  ): Promise<RevisionModel> {
    const revision = await this.lookup.findIn(designId, number, transaction);
    if (!revision) throw new DomainError('not_found', `Revision ${number} not found`, field);
    return revision;
  }
}
