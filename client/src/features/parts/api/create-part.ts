import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Part } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Fields as typed: numbers may carry units ("4.7n", "3 kV", "10%"); the server parses them. */
export type PartDraft = Record<string, string>;

export function createPart(projectId: string, draft: PartDraft): Promise<Part> {
  const body = Object.fromEntries(Object.entries(draft).filter(([, value]) => value.trim() !== ''));
  return apiRequest<Part>(apiPaths.parts(projectId), { method: 'POST', body });
}

export function useCreatePart(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (draft: PartDraft) => createPart(projectId, draft),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.parts.project(projectId) }),
  });
}
