import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { PartKind } from '@ladderwright/shared/api';
import { ProjectModel } from '../projects/project.model';

export interface PartAttrs {
  id: string;
  projectId: string;
  code: string;
  kind: PartKind;
  description: string;
  valueSi: number | null;
  tolerance: number | null;
  ratedVoltageV: number | null;
  ratedCurrentA: number | null;
  ratedSurgeCurrentA: number | null;
  ratedPowerW: number | null;
  unitCost: number;
  sizeMm: string;
  createdAt: Date;
  updatedAt: Date;
}

export type PartCreationAttrs = Omit<PartAttrs, 'id' | 'createdAt' | 'updatedAt'>;

const rating = { type: DataType.DOUBLE, allowNull: true };

@Table({ tableName: 'parts', underscored: true, timestamps: true })
export class PartModel extends Model<PartAttrs, PartCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  code!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  kind!: PartKind;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  description!: string;

  @Column(rating)
  valueSi!: number | null;

  @Column(rating)
  tolerance!: number | null;

  @Column(rating)
  ratedVoltageV!: number | null;

  @Column(rating)
  ratedCurrentA!: number | null;

  @Column(rating)
  ratedSurgeCurrentA!: number | null;

  @Column(rating)
  ratedPowerW!: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  unitCost!: number;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  sizeMm!: string;

  @BelongsTo(() => ProjectModel, { onDelete: 'CASCADE' })
  project?: ProjectModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
