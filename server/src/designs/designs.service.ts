import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { CreateDesignRequest, DesignDetail, DesignPage, DesignSummary } from '@ladderwright/shared/api';
import { withoutRetiredFields, type Design } from '@ladderwright/shared/designs';
import { DomainError } from '@ladderwright/shared/errors';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { AnalysisService } from '../analysis/analysis.service';
import { blankDocument } from '../analysis/design-templates';
import { ProjectsService } from '../projects/projects.service';
import { RevisionLookupService } from '../revisions/revision-lookup.service';
import { RevisionsService } from '../revisions/revisions.service';
import { DesignModel } from './design.model';
import type { ListDesignsDto } from './dto/list-designs.dto';
import { designSourceDocument } from './design-source';

interface SummaryRow {
  id: string;
  project_id: string;
  name: string;
  owner_id: string;
  owner_name: string;
  latest_revision_number: number;
  latest_state: RevisionState;
  updated_at: Date;
  total: string;
}

const SORT_COLUMNS = { name: 'lower(d.name)', updatedAt: 'updated_at', state: 'r.state' } as const;

const SUMMARY_SELECT = `
  SELECT d.id, d.project_id, d.name, d.owner_id, u.display_name AS owner_name, d.latest_revision_number,
         r.state AS latest_state, greatest(d.updated_at, r.updated_at) AS updated_at, count(*) OVER () AS total
  FROM designs d
  JOIN users u ON u.id = d.owner_id
  JOIN revisions r ON r.design_id = d.id AND r.number = d.latest_revision_number`;

function toSummary(row: SummaryRow): DesignSummary {
  return {
    id: row.id,
    projectId: row.project_id,
    name: row.name,
    ownerId: row.owner_id,
    ownerName: row.owner_name,
    latestRevisionNumber: row.latest_revision_number,
    latestState: row.latest_state,
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (character) => `\\${character}`)}%`;
}

@Injectable()
export class DesignsService {
  constructor(
    @InjectModel(DesignModel) private readonly designs: typeof DesignModel,
    private readonly revisions: RevisionsService,
    private readonly lookup: RevisionLookupService,
    private readonly projects: ProjectsService,
    private readonly analysis: AnalysisService,
    private readonly sequelize: Sequelize,
  ) {}

  /** One page of a project's designs with the latest revision's number and state. */
  async list(projectId: string, query: ListDesignsDto): Promise<DesignPage> {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? 20;
    const sort = query.sort ?? 'updatedAt';
    const order = (query.order ?? (sort === 'updatedAt' ? 'desc' : 'asc')) === 'asc' ? 'ASC' : 'DESC';
    const conditions = ['d.project_id = :projectId'];
    const replacements: Record<string, unknown> = { projectId, limit: pageSize, offset: (page - 1) * pageSize };
    if (query.q?.trim()) {
      conditions.push("d.name ILIKE :q ESCAPE '\\'");
      replacements.q = likePattern(query.q.trim());
    }
    if (query.state) {
      conditions.push('r.state = :state');
      replacements.state = query.state;
    }
    if (query.ownerId) {
      conditions.push('d.owner_id = :ownerId');
      replacements.ownerId = query.ownerId;
    }
    const rows = await this.sequelize.query<SummaryRow>(
      `${SUMMARY_SELECT} WHERE ${conditions.join(' AND ')}
       ORDER BY ${SORT_COLUMNS[sort]} ${order}, d.id ASC LIMIT :limit OFFSET :offset`,
      { replacements, type: QueryTypes.SELECT },
    );
    const total = rows[0] ? Number(rows[0].total) : await this.countOnly(conditions, replacements);
    return { items: rows.map(toSummary), total, page, pageSize };
  }

  async detail(projectId: string, designId: string): Promise<DesignDetail> {
    const design = await this.lookup.findDesign(projectId, designId);
    const [row] = await this.sequelize.query<SummaryRow>(`${SUMMARY_SELECT} WHERE d.id = :id`, {
      replacements: { id: design.id },
      type: QueryTypes.SELECT,
    });
    if (!row) throw new DomainError('not_found', 'Design not found', 'designId');
    return {
      ...toSummary(row),
      createdAt: design.createdAt.toISOString(),
      revisions: await this.revisions.listOf(design.id),
    };
  }

  /** Creates the design and its revision 1 (draft) from a blank, a template, another design or a document. */
  async create(projectId: string, request: CreateDesignRequest, ownerId: string): Promise<DesignDetail> {
    const name = request.name.trim();
    if (!name) throw new DomainError('invalid_argument', 'name must not be empty', 'name');
    const defaultTargets =
      request.from.kind === 'blank' ? (await this.projects.settings(projectId)).defaultTargets : {};
    const source = await designSourceDocument(request.from, {
      blank: () => {
        const blank = blankDocument(name);
        return { ...blank, targets: { ...blank.targets, ...defaultTargets } };
      },
      template: (id) => this.analysis.template(id)?.document ?? null,
      revision: async (designId, revisionNumber) => {
        const design = await this.lookup.findDesign(projectId, designId).catch((error: unknown) => {
          throw error instanceof DomainError
            ? new DomainError('not_found', 'Design not found', 'from.designId')
            : error;
        });
        const number = revisionNumber ?? design.latestRevisionNumber;
        const revision = await this.revisions
          .get({ projectId, designId: design.id, revisionNumber: number })
          .catch((error: unknown) => {
            throw error instanceof DomainError
              ? new DomainError('not_found', `Revision ${number} not found`, 'from.revisionNumber')
              : error;
          });
        return revision.document;
      },
      parse: (document) => this.analysis.parseDocument(document, 'from.document'),
    });
    return this.createWithFirstRevision(projectId, { ...source, name }, ownerId, 'Created');
  }

  /** Imports an export file (ImportDesignRequest) or a bare document as a new design named after the document. */
  async import(projectId: string, body: unknown, ownerId: string): Promise<DesignDetail> {
    const document = this.parseImport(body);
    const name = document.name.trim() || 'Imported design';
    return this.createWithFirstRevision(projectId, document, ownerId, 'Imported', name);
  }

  private parseImport(body: unknown): Design {
    const isObject = typeof body === 'object' && body !== null && !Array.isArray(body);
    if (!isObject)
      throw new DomainError(
        'invalid_design',
        'the import must be a design export file or a design document',
        '(document)',
      );
    const file = body as Record<string, unknown>;
    if (!('format' in file)) return this.analysis.parseDocument(withoutRetiredFields(file), '');
    if (file.format !== 'ladderwright-design') {
      throw new DomainError('invalid_argument', "format must be 'ladderwright-design'", 'format');
    }
    if (file.formatVersion !== 1) {
      throw new DomainError('unsupported_version', 'formatVersion must be 1', 'formatVersion');
    }
    return this.analysis.parseDocument(withoutRetiredFields(file.design), 'design');
  }

  private async createWithFirstRevision(
    projectId: string,
    document: Design,
    ownerId: string,
    changeNote: string,
    name = document.name,
  ): Promise<DesignDetail> {
    return this.revisions.inWriteSlot(async () => {
      const evaluated = await this.revisions.evaluate(projectId, document);
      const designId = await this.sequelize.transaction(async (transaction) => {
        const design = await this.designs.create(
          { projectId, name, ownerId, latestRevisionNumber: 1 },
          { transaction },
        );
        await this.revisions.write(
          { designId: design.id, number: 1, document, authorId: ownerId, changeNote, baseRevisionNumber: null },
          evaluated,
          transaction,
        );
        return design.id;
      });
      return this.detail(projectId, designId);
    });
  }

  private async countOnly(conditions: string[], replacements: Record<string, unknown>): Promise<number> {
    const [row] = await this.sequelize.query<{ total: string }>(
      `SELECT count(*) AS total FROM designs d
       JOIN revisions r ON r.design_id = d.id AND r.number = d.latest_revision_number
       WHERE ${conditions.join(' AND ')}`,
      { replacements, type: QueryTypes.SELECT },
    );
    return Number(row?.total ?? 0);
  }
}
