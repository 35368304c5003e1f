import { Column, DataType, Model, Table } from 'sequelize-typescript';

export interface PasswordResetLinkAttrs {
  id: string;
  userId: string;
  /** SHA-256 of the token; the token itself is never stored. */
  tokenHash: string;
  expiresAt: Date;
  usedAt: Date | null;
  createdBy: string | null;
  createdAt: Date;
}

export type PasswordResetLinkCreationAttrs = Pick<
  PasswordResetLinkAttrs,
  'userId' | 'tokenHash' | 'expiresAt' | 'createdBy'
>;

/** A one-time password-reset link an admin issued; good once, until it expires or a newer one is issued. */
@Table({ tableName: 'password_reset_links', underscored: true, timestamps: true, updatedAt: false })
export class PasswordResetLinkModel extends Model<PasswordResetLinkAttrs, PasswordResetLinkCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.UUID, allowNull: false })
  userId!: string;

  @Column({ type: DataType.TEXT, allowNull: false, unique: true })
  tokenHash!: string;

  @Column({ type: DataType.DATE, allowNull: false })
  expiresAt!: Date;

  @Column({ type: DataType.DATE, allowNull: true })
  usedAt!: Date | null;

  @Column({ type: DataType.UUID, allowNull: true })
  createdBy!: string | null;

  override createdAt!: Date;
}
