import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PartImportResult } from '@ladderwright/shared/api';
import { apiPaths } from '../../../config/paths';
import { apiFormRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Sends a shelf CSV: `dryRun` true previews it, false writes it (only when every row is valid). */
export function importParts(projectId: string, file: File, dryRun: boolean): Promise<PartImportResult> {
  const form = new FormData();
  form.append('file', file);
  return apiFormRequest<PartImportResult>(apiPaths.importParts(projectId, dryRun), form);
}

export function useImportParts(projectId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, dryRun }: { file: File; dryRun: boolean }) => importParts(projectId, file, dryRun),
    onSuccess: (result) => {
      if (result.written) void queryClient.invalidateQueries({ queryKey: queryKeys.parts.project(projectId) });
    },
  });
}
