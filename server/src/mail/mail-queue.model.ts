import { Column, DataType, Model, Table } from 'sequelize-typescript';

export type MailStatus = 'pending' | 'sent' | 'failed';

export interface MailQueueAttrs {
  id: string;
  kind: string;
  recipients: string[];
  subject: string;
  body: string;
  status: MailStatus;
  attempts: number;
  nextAttemptAt: Date;
  lastError: string | null;
  sentAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

export type MailQueueCreationAttrs = Pick<MailQueueAttrs, 'kind' | 'recipients' | 'subject' | 'body'>;

/** One notification waiting for (or past) delivery. Written in the transaction of the change it reports. */
@Table({ tableName: 'mail_queue', underscored: true, timestamps: true })
export class MailQueueModel extends Model<MailQueueAttrs, MailQueueCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  kind!: string;

  @Column({ type: DataType.ARRAY(DataType.TEXT), allowNull: false })
  recipients!: string[];

  @Column({ type: DataType.TEXT, allowNull: false })
  subject!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  body!: string;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: 'pending' })
  status!: MailStatus;

  @Column({ type: DataType.INTEGER, allowNull: false, defaultValue: 0 })
  attempts!: number;

  @Column({ type: DataType.DATE, allowNull: false, defaultValue: DataType.NOW })
  nextAttemptAt!: Date;

  @Column({ type: DataType.TEXT, allowNull: true })
  lastError!: string | null;

  @Column({ type: DataType.DATE, allowNull: true })
  sentAt!: Date | null;

  override createdAt!: Date;
  override updatedAt!: Date;
}
