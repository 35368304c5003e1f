export { DomainError, isDomainError } from './domain-error';
export type { DomainErrorCode, FieldIssue } from './domain-error';
export { fieldPath, capIssues, MAX_FIELD_ISSUES } from './field-path';
