import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { ProjectRole } from '@ladderwright/shared/auth';
import { ProjectModel } from './project.model';
import { UserModel } from '../users/user.model';

export interface ProjectMemberAttrs {
  projectId: string;
  userId: string;
  role: ProjectRole;
  createdAt: Date;
  updatedAt: Date;
}

export type ProjectMemberCreationAttrs = Pick<ProjectMemberAttrs, 'projectId' | 'userId' | 'role'>;

@Table({ tableName: 'project_members', underscored: true, timestamps: true })
export class ProjectMemberModel extends Model<ProjectMemberAttrs, ProjectMemberCreationAttrs> {
  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, primaryKey: true })
  projectId!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, primaryKey: true })
  userId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  role!: ProjectRole;

  @BelongsTo(() => ProjectModel, { onDelete: 'CASCADE' })
  project?: ProjectModel;

  @BelongsTo(() => UserModel, { onDelete: 'CASCADE' })
  user?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
