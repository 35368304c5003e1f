import { Column, DataType, Model, Table } from 'sequelize-typescript';

export interface CapturedMailAttrs {
  id: string;
  envelopeFrom: string;
  recipients: string[];
  subject: string;
  body: string;
  raw: string;
  receivedAt: Date;
}

export type CapturedMailCreationAttrs = Omit<CapturedMailAttrs, 'id' | 'receivedAt'>;

/** A message the local fake SMTP server received: what the Outbox shows. */
@Table({ tableName: 'captured_mails', underscored: true, timestamps: false })
export class CapturedMailModel extends Model<CapturedMailAttrs, CapturedMailCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  envelopeFrom!: string;

  @Column({ type: DataType.ARRAY(DataType.TEXT), allowNull: false })
  recipients!: string[];

  @Column({ type: DataType.TEXT, allowNull: false })
  subject!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  body!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  raw!: string;

  @Column({ type: DataType.DATE, allowNull: false, defaultValue: DataType.NOW })
  receivedAt!: Date;
}
