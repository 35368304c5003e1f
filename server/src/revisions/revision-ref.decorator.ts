import { createParamDecorator, type ExecutionContext, InternalServerErrorException } from '@nestjs/common';
import { DomainError } from '@ladderwright/shared/errors';
import type { AppRequest } from '../common/request.types';
import { isUuid } from '../common/uuid';

/** A revision as a route names it: `/projects/:projectId/designs/:designId/revisions/:revisionNumber`. */
export interface RevisionRef {
  projectId: string;
  designId: string;
  revisionNumber: number;
}

/** The one answer to a malformed or unknown revision reference: 404 naming the field. */
export function revisionNotFound(field: 'designId' | 'revisionNumber', raw: string): DomainError {
  return field === 'designId'
    ? new DomainError('not_found', 'Design not found', 'designId')
    : new DomainError('not_found', `Revision ${raw} not found`, 'revisionNumber');
}

/** Parses a revision number from a route or query; anything but a positive integer is "no such revision". */
export function parseRevisionNumber(raw: string): number | null {
  return /^[1-9][0-9]{0,8}$/.test(raw) ? Number(raw) : null;
}

/** Reads and checks the route's revision reference; the project comes from the project access guard. */
export function revisionRefOf(request: AppRequest): RevisionRef {
  const membership = request.projectMembership;
  if (!membership) throw new InternalServerErrorException('Route has no :projectId to check membership against');
  const params = request.params as Record<string, string | undefined>;
  const designId = params.designId ?? '';
  const rawNumber = params.revisionNumber ?? '';
  if (!isUuid(designId)) throw revisionNotFound('designId', designId);
  const revisionNumber = parseRevisionNumber(rawNumber);
  if (revisionNumber === null) throw revisionNotFound('revisionNumber', rawNumber);
  return { projectId: membership.projectId, designId, revisionNumber };
}

/**
 * The revision a route names, checked in form (404 for a malformed id or number, as for an unknown one).
 * Load it with `RevisionLookupService.find`.
 */
export const RevisionRef = createParamDecorator((_data: unknown, context: ExecutionContext): RevisionRef =>
  revisionRefOf(context.switchToHttp().getRequest<AppRequest>()),
);
