import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  HttpStatus,
  Logger,
  type ValidationError,
} from '@nestjs/common';
import type { Response } from 'express';
import {
  ConnectionAcquireTimeoutError,
  ConnectionError,
  DatabaseError,
  ForeignKeyConstraintError,
  UniqueConstraintError,
} from 'sequelize';
import type { ApiErrorBody } from '@ladderwright/shared/api';
import { fieldPath, isDomainError, type DomainError, type DomainErrorCode } from '@ladderwright/shared/errors';

const DOMAIN_STATUS: Record<DomainErrorCode, number> = {
  invalid_quantity: HttpStatus.BAD_REQUEST,
  invalid_design: HttpStatus.BAD_REQUEST,
  invalid_argument: HttpStatus.BAD_REQUEST,
  unsupported_version: HttpStatus.BAD_REQUEST,
  not_converged: HttpStatus.UNPROCESSABLE_ENTITY,
  illegal_transition: HttpStatus.CONFLICT,
  stale_base: HttpStatus.CONFLICT,
  not_found: HttpStatus.NOT_FOUND,
  forbidden: HttpStatus.FORBIDDEN,
  cancelled: HttpStatus.CONFLICT,
  budget_exceeded: HttpStatus.UNPROCESSABLE_ENTITY,
};

const HTTP_CODES: Record<number, string> = {
  400: 'bad_request',
  401: 'unauthorized',
  403: 'forbidden',
  404: 'not_found',
  405: 'method_not_allowed',
  409: 'conflict',
  413: 'payload_too_large',
  415: 'unsupported_media_type',
  422: 'unprocessable',
  429: 'too_many_requests',
  503: 'unavailable',
};

/** Thrown by the global ValidationPipe: carries class-validator's findings as field issues. */
export class RequestValidationException extends HttpException {
  readonly issues: { path: string; message: string }[];

  constructor(errors: ValidationError[]) {
    const issues = flattenValidationErrors(errors);
    super(issues[0]?.message ?? 'Invalid request', HttpStatus.BAD_REQUEST);
    this.issues = issues;
  }
}

/** 429 with a `Retry-After` header (seconds). */
export class RetryLaterException extends HttpException {
  constructor(
    message: string,
    readonly retryAfterS: number,
  ) {
    super(message, HttpStatus.TOO_MANY_REQUESTS);
  }
}

/** Seconds a client is asked to wait when every pooled database connection stayed busy. */
export const BUSY_RETRY_AFTER_S = 1;

/** 503 `busy` with `Retry-After`: this instance has more of some work queued than it takes on. */
export class BusyException extends HttpException {
  constructor(message: string) {
    super(message, HttpStatus.SERVICE_UNAVAILABLE);
  }
}

/** Presence and type first: "email is required" says more than "email must be shorter than 254 characters". */
const CONSTRAINT_PRIORITY = [
  'whitelistValidation',
  'isDefined',
  'isNotEmpty',
  'isString',
  'isIn',
  'isEmail',
  'minLength',
];

function firstConstraintMessage(constraints: Record<string, string>): string | undefined {
  // class-validator lists constraints bottom decorator first; reverse to declaration order, then rank.
  const entries = Object.entries(constraints).reverse();
  const rank = (key: string) => {
    const index = CONSTRAINT_PRIORITY.indexOf(key);
    return index === -1 ? CONSTRAINT_PRIORITY.length : index;
  };
  return entries.sort(([a], [b]) => rank(a) - rank(b))[0]?.[1];
}

/** One issue per offending property (its most telling message), nested properties as dotted paths. */
function flattenValidationErrors(errors: ValidationError[], prefix = ''): { path: string; message: string }[] {
  return errors.flatMap((error) => {
    // Our path notation: an odd key (even an empty one) is quoted, so every issue names its field.
    const path = fieldPath(prefix, /^(0|[1-9]\d*)$/.test(error.property) ? Number(error.property) : error.property);
    const message = firstConstraintMessage(error.constraints ?? {});
    const own = message ? [{ path, message }] : [];
    return [...own, ...flattenValidationErrors(error.children ?? [], path)];
  });
}

function fromDomainError(error: DomainError): ApiErrorBody {
  const body: ApiErrorBody = { statusCode: DOMAIN_STATUS[error.code], code: error.code, message: error.message };
  if (error.field) body.field = error.field;
  if (error.issues.length > 0) body.issues = error.issues;
  return body;
}

function fromHttpException(error: HttpException): ApiErrorBody {
  const statusCode = error.getStatus();
  if (error instanceof RequestValidationException) {
    const first = error.issues[0];
    return {
      statusCode,
      code: 'invalid_argument',
      message: error.message,
      ...(first ? { field: first.path } : {}),
      issues: error.issues,
    };
  }
  if (error instanceof BusyException) return { statusCode, code: 'busy', message: error.message };
  const response = error.getResponse();
  const raw = typeof response === 'string' ? response : (response as { message?: unknown }).message;
  const message = Array.isArray(raw) ? raw.join('; ') : typeof raw === 'string' ? raw : error.message;
  return { statusCode, code: HTTP_CODES[statusCode] ?? (statusCode >= 500 ? 'internal' : 'bad_request'), message };
}

function bodyTooLargeMessage(error: unknown): string {
  const limit = (error as { limit?: unknown }).limit;
  return typeof limit === 'number'
    ? `The request body is larger than the limit of ${limit} bytes`
    : 'The request body is larger than the limit';
}

/** Body-parser failures (malformed JSON, oversized body) arrive as errors with a 4xx `status`. */
function fromClientError(error: unknown): ApiErrorBody | null {
  const status = (error as { status?: unknown; type?: unknown }).status;
  if (typeof status !== 'number' || status < 400 || status >= 500) return null;
  const message =
    status === 400
      ? 'The request body is not valid JSON'
      : status === 413
        ? bodyTooLargeMessage(error)
        : 'The request body was refused';
  // A body that is not JSON, or JSON that is not an object or a list, is the body's own fault.
  return {
    statusCode: status,
    code: HTTP_CODES[status] ?? 'bad_request',
    message,
    ...(status === 400 ? { field: '(body)' } : {}),
  };
}

/**
 * A query that failed because the database went away under it (a crash, a shutdown or a restart while
 * the request ran): SQLSTATE class 57 (operator intervention) or 08 (connection exception), or the
 * driver's own words for a dropped connection. Not a bad request and not a bug: 503.
 */
export function isDatabaseOutage(error: unknown): boolean {
  if (!(error instanceof DatabaseError)) return false;
  const parent = error.parent as Error & { code?: unknown };
  const code = typeof parent?.code === 'string' ? parent.code : '';
  if (code.startsWith('57P') || code.startsWith('08')) return true;
  if (['ECONNRESET', 'ECONNREFUSED', 'EPIPE'].includes(code)) return true;
  return /connection terminated|not queryable|connection error|server closed the connection/i.test(
    parent?.message ?? error.message,
  );
}

/**
 * Maps every error to the `ApiErrorBody` shape: DomainError codes to their status, HttpExceptions as they
 * are, validation findings to 400 with the first offending field. Unknown errors become a bare 500.
 */
@Catch()
export class DomainErrorFilter implements ExceptionFilter {
  private readonly logger = new Logger('DomainErrorFilter');

  catch(error: unknown, host: ArgumentsHost): void {
    const response = host.switchToHttp().getResponse<Response>();
    const body = this.toBody(error);
    // Every 400 names a field: one about the request as a whole names its body.
    if (body.statusCode === 400 && !body.field) body.field = '(body)';
    if (response.headersSent) return;
    if (error instanceof RetryLaterException) response.setHeader('Retry-After', String(error.retryAfterS));
    if (error instanceof ConnectionAcquireTimeoutError || error instanceof BusyException)
      response.setHeader('Retry-After', String(BUSY_RETRY_AFTER_S));
    response.status(body.statusCode).json(body);
  }

  private toBody(error: unknown): ApiErrorBody {
    if (isDomainError(error)) return fromDomainError(error);
    if (error instanceof HttpException) return fromHttpException(error);
    if (error instanceof UniqueConstraintError) {
      const field = Object.keys(error.fields ?? {})[0];
      return {
        statusCode: 409,
        code: 'conflict',
        message: 'A record with this value already exists',
        ...(field ? { field } : {}),
      };
    }
    if (error instanceof ForeignKeyConstraintError) {
      return {
        statusCode: 409,
        code: 'conflict',
        message: 'The record refers to, or is referred to by, another record',
      };
    }
    // Every pooled connection stayed in use for the acquire timeout: the database is up, this instance is busy.
    if (error instanceof ConnectionAcquireTimeoutError) {
      this.logger.warn('database pool busy: no connection within the acquire timeout');
      return { statusCode: 503, code: 'busy', message: 'The server is busy; try again in a moment' };
    }
    if (error instanceof ConnectionError || isDatabaseOutage(error)) {
      this.logger.error(`database unavailable: ${(error as Error).message}`);
      return { statusCode: 503, code: 'database_unavailable', message: 'The database is not reachable' };
    }
    const clientError = fromClientError(error);
    if (clientError) return clientError;
    this.logger.error(error instanceof Error ? (error.stack ?? error.message) : String(error));
    return { statusCode: 500, code: 'internal', message: 'Internal server error' };
  }
}
