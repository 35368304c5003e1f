export {
  HV_CAUTION,
  SAFETY_MARGINAL_BELOW_PCT,
  storedChargeLimit,
  upperLimitVerdict,
  lowerLimitVerdict,
  deratedVerdict,
} from './hazard-limits';
export type { HazardStandard } from './hazard-limits';
export { storedEnergy, storedEnergyChecks, STORED_ENERGY_METHOD } from './stored-energy';
export type { StoredEnergyItem, StoredEnergySummary } from './stored-energy';
export { dischargeRuleLimits, dischargeTimeS, dischargeCheck, trappedChargeCheck, DISCHARGE_METHOD } from './discharge';
export type { DischargeInput, TrappedChargeInput } from './discharge';
export {
  CREEPAGE_TABLE_F4_MM,
  CREEPAGE_TABLE_F4_VOLTAGES_V,
  CREEPAGE_METHOD_TEXT,
  creepageColumn,
  requiredCreepageMm,
  ipc2221B2SpacingMm,
  stageSpacing,
  creepageChecks,
} from './creepage';
export type { CreepageColumn, StageSpacing } from './creepage';
export type { CheckVerdict } from './check.types';
export { mergeCheckRows, describeMargin } from './check-rows';
export type { CheckRow } from './check-rows';
export { hipotTestVoltageV, HIPOT_METHOD } from './hipot';
