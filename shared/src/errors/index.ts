export { DomainError, isDomainError } from './domain-error';
export type { DomainErrorCode, FieldIssue } from './domain-error';
