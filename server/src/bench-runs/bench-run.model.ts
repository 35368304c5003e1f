import { BelongsTo, Column, DataType, ForeignKey, HasMany, Model, Table } from 'sequelize-typescript';
import type { BenchComparison, BenchKind, BenchVerdict, MeasuredPoint } from '@ladderwright/shared/bench';
import { DesignModel } from '../designs/design.model';
import { ProjectModel } from '../projects/project.model';
import { UserModel } from '../users/user.model';
import { BenchRunFileModel } from './bench-run-file.model';

export interface BenchRunAttrs {
  id: string;
  projectId: string;
  designId: string;
  revisionNumber: number;
  kind: BenchKind;
  title: string;
  tolerance: number;
  points: MeasuredPoint[];
  metadata: string[];
  comparison: BenchComparison;
  verdict: BenchVerdict;
  marginPct: number;
  worstDeviation: number;
  uploadedBy: string;
  deletedAt: Date | null;
  deletedBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export type BenchRunCreationAttrs = Omit<BenchRunAttrs, 'id' | 'deletedAt' | 'deletedBy' | 'createdAt' | 'updatedAt'>;

/** Measured data for one revision with its comparison. Written once; a delete only sets deletedAt/deletedBy. */
@Table({ tableName: 'bench_runs', underscored: true, timestamps: true })
export class BenchRunModel extends Model<BenchRunAttrs, BenchRunCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @ForeignKey(() => DesignModel)
  @Column({ type: DataType.UUID, allowNull: false })
  designId!: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  revisionNumber!: number;

  @Column({ type: DataType.TEXT, allowNull: false })
  kind!: BenchKind;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  title!: string;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  tolerance!: number;

  @Column({ type: DataType.JSONB, allowNull: false })
  points!: MeasuredPoint[];

  @Column({ type: DataType.JSONB, allowNull: false })
  metadata!: string[];

  @Column({ type: DataType.JSONB, allowNull: false })
  comparison!: BenchComparison;

  @Column({ type: DataType.TEXT, allowNull: false })
  verdict!: BenchVerdict;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  marginPct!: number;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  worstDeviation!: number;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: false })
  uploadedBy!: string;

  @Column({ type: DataType.DATE, allowNull: true })
  override deletedAt!: Date | null;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  deletedBy!: string | null;

  @BelongsTo(() => UserModel, 'uploadedBy')
  uploader?: UserModel;

  @HasMany(() => BenchRunFileModel)
  files?: BenchRunFileModel[];

  override createdAt!: Date;
  override updatedAt!: Date;
}
