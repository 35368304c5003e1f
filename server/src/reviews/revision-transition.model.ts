import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { RevisionCommand, RevisionState } from '@ladderwright/shared/reviews';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';

export interface RevisionTransitionAttrs {
  id: string;
  revisionId: string;
  command: RevisionCommand;
  fromState: RevisionState;
  toState: RevisionState;
  actorId: string | null;
  note: string;
  createdAt: Date;
}

export type RevisionTransitionCreationAttrs = Omit<RevisionTransitionAttrs, 'id' | 'createdAt'>;

/** One audit entry of the Sign-off (append-only: a trigger refuses UPDATE). */
@Table({ tableName: 'revision_transitions', underscored: true, timestamps: true, updatedAt: false })
export class RevisionTransitionModel extends Model<RevisionTransitionAttrs, RevisionTransitionCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => RevisionModel)
  @Column({ type: DataType.UUID, allowNull: false })
  revisionId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  command!: RevisionCommand;

  @Column({ type: DataType.TEXT, allowNull: false })
  fromState!: RevisionState;

  @Column({ type: DataType.TEXT, allowNull: false })
  toState!: RevisionState;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  actorId!: string | null;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  note!: string;

  @BelongsTo(() => RevisionModel, { onDelete: 'CASCADE' })
  revision?: RevisionModel;

  @BelongsTo(() => UserModel)
  actor?: UserModel;

  override createdAt!: Date;
}
