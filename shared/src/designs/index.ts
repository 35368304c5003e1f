export { validateDesign, capacitorCountFor } from './validate-design';
export { designDocumentSchema } from './design.schema';
export { designExamples } from './design-examples';
export { DESIGN_SCHEMA_VERSION } from './design.types';
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
