import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { BenchRunModel } from './bench-run.model';

export interface BenchRunFileAttrs {
  id: string;
  benchRunId: string;
  role: 'data' | 'photo';
  originalName: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  storageKey: string;
  createdAt: Date;
  updatedAt: Date;
}

export type BenchRunFileCreationAttrs = Omit<BenchRunFileAttrs, 'id' | 'createdAt' | 'updatedAt'>;

/** One uploaded file of a bench run; the bytes are in the blob store under `storageKey`. */
@Table({ tableName: 'bench_run_files', underscored: true, timestamps: true })
export class BenchRunFileModel extends Model<BenchRunFileAttrs, BenchRunFileCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => BenchRunModel)
  @Column({ type: DataType.UUID, allowNull: false })
  benchRunId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  role!: 'data' | 'photo';

  @Column({ type: DataType.TEXT, allowNull: false })
  originalName!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  contentType!: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  sizeBytes!: number;

  @Column({ type: DataType.TEXT, allowNull: false })
  sha256!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  storageKey!: string;

  @BelongsTo(() => BenchRunModel, { onDelete: 'CASCADE' })
  benchRun?: BenchRunModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
