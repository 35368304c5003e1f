import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type { UserRole } from '@ladderwright/shared/auth';

export interface UserAttrs {
  id: string;
  email: string;
  displayName: string;
  role: UserRole;
  passwordHash: string;
  /** Bumped by "sign out everywhere" and password resets; session tokens carry the version they were issued at. */
  sessionVersion: number;
  /** false: deactivated by an admin; the account cannot sign in and its sessions end. */
  isActive: boolean;
  /** Mail kinds (`MailKind`) the user chose not to receive. */
  mailOptOuts: string[];
  createdAt: Date;
  updatedAt: Date;
}

export type UserCreationAttrs = Pick<UserAttrs, 'email' | 'displayName' | 'role' | 'passwordHash'> &
  Partial<Pick<UserAttrs, 'id'>>;

@Table({ tableName: 'users', underscored: true, timestamps: true })
export class UserModel extends Model<UserAttrs, UserCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.TEXT, allowNull: false, unique: true })
  email!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  displayName!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  role!: UserRole;

  @Column({ type: DataType.TEXT, allowNull: false })
  passwordHash!: string;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  sessionVersion!: number;

  @Column({ type: DataType.BOOLEAN, allowNull: false, defaultValue: true })
  isActive!: boolean;

  @Column({ type: DataType.JSONB, allowNull: false, defaultValue: [] })
  mailOptOuts!: string[];

  override createdAt!: Date;
  override updatedAt!: Date;
}
