import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { AuditAction, AuditEntry } from './audit.types';

/** The stored row: the response shape with a Date for the time. */
export type AuditEntryAttrs = Omit<AuditEntry, 'occurredAt'> & { occurredAt: Date };

export type AuditEntryCreationAttrs = Omit<AuditEntryAttrs, 'id' | 'occurredAt'> &
  Partial<Pick<AuditEntryAttrs, 'id' | 'occurredAt'>>;

@Table({ tableName: 'audit_entries', underscored: true, timestamps: false })
export class AuditEntryModel extends Model<AuditEntryAttrs, AuditEntryCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.DATE, allowNull: false, defaultValue: DataType.NOW })
  occurredAt!: Date;

  @Column({ type: DataType.TEXT, allowNull: false })
  action!: AuditAction;

  @Column({ type: DataType.UUID, allowNull: true })
  actorId!: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  actorEmail!: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  subjectType!: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  subjectId!: string | null;

  @Column({ type: DataType.JSONB, allowNull: false, defaultValue: {} })
  detail!: Record<string, unknown>;

  @Column({ type: DataType.TEXT, allowNull: true })
  clientAddress!: string | null;
}
