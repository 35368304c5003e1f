import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';

export interface RevisionReviewerAttrs {
  revisionId: string;
  userId: string;
  createdAt: Date;
  updatedAt: Date;
}

export type RevisionReviewerCreationAttrs = Pick<RevisionReviewerAttrs, 'revisionId' | 'userId'>;

/** A member a revision is submitted to. Replaced as a set on each submit. */
@Table({ tableName: 'revision_reviewers', underscored: true, timestamps: true })
export class RevisionReviewerModel extends Model<RevisionReviewerAttrs, RevisionReviewerCreationAttrs> {
  @ForeignKey(() => RevisionModel)
  @Column({ type: DataType.UUID, primaryKey: true })
  revisionId!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, primaryKey: true })
  userId!: string;

  @BelongsTo(() => RevisionModel, { onDelete: 'CASCADE' })
  revision?: RevisionModel;

  @BelongsTo(() => UserModel)
  user?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
