import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { GateReason, RevisionCommand, RevisionState } from '@ladderwright/shared/reviews';
import { UserModel } from '../users/user.model';

export interface RevisionTransitionAttrs {
  id: string;
  revisionId: string;
  command: RevisionCommand;
  fromState: RevisionState;
  toState: RevisionState;
  actorId: string | null;
  note: string;
  /** Set when the actor went past closed gates: their reason and the gate reasons then in force. */
  overrideReason: string | null;
  overridden: GateReason[] | null;
  createdAt: Date;
}

export type RevisionTransitionCreationAttrs = Omit<
  RevisionTransitionAttrs,
  'id' | 'createdAt' | 'overrideReason' | 'overridden'
> &
  Partial<Pick<RevisionTransitionAttrs, 'overrideReason' | 'overridden'>>;

/** One audit entry of the Sign-off (append-only: a trigger refuses UPDATE). */
@Table({ tableName: 'revision_transitions', underscored: true, timestamps: true, updatedAt: false })
export class RevisionTransitionModel extends Model<RevisionTransitionAttrs, RevisionTransitionCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

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

  @Column({ type: DataType.TEXT, allowNull: true })
  overrideReason!: string | null;

  @Column({ type: DataType.JSONB, allowNull: true })
  overridden!: GateReason[] | null;

  @BelongsTo(() => UserModel)
  actor?: UserModel;

  override createdAt!: Date;
}
