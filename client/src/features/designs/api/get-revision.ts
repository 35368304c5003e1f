import { queryOptions, useQuery } from '@tanstack/react-query';
import { expandCheckRules, type RevisionDetail, type RevisionDetailBody } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * One saved revision with its document and the server's report; both never change once saved. The server sends each
 * check rule's text once (`report.checkRules`); the report comes back with each check's rule looked up.
 */
export async function getRevision(
  projectId: string,
  designId: string,
  revisionNumber: number,
  signal?: AbortSignal,
): Promise<RevisionDetail> {
  const body = await apiRequest<RevisionDetailBody>(apiPaths.revision(projectId, designId, revisionNumber), { signal });
  return { ...body, report: expandCheckRules(body.report) };
}

export function getRevisionQueryOptions(projectId: string, designId: string, revisionNumber: number) {
  return queryOptions({
    queryKey: queryKeys.designs.revision(projectId, designId, revisionNumber),
    queryFn: ({ signal }) => getRevision(projectId, designId, revisionNumber, signal),
    staleTime: Infinity,
  });
}

export function useRevision(projectId: string, designId: string, revisionNumber: number) {
  return useQuery(getRevisionQueryOptions(projectId, designId, revisionNumber));
}
