import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { ProjectSettings } from '@ladderwright/shared/api';

export interface ProjectAttrs {
  id: string;
  name: string;
  productLine: string;
  description: string;
  /** Set when a lead archived the project: it stays readable and takes no more changes. */
  archivedAt: Date | null;
  settings: Partial<ProjectSettings>;
  createdAt: Date;
  updatedAt: Date;
}

export type ProjectCreationAttrs = Pick<ProjectAttrs, 'name' | 'productLine' | 'description'> &
  Partial<Pick<ProjectAttrs, 'id'>>;

@Table({ tableName: 'projects', underscored: true, timestamps: true })
export class ProjectModel extends Model<ProjectAttrs, ProjectCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  name!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  productLine!: string;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  description!: string;

  @Column({ type: DataType.DATE, allowNull: true })
  archivedAt!: Date | null;

  @Column({ type: DataType.JSONB, allowNull: false, defaultValue: {} })
  settings!: Partial<ProjectSettings>;

  override createdAt!: Date;
  override updatedAt!: Date;
}
