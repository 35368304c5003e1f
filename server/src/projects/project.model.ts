import { Column, DataType, HasMany, Model, Table } from 'sequelize-typescript';
import { ProjectMemberModel } from './project-member.model';

export interface ProjectAttrs {
  id: string;
  name: string;
  productLine: string;
  description: string;
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

  @HasMany(() => ProjectMemberModel)
  members?: ProjectMemberModel[];

  override createdAt!: Date;
  override updatedAt!: Date;
}
