import { Column, DataType, Model, Table } from 'sequelize-typescript';
import type {
  SimulationBatchKind,
  SimulationJobStatus,
  SimulationKind,
  SimulationOptions,
  SimulationResult,
} from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';

/**
 * A job's kind: a simulation, a calibration whose model runs go to the same worker pool, or a batch (a sweep or
 * Monte Carlo) whose members are simulation jobs of their own.
 */
export type SimulationJobKind = SimulationKind | 'calibration' | 'batch';

/** What the worker needs to run the job, stored with it so that any app instance can pick it up. */
export interface SimulationJobInput {
  document: Design;
  options: SimulationOptions;
  /** A batch member: the numbers it varies from the batch's design, by field path. */
  variant?: Record<string, number>;
  /** A batch: how its members were made and what they run. */
  batch?: { kind: SimulationBatchKind; simulationKind: SimulationKind; memberCount: number };
}

export interface SimulationJobAttrs {
  id: string;
  projectId: string;
  requestedBy: string | null;
  kind: SimulationJobKind;
  status: SimulationJobStatus;
  progressPct: number;
  input: SimulationJobInput;
  designId: string | null;
  revisionNumber: number | null;
  result: SimulationResult | null;
  errorCode: string | null;
  errorMessage: string | null;
  queueJobId: string | null;
  startedAt: Date | null;
  finishedAt: Date | null;
  /** Written every `SIMULATION_HEARTBEAT_MS` while the job runs; a stale one means its instance died. */
  heartbeatAt: Date | null;
  /** A batch member: its batch and its place in it. */
  parentJobId: string | null;
  memberIndex: number | null;
  /** The app instance that ran the job (host name, process id). */
  runBy: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export type SimulationJobCreationAttrs = Pick<SimulationJobAttrs, 'projectId' | 'requestedBy' | 'kind' | 'input'> &
  Partial<Pick<SimulationJobAttrs, 'designId' | 'revisionNumber' | 'parentJobId' | 'memberIndex' | 'status'>>;

@Table({ tableName: 'simulation_jobs', underscored: true, timestamps: true })
export class SimulationJobModel extends Model<SimulationJobAttrs, SimulationJobCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @Column({ type: DataType.UUID, allowNull: true })
  requestedBy!: string | null;

  @Column({ type: DataType.TEXT, allowNull: false })
  kind!: SimulationJobKind;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: 'queued' })
  status!: SimulationJobStatus;

  @Column({ type: DataType.SMALLINT, allowNull: false, defaultValue: 0 })
  progressPct!: number;

  @Column({ type: DataType.JSONB, allowNull: false })
  input!: SimulationJobInput;

  @Column({ type: DataType.UUID, allowNull: true })
  designId!: string | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  revisionNumber!: number | null;

  @Column({ type: DataType.JSONB, allowNull: true })
  result!: SimulationResult | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  errorCode!: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  errorMessage!: string | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  queueJobId!: string | null;

  @Column({ type: DataType.DATE, allowNull: true })
  startedAt!: Date | null;

  @Column({ type: DataType.DATE, allowNull: true })
  finishedAt!: Date | null;

  @Column({ type: DataType.DATE, allowNull: true })
  heartbeatAt!: Date | null;

  @Column({ type: DataType.UUID, allowNull: true })
  parentJobId!: string | null;

  @Column({ type: DataType.INTEGER, allowNull: true })
  memberIndex!: number | null;

  @Column({ type: DataType.TEXT, allowNull: true })
  runBy!: string | null;

  override createdAt!: Date;
  override updatedAt!: Date;
}
