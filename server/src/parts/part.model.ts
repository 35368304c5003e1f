import { BelongsTo, Column, DataType, ForeignKey, Model, Table } from 'sequelize-typescript';
import type { PartKind, PartMagnetics } from '@ladderwright/shared/api';
import { ProjectModel } from '../projects/project.model';

export interface PartAttrs extends PartMagnetics {
  id: string;
  projectId: string;
  code: string;
  kind: PartKind;
  description: string;
  valueSi: number | null;
  tolerance: number | null;
  ratedVoltageV: number | null;
  ratedCurrentA: number | null;
  ratedSurgeCurrentA: number | null;
  ratedPowerW: number | null;
  unitCost: number;
  sizeMm: string;
  createdAt: Date;
  updatedAt: Date;
}

export type PartCreationAttrs = Omit<PartAttrs, 'id' | 'createdAt' | 'updatedAt'>;

const rating = { type: DataType.DOUBLE, allowNull: true };
/** A magnetics column, named explicitly (the digits in some names would not map back by convention). */
const magnetics = (field: string) => ({ ...rating, field });

@Table({ tableName: 'parts', underscored: true, timestamps: true })
export class PartModel extends Model<PartAttrs, PartCreationAttrs> {
  @Column({ type: DataType.UUID, primaryKey: true, defaultValue: DataType.UUIDV4 })
  override id!: string;

  @ForeignKey(() => ProjectModel)
  @Column({ type: DataType.UUID, allowNull: false })
  projectId!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  code!: string;

  @Column({ type: DataType.TEXT, allowNull: false })
  kind!: PartKind;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  description!: string;

  @Column(rating)
  valueSi!: number | null;

  @Column(rating)
  tolerance!: number | null;

  @Column(rating)
  ratedVoltageV!: number | null;

  @Column(rating)
  ratedCurrentA!: number | null;

  @Column(rating)
  ratedSurgeCurrentA!: number | null;

  @Column(rating)
  ratedPowerW!: number | null;

  @Column({ type: DataType.DOUBLE, allowNull: false })
  unitCost!: number;

  @Column({ type: DataType.TEXT, allowNull: false, defaultValue: '' })
  sizeMm!: string;

  @Column(magnetics('core_area_m2'))
  coreAreaM2!: number | null;

  @Column(magnetics('core_path_length_m'))
  corePathLengthM!: number | null;

  @Column(magnetics('core_volume_m3'))
  coreVolumeM3!: number | null;

  @Column(magnetics('window_area_m2'))
  windowAreaM2!: number | null;

  @Column(magnetics('bobbin_breadth_m'))
  bobbinBreadthM!: number | null;

  @Column(magnetics('bobbin_height_m'))
  bobbinHeightM!: number | null;

  @Column(magnetics('mean_turn_length_m'))
  meanTurnLengthM!: number | null;

  @Column(magnetics('saturation_flux_density_25_t'))
  saturationFluxDensity25T!: number | null;

  @Column(magnetics('saturation_flux_density_100_t'))
  saturationFluxDensity100T!: number | null;

  @Column(magnetics('steinmetz_k'))
  steinmetzK!: number | null;

  @Column(magnetics('steinmetz_alpha'))
  steinmetzAlpha!: number | null;

  @Column(magnetics('steinmetz_beta'))
  steinmetzBeta!: number | null;

  @Column(magnetics('copper_diameter_m'))
  copperDiameterM!: number | null;

  @Column(magnetics('overall_diameter_m'))
  overallDiameterM!: number | null;

  @Column(magnetics('enamel_grade'))
  enamelGrade!: number | null;

  @Column(magnetics('breakdown_voltage_v'))
  breakdownVoltageV!: number | null;

  @Column(magnetics('thickness_m'))
  thicknessM!: number | null;

  @Column(magnetics('dielectric_strength_v_per_m'))
  dielectricStrengthVPerM!: number | null;

  @BelongsTo(() => ProjectModel, { onDelete: 'CASCADE' })
  project?: ProjectModel;

  override createdAt!: Date;
  override updatedAt!: Date;
}
