import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { Op, type WhereOptions } from 'sequelize';
import type { Part, PartInput, PartListQuery } from '@ladderwright/shared/api';
import { DomainError } from '@ladderwright/shared/errors';
import { magneticsOf, normalizePart, type ShelfPart } from '@ladderwright/shared/parts';
import { isUuid } from '../common/uuid';
import { PartModel, type PartAttrs } from './part.model';

export function toPart(model: PartModel): Part {
  return {
    id: model.id,
    projectId: model.projectId,
    code: model.code,
    kind: model.kind,
    description: model.description,
    valueSi: model.valueSi,
    tolerance: model.tolerance,
    ratedVoltageV: model.ratedVoltageV,
    ratedCurrentA: model.ratedCurrentA,
    ratedSurgeCurrentA: model.ratedSurgeCurrentA,
    ratedPowerW: model.ratedPowerW,
    unitCost: model.unitCost,
    sizeMm: model.sizeMm,
    ...magneticsOf(model),
    createdAt: model.createdAt.toISOString(),
    updatedAt: model.updatedAt.toISOString(),
  };
}

function requireObject(body: unknown): Record<string, unknown> {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw new DomainError('invalid_argument', 'The request body must be a JSON object with the part fields', 'body');
  }
  return body as Record<string, unknown>;
}

function validated(raw: Record<string, unknown>, options: Parameters<typeof normalizePart>[1] = {}): PartInput {
  const { part, issues } = normalizePart(raw, options);
  const first = issues[0];
  if (!part || first) {
    throw new DomainError('invalid_argument', first?.message ?? 'Invalid part', first?.path ?? null, issues);
  }
  return part;
}

/** The Parts shelf of one project: list with filters, create, edit, remove; the shelf as the engine reads it. */
@Injectable()
export class PartsService {
  constructor(@InjectModel(PartModel) private readonly parts: typeof PartModel) {}

  async list(projectId: string, query: PartListQuery = {}): Promise<Part[]> {
    const where: WhereOptions<PartAttrs> = { projectId };
    const and: WhereOptions<PartAttrs>[] = [where];
    if (query.kind) and.push({ kind: query.kind });
    if (query.q) {
      const pattern = `%${query.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      and.push({ [Op.or]: [{ code: { [Op.iLike]: pattern } }, { description: { [Op.iLike]: pattern } }] });
    }
    if (query.minVoltageV !== undefined) and.push({ ratedVoltageV: { [Op.gte]: query.minVoltageV } });
    const rows = await this.parts.findAll({
      where: { [Op.and]: and },
      order: [
        ['kind', 'ASC'],
        ['code', 'ASC'],
      ],
    });
    return rows.map(toPart);
  }

  /** The shelf as plain ratings for `fillPartRatings`, `bomCost` and `shelfForSizer`. */
  async shelf(projectId: string): Promise<ShelfPart[]> {
    return this.list(projectId);
  }

  async create(projectId: string, body: unknown): Promise<Part> {
    const part = validated(requireObject(body));
    const existing = await this.parts.findOne({ where: { projectId, code: part.code }, attributes: ['id'] });
    if (existing) throw new DomainError('invalid_argument', `code ${part.code} is already on this shelf`, 'code');
    return toPart(await this.parts.create({ projectId, ...part }));
  }

  async update(projectId: string, partId: string, body: unknown): Promise<Part> {
    const model = await this.find(projectId, partId);
    const part = validated(requireObject(body), { partial: true, base: toPart(model) });
    await model.update(part);
    return toPart(model);
  }

  async remove(projectId: string, partId: string): Promise<void> {
    const model = await this.find(projectId, partId);
    await model.destroy();
  }

  private async find(projectId: string, partId: string): Promise<PartModel> {
    const model = isUuid(partId) ? await this.parts.findOne({ where: { projectId, id: partId } }) : null;
    if (!model) throw new DomainError('not_found', 'Part not found on this shelf', 'partId');
    return model;
  }
}
