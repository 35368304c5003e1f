export {
  analyzeLadder,
  prepareLadder,
  analyzePrepared,
  terminalMeanAt,
  withDiode,
  STEADY_STATE_METHOD,
} from './analyze-ladder';
export { textbookFigures } from './textbook-formulas';
export { ladderNodeVoltages, NODE_VOLTAGE_METHOD } from './ladder-nodes';
export type { PreparedLadder } from './analyze-ladder';
export { buildLadderNetwork } from './topologies';
export type { LadderNetwork } from './topologies';
export { ladderCurves } from './ladder-curves';
export { ladderStressChecks, bleederStressChecks, DERATING, STRESS_CHECK_IDS } from './ladder-stress';
export { ENGINE_VERSION } from './engine-version';
export type {
  LadderInput,
  LadderAnalysis,
  LadderCurves,
  CurvePoint,
  CapacitorStress,
  DiodeStress,
  ShockleyDiode,
  LadderNodeVoltage,
  LadderNodeColumn,
  TextbookFigures,
} from './ladder.types';
export type { MethodInfo } from '../methods';
export { capacitorGradeFactors, capacitorPlaces, capacitorRoleChanges } from './capacitor-places';
export type { CapacitorPlace, CapacitorRoleChange } from './capacitor-places';
