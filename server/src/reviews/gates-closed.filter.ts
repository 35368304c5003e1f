import { type ArgumentsHost, Catch, type ExceptionFilter, HttpStatus } from '@nestjs/common';
import type { Response } from 'express';
import type { GatesClosedBody } from '@ladderwright/shared/api';
import type { GateReason } from '@ladderwright/shared/reviews';

/** A gated Sign-off command refused because gates are closed and no override was given. Nothing was written. */
export class GatesClosedException extends Error {
  constructor(
    readonly command: string,
    readonly reasons: GateReason[],
  ) {
    super(
      `Cannot ${command} while: ${reasons.map((reason) => reason.message).join('; ')}. Fix these, or record an override with its reason.`,
    );
    this.name = 'GatesClosedException';
  }
}

/** Writes the 409 `gates_closed` body: the usual error fields plus one entry per reason. */
@Catch(GatesClosedException)
export class GatesClosedFilter implements ExceptionFilter {
  catch(error: GatesClosedException, host: ArgumentsHost): void {
    const body: GatesClosedBody = {
      statusCode: HttpStatus.CONFLICT,
      code: 'gates_closed',
      message: error.message,
      reasons: error.reasons,
    };
    host
      .switchToHttp()
      .getResponse<Response>()
      .status(HttpStatus.CONFLICT)
      .json({ ...body, field: 'override' });
  }
}
