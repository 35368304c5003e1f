import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { MemberRequestState } from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';
import { ProjectModel } from '../projects/project.model';
import { UserModel } from '../users/user.model';

export interface MemberRequestAttrs {
  id: string;
  projectId: string;
  requesterId: string | null;
  email: string;
  role: ProjectRole;
  note: string;
  state: MemberRequestState;
  decidedById: string | null;
  decidedAt: Date | null;
  declineReason: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export type MemberRequestCreationAttrs = Pick<
  MemberRequestAttrs,
  'projectId' | 'requesterId' | 'email' | 'role' | 'note'
>;

@Table({ tableName: 'member_requests', underscored: true, timestamps: true })
export class MemberRequestModel extends Model<MemberRequestAttrs, MemberRequestCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  requesterId!: string | null;

  @Column({ type: DataType.TEXT, allowNull: false })
  email!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  role!: ProjectRole;

  @Column({ type: DataType.TEXT, allowNull: false })
  note!: string;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: 'pending' })
  state!: MemberRequestState;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  decidedById!: string | null;

  @Column({ type: DataType.DATE, allowNull: true })
  decidedAt!: Date | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  declineReason!: string | null;

  @BelongsTo(() => ProjectModel, { onDelete: 'CASCADE' })
  project?: ProjectModel;

  @BelongsTo(() => UserModel, { foreignKey: 'requesterId', as: 'requester' })
  requester?: UserModel;

  @BelongsTo(() => UserModel, { foreignKey: 'decidedById', as: 'decidedBy' })
  decidedBy?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
