export { validateDesign } from './validate-design';
export { capacitorCountFor } from './capacitor-count';
export { designDocumentSchema, designSchema, DESIGN_SCHEMA_VERSION } from './design.schema';
export { DISCHARGE_RULE_LABELS, NAMED_DISCHARGE_RULES } from './discharge-rules';
export { designLimits } from './design-limits';
export { TRANSISTOR_MODEL_DEFAULTS, DIODE_MODEL_DEFAULTS, RCD_CLAMP_DEFAULTS } from './device-defaults';
export { designExamples } from './design-examples';
export type {
  Design,
  Drive,
  SineDrive,
  PulseDrive,
  DriverDrive,
  Topology,
  CapacitorPart,
  DiodePart,
  MultiplierSpec,
  BleederString,
  OutputNetwork,
  Load,
  DischargeRule,
  SpacingEnvironment,
  DesignTargets,
} from './design.types';
export {
  documentFieldLabel,
  resultFieldLabel,
  formatFieldValue,
  formatFieldDelta,
  DOCUMENT_FIELD_PATTERNS,
} from './field-labels';
export type { FieldLabel, FieldDisplay } from './field-labels';
export { withoutRetiredFields } from './retired-fields';
