import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { DesignReportBody } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import type { RevisionState } from '@ladderwright/shared/reviews';
import { DesignModel } from '../designs/design.model';
import { UserModel } from '../users/user.model';

export interface RevisionAttrs {
  id: string;
  designId: string;
  number: number;
  state: RevisionState;
  document: Design;
  report: DesignReportBody;
  engineVersion: string;
  authorId: string;
  changeNote: string;
  baseRevisionNumber: number | null;
  createdAt: Date;
  updatedAt: Date;
}

export type RevisionCreationAttrs = Pick<
  RevisionAttrs,
  'designId' | 'number' | 'document' | 'report' | 'engineVersion' | 'authorId' | 'changeNote' | 'baseRevisionNumber'
> &
  Partial<Pick<RevisionAttrs, 'id' | 'state'>>;

/**
 * One saved revision of a design. `document`, `report` and the provenance columns are written once;
 * the service has no update path for them and a database trigger refuses one. Only `state` moves.
 */
@Table({ tableName: 'revisions', underscored: true, timestamps: true })
export class RevisionModel extends Model<RevisionAttrs, RevisionCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => DesignModel)
  @Column({ type: DataType.UUID, allowNull: false })
  designId!: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  number!: number;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: 'draft' })
  state!: RevisionState;

  @Column({ type: DataType.JSONB, allowNull: false })
  document!: Design;

  @Column({ type: DataType.JSONB, allowNull: false })
  report!: DesignReportBody;

  @Column({ type: DataType.TEXT, allowNull: false })
  engineVersion!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: false })
  authorId!: string;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  changeNote!: string;

  @Column({ type: DataType.INTEGER, allowNull: true })
  baseRevisionNumber!: number | null;

  @BelongsTo(() => DesignModel, { onDelete: 'CASCADE' })
  design?: DesignModel;

  @BelongsTo(() => UserModel)
  author?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
