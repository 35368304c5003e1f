import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { RevisionModel } from '../revisions/revision.model';
import { UserModel } from '../users/user.model';

export interface ReviewCommentAttrs {
  id: string;
  revisionId: string;
  parentId: string | null;
  authorId: string;
  body: string;
  anchorKind: 'input' | 'result' | null;
  anchorPath: string | null;
  resolvedAt: Date | null;
  resolvedById: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export type ReviewCommentCreationAttrs = Pick<
  ReviewCommentAttrs,
  'revisionId' | 'parentId' | 'authorId' | 'body' | 'anchorKind' | 'anchorPath'
>;

/** A comment on a revision: a thread's first comment (optionally anchored) or a reply to it. */
@Table({ tableName: 'review_comments', underscored: true, timestamps: true })
export class ReviewCommentModel extends Model<ReviewCommentAttrs, ReviewCommentCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => RevisionModel)
  @Column({ type: DataType.UUID, allowNull: false })
  revisionId!: string;

  @ForeignKey(() => ReviewCommentModel)
  @Column({ type: DataType.UUID, allowNull: true })
  parentId!: string | null;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: false })
  authorId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  body!: string;

  @Column({ type: DataType.TEXT, allowNull: true })
  anchorKind!: 'input' | 'result' | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  anchorPath!: string | null;

  @Column({ type: DataType.DATE, allowNull: true })
  resolvedAt!: Date | null;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  resolvedById!: string | null;

  @BelongsTo(() => RevisionModel, { onDelete: 'CASCADE' })
  revision?: RevisionModel;

  @BelongsTo(() => UserModel, 'authorId')
  author?: UserModel;

  @BelongsTo(() => UserModel, 'resolvedById')
  resolvedBy?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
