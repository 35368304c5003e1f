export { DomainError, isDomainError } from './domain-error';
export type { DomainErrorCode, FieldIssue } from './domain-error';
export { fieldPath, prefixedFieldPath, capIssues, MAX_FIELD_ISSUES } from './field-path';
export { jsonLimitIssue, textProblem } from './json-limits';
export type { JsonLimits } from './json-limits';
