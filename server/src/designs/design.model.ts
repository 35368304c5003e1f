import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import { ProjectModel } from '../projects/project.model';
import { UserModel } from '../users/user.model';

export interface DesignAttrs {
  id: string;
  projectId: string;
  name: string;
  ownerId: string;
  /** 0 only inside the transaction that creates the design and its revision 1. */
  latestRevisionNumber: number;
  createdAt: Date;
  updatedAt: Date;
}

export type DesignCreationAttrs = Pick<DesignAttrs, 'projectId' | 'name' | 'ownerId'> &
  Partial<Pick<DesignAttrs, 'id' | 'latestRevisionNumber'>>;

@Table({ tableName: 'designs', underscored: true, timestamps: true })
export class DesignModel extends Model<DesignAttrs, DesignCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  name!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: false })
  ownerId!: string;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  latestRevisionNumber!: number;

  @BelongsTo(() => ProjectModel, { onDelete: 'CASCADE' })
  project?: ProjectModel;

  @BelongsTo(() => UserModel)
  owner?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
