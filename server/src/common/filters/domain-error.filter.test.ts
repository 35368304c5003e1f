import type { ArgumentsHost } from '@nestjs/common';
import { DatabaseError, ValidationError } from 'sequelize';
import { DomainErrorFilter, isDatabaseOutage } from './domain-error.filter';

/** A pg error as the driver raises it, wrapped by sequelize as a query failure. */
function queryFailure(message: string, code?: string): DatabaseError {
  const parent = Object.assign(new Error(message), code ? { code } : {}, { sql: 'SELECT 1' });
  return new DatabaseError(parent as Error & { sql: string });
}

function answer(error: unknown): { status: number; body: Record<string, unknown> } {
  const sent = { status: 0, body: {} as Record<string, unknown> };
  const response = {
    headersSent: false,
    setHeader: () => undefined,
    status(code: number) {
      sent.status = code;
      return this;
    },
    json(body: Record<string, unknown>) {
      sent.body = body;
    },
  };
  const host = { switchToHttp: () => ({ getResponse: () => response }) } as unknown as ArgumentsHost;
  new DomainErrorFilter().catch(error, host);
  return sent;
}

describe('DomainErrorFilter and a database that goes away mid-request', () => {
  // SQLSTATE 57P01 admin_shutdown, 57P02 crash_shutdown (PostgreSQL documentation, Appendix A).
  it.each([
    ['terminating connection due to administrator command', '57P01'],
    ['terminating connection because of crash of another server process', '57P02'],
    ['Connection terminated unexpectedly', undefined],
    ['Client has encountered a connection error and is not queryable', undefined],
  ])('answers "%s" with 503 database_unavailable', (message, code) => {
    const sent = answer(queryFailure(message, code));
    expect(sent.status).toBe(503);
    expect(sent.body).toMatchObject({ code: 'database_unavailable' });
  });

  it('keeps a query error of the request itself a 500, not an outage', () => {
    expect(isDatabaseOutage(queryFailure('syntax error at or near "FROM"', '42601'))).toBe(false);
    expect(isDatabaseOutage(new ValidationError('bad', []))).toBe(false);
  });
});
