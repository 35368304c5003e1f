import { Injectable } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type { Transaction } from 'sequelize';
import { AuditEntryModel } from './audit-entry.model';
import type { AuditAction, AuditEntry, AuditRecord } from './audit.types';

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

  /** Newest first. */
  async list(query: { action?: AuditAction; limit?: number }): Promise<AuditEntry[]> {
    const rows = await this.entries.findAll({
      where: query.action ? { action: query.action } : {},
      order: [
        ['occurredAt', 'DESC'],
        ['id', 'ASC'],
      ],
      limit: query.limit ?? 100,
    });
    return rows.map(toEntry);
  }
}
