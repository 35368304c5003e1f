import { Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { UserModel } from '../users/user.model';
import { BenchRunModel } from './bench-run.model';

export interface BenchRunEventAttrs {
  id: string;
  benchRunId: string;
  action: 'uploaded' | 'deleted';
  actorId: string;
  detail: Record<string, unknown>;
  createdAt: Date;
  updatedAt: Date;
}

export type BenchRunEventCreationAttrs = Pick<BenchRunEventAttrs, 'benchRunId' | 'action' | 'actorId' | 'detail'>;

/** Audit trail of bench runs: who uploaded or deleted what, and when (created_at). Rows are only added. */
@Table({ tableName: 'bench_run_events', underscored: true, timestamps: true })
export class BenchRunEventModel extends Model<BenchRunEventAttrs, BenchRunEventCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => BenchRunModel)
  @Column({ type: DataType.UUID, allowNull: false })
  benchRunId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  action!: 'uploaded' | 'deleted';

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: false })
  actorId!: string;

  @Column({ type: DataType.JSONB, allowNull: false })
  detail!: Record<string, unknown>;

  override createdAt!: Date;
  override updatedAt!: Date;
}
