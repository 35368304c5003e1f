import { type ArgumentsHost, Catch, type ExceptionFilter, HttpStatus } from '@nestjs/common';
import type { Response } from 'express';
import type { StaleBaseError } from '@ladderwright/shared/api';

/** A save whose base revision is not the latest; carries what the 409 body needs. Nothing was written. */
export class StaleBaseException extends Error {
  constructor(
    readonly latestRevisionNumber: number,
    readonly changedFields: string[],
  ) {
    super(`The design has moved on to revision ${latestRevisionNumber}; merge those changes and save again`);
    this.name = 'StaleBaseException';
  }
}

/** Writes the `StaleBaseError` body: the usual error fields plus the latest number and the changed paths. */
@Catch(StaleBaseException)
export class StaleBaseFilter implements ExceptionFilter {
  catch(error: StaleBaseException, host: ArgumentsHost): void {
    const body: StaleBaseError = {
      statusCode: HttpStatus.CONFLICT,
      code: 'stale_base',
      message: error.message,
      latestRevisionNumber: error.latestRevisionNumber,
      changedFields: error.changedFields,
    };
    host
      .switchToHttp()
      .getResponse<Response>()
      .status(HttpStatus.CONFLICT)
      .json({ ...body, field: 'baseRevisionNumber' });
  }
}
