import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { CalibrationDataset, CalibrationResult, ChosenParameter } from '@ladderwright/shared/calibration';
import { DesignModel } from '../designs/design.model';
import { ProjectModel } from '../projects/project.model';
import { SimulationJobModel } from '../simulations/simulation-job.model';
import { UserModel } from '../users/user.model';

/** What a calibration was run with: the checked parameters, the runs' points as fitted, the confidence. */
export interface CalibrationInputRecord {
  parameters: ChosenParameter[];
  datasets: CalibrationDataset[];
  confidence: number;
}

export interface CalibrationAttrs {
  id: string;
  projectId: string;
  designId: string;
  revisionNumber: number;
  simulationJobId: string;
  requestedBy: string | null;
  input: CalibrationInputRecord;
  result: CalibrationResult | null;
  draftRevisionNumber: number | null;
  createdAt: Date;
  updatedAt: Date;
}

export type CalibrationCreationAttrs = Pick<
  CalibrationAttrs,
  'projectId' | 'designId' | 'revisionNumber' | 'simulationJobId' | 'requestedBy' | 'input'
>;

/** A calibration of one revision against its bench runs; its work is the linked simulation job. */
@Table({ tableName: 'calibrations', underscored: true, timestamps: true })
export class CalibrationModel extends Model<CalibrationAttrs, CalibrationCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @ForeignKey(() => DesignModel)
  @Column({ type: DataType.UUID, allowNull: false })
  designId!: string;

  @Column({ type: DataType.INTEGER, allowNull: false })
  revisionNumber!: number;

  @ForeignKey(() => SimulationJobModel)
  @Column({ type: DataType.UUID, allowNull: false })
  simulationJobId!: string;

  @ForeignKey(() => UserModel)
  @Column({ type: DataType.UUID, allowNull: true })
  requestedBy!: string | null;

  @Column({ type: DataType.JSONB, allowNull: false })
  input!: CalibrationInputRecord;

  @Column({ type: DataType.JSONB, allowNull: true })
  result!: CalibrationResult | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  draftRevisionNumber!: number | null;

  @BelongsTo(() => SimulationJobModel, 'simulationJobId')
  job?: SimulationJobModel;

  @BelongsTo(() => UserModel, 'requestedBy')
  requester?: UserModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
