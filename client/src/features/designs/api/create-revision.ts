import { useMutation, useQueryClient } from '@tanstack/react-query';
import {
  expandCheckRules,
  type RevisionDetail,
  type RevisionDetailBody,
  type SaveRevisionRequest,
  type StaleBaseError,
} from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest, isApiError } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Saves an edited document as revision n+1; answers 409 stale_base when `baseRevisionNumber` is not the latest. */
export async function createRevision(
  projectId: string,
  designId: string,
  request: SaveRevisionRequest,
): Promise<RevisionDetail> {
  const body = await apiRequest<RevisionDetailBody>(apiPaths.revisions(projectId, designId), {
    method: 'POST',
    body: request,
  });
  return { ...body, report: expandCheckRules(body.report) };
}

/** The 409 body of a stale save, or null for any other failure. */
export function staleBaseOf(error: unknown): StaleBaseError | null {
  if (!isApiError(error) || error.status !== 409 || error.body.code !== 'stale_base') return null;
  const body = error.body as unknown as Partial<StaleBaseError>;
  return {
    statusCode: 409,
    code: 'stale_base',
    message: error.body.message,
    latestRevisionNumber: typeof body.latestRevisionNumber === 'number' ? body.latestRevisionNumber : 0,
    changedFields: Array.isArray(body.changedFields) ? body.changedFields : [],
  };
}

export function useCreateRevision(projectId: string, designId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: SaveRevisionRequest) => createRevision(projectId, designId, request),
    onSuccess: (revision) => {
      queryClient.setQueryData(queryKeys.designs.revision(projectId, designId, revision.number), revision);
      // Not awaited: the caller navigates to the new revision at once. Awaiting let the refetched design
      // re-render the page first, which unmounted the caller and dropped its onSuccess (and the navigation).
      // Saved revisions and comparisons never change, so they are left out.
      void queryClient.invalidateQueries({
        queryKey: queryKeys.designs.project(projectId),
        predicate: (query) => !query.queryKey.includes('revision') && !query.queryKey.includes('compare'),
      });
    },
  });
}
