import { type CanActivate, type ExecutionContext, Injectable, UnsupportedMediaTypeException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { DECORATORS } from '@nestjs/swagger';
import type { Request } from 'express';

const MULTIPART = 'multipart/form-data';

function hasBody(request: Request): boolean {
  const length = request.headers['content-length'];
  return request.headers['transfer-encoding'] !== undefined || (length !== undefined && length !== '0');
}

/**
 * Global guard, first in line: a request body must be JSON, or multipart/form-data on the upload routes
 * that declare it with `@ApiConsumes('multipart/form-data')`. Anything else (form-encoded, text/plain, the
 * bodies an HTML form can send across sites without a preflight) is refused with 415 before any other work.
 */
@Injectable()
export class JsonBodyGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const request = context.switchToHttp().getRequest<Request>();
    if (!hasBody(request) || request.is('application/json') === 'application/json') return true;
    const consumes =
      this.reflector.getAllAndOverride<string[] | undefined>(DECORATORS.API_CONSUMES, [
        context.getHandler(),
        context.getClass(),
      ]) ?? [];
    if (consumes.includes(MULTIPART) && request.is(MULTIPART) === MULTIPART) return true;
    const accepted = consumes.includes(MULTIPART) ? `application/json or ${MULTIPART}` : 'application/json';
    throw new UnsupportedMediaTypeException(
      `The request body must be ${accepted} (got ${request.headers['content-type'] ?? 'no content type'})`,
    );
  }
}
