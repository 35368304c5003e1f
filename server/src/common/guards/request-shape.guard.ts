import { type CanActivate, type ExecutionContext, Injectable } from '@nestjs/common';
import type { Request } from 'express';
import { DomainError, jsonLimitIssue, type JsonLimits } from '@ladderwright/shared/errors';

/**
 * Depth of objects and lists in a request body: a design document inside its request needs 13; bench
 * points and part lists 3. Common practice, no source.
 */
export const REQUEST_MAX_DEPTH = 32;

const BODY_LIMITS: JsonLimits = { maxDepth: REQUEST_MAX_DEPTH, maxBytes: Number.POSITIVE_INFINITY, checkText: true };

/**
 * Refuses, with a 400 naming the field, a body or query that no route can store or walk safely: nesting
 * deeper than REQUEST_MAX_DEPTH, and text with NUL or other control characters or unpaired UTF-16
 * surrogates (PostgreSQL refuses them in text and JSONB). Runs before any pipe, so nothing recursive
 * ever sees such a value. The body size itself is limited by the body parser (BODY_LIMIT_BYTES).
 */
@Injectable()
export class RequestShapeGuard implements CanActivate {
  canActivate(context: ExecutionContext): boolean {
    if (context.getType() !== 'http') return true;
    const request = context.switchToHttp().getRequest<Request>();
    const issue =
      jsonLimitIssue(request.query, BODY_LIMITS, '', '(query)') ??
      (request.body === undefined ? null : jsonLimitIssue(request.body as unknown, BODY_LIMITS, '', '(body)'));
    if (issue) throw new DomainError('invalid_argument', `${issue.path} ${issue.message}`, issue.path, [issue]);
    return true;
  }
}
