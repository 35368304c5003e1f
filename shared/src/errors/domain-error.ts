/** Stable error codes shared by the engine, the server (mapped to HTTP status) and the client (mapped to messages). */
export type DomainErrorCode =
  | 'invalid_quantity'
  | 'invalid_design'
  | 'invalid_argument'
  | 'unsupported_version'
  | 'not_converged'
  | 'illegal_transition'
  | 'stale_base'
  | 'not_found'
  | 'forbidden'
  | 'cancelled'
  /** The engine work of one request did not finish within the request's time budget. */
  | 'budget_exceeded';

/** One field-level problem: `path` is a dotted/indexed path into the input, e.g. `multiplier.capacitors[3].valueF`. */
export interface FieldIssue {
  path: string;
  message: string;
}

/** The one error class of the domain code. `field` names the offending input path when there is one. */
export class DomainError extends Error {
  readonly code: DomainErrorCode;
  readonly field: string | null;
  readonly issues: FieldIssue[];

  constructor(code: DomainErrorCode, message: string, field: string | null = null, issues: FieldIssue[] = []) {
    super(message);
    this.name = 'DomainError';
    this.code = code;
    this.field = field;
    this.issues = issues.length > 0 ? issues : field ? [{ path: field, message }] : [];
  }
}

export function isDomainError(value: unknown): value is DomainError {
  return value instanceof DomainError;
}
