import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import Papa from 'papaparse';
import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { AuditPage } from '@ladderwright/shared/api';
import { csvCellNeedsQuotes, neutraliseCsvCell } from '@ladderwright/shared/parts';
import { isUuid } from '../common/uuid';
import { AuditEntryModel } from './audit-entry.model';
import type { AuditEntry, AuditRecord } from './audit.types';
import type { ListAuditEntriesDto } from './dto/list-audit-entries.dto';

/** The most rows one CSV export carries (a year of a busy team's entries). */
export const AUDIT_EXPORT_MAX = 100_000;

function whereOf(query: ListAuditEntriesDto): WhereOptions<AuditEntryModel> {
  const conditions: WhereOptions<AuditEntryModel>[] = [];
  if (query.action) conditions.push({ action: query.action });
  const actor = query.actor?.trim();
  if (actor) {
    conditions.push(
      isUuid(actor) ? { actorId: actor } : { actorEmail: { [Op.iLike]: `%${actor.replace(/[\\%_]/g, '\\$&')}%` } },
    );
  }
  if (query.from) conditions.push({ occurredAt: { [Op.gte]: new Date(query.from) } });
  if (query.to) conditions.push({ occurredAt: { [Op.lt]: new Date(query.to) } });
  return { [Op.and]: conditions };
}

function toEntry(row: AuditEntryModel): AuditEntry {
  return {
    id: row.id,
    occurredAt: row.occurredAt.toISOString(),
    action: row.action,
    actorId: row.actorId,
    actorEmail: row.actorEmail,
    subjectType: row.subjectType,
    subjectId: row.subjectId,
    detail: row.detail,
    clientAddress: row.clientAddress,
  };
}

/**
 * The append-only audit log. Other modules inject it (AuditModule is global) and call `record`, inside
 * their own transaction when they pass one, so the entry commits or rolls back with the change it describes.
 */
@Injectable()
export class AuditService {
  constructor(@InjectModel(AuditEntryModel) private readonly entries: typeof AuditEntryModel) {}

  async record(entry: AuditRecord, transaction?: Transaction): Promise<void> {
    await this.entries.create(
      {
        action: entry.action,
        actorId: entry.actorId,
        actorEmail: entry.actorEmail ?? null,
        subjectType: entry.subjectType ?? null,
        subjectId: entry.subjectId ?? null,
        detail: entry.detail ?? {},
        clientAddress: entry.clientAddress ?? null,
      },
      transaction ? { transaction } : {},
    );
  }

  /** One page of entries matching the filters, newest first. */
  async list(query: ListAuditEntriesDto): Promise<AuditPage> {
    const page = query.page ?? 1;
    const pageSize = query.pageSize ?? query.limit ?? 100;
    const { rows, count } = await this.entries.findAndCountAll({
      where: whereOf(query),
      order: [
        ['occurredAt', 'DESC'],
        ['id', 'ASC'],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
    return { items: rows.map(toEntry), total: count, page, pageSize };
  }

  /** Every entry matching the filters (at most AUDIT_EXPORT_MAX), newest first, as RFC 4180 CSV. */
  async exportCsv(query: ListAuditEntriesDto): Promise<string> {
    const rows = await this.entries.findAll({
      where: whereOf(query),
      order: [
        ['occurredAt', 'DESC'],
        ['id', 'ASC'],
      ],
      limit: AUDIT_EXPORT_MAX,
    });
    const entries = rows.map(toEntry);
    return Papa.unparse(
      {
        fields: [
          'occurredAt',
          'action',
          'actorEmail',
          'actorId',
          'subjectType',
          'subjectId',
          'detail',
          'clientAddress',
        ],
        data: entries.map((entry) =>
          [
            entry.occurredAt,
            entry.action,
            entry.actorEmail ?? '',
            entry.actorId ?? '',
            entry.subjectType ?? '',
            entry.subjectId ?? '',
            JSON.stringify(entry.detail),
            entry.clientAddress ?? '',
          ].map(neutraliseCsvCell),
        ),
      },
      { newline: '\r\n', quotes: csvCellNeedsQuotes },
    );
  }
}
