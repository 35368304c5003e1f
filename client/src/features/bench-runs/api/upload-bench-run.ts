import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BenchRunDetail } from '@ladderwright/shared/api';
import type { BenchKind } from '@ladderwright/shared/bench';
import { apiPaths } from '../../../config/paths';
import { apiFormRequest } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export interface BenchUploadInput {
  kind: BenchKind;
  title: string;
  tolerance: string;
  data: File;
  photos: File[];
}

export function uploadBenchRun(projectId: string, designId: string, revisionNumber: number, input: BenchUploadInput) {
  const form = new FormData();
  form.append('kind', input.kind);
  if (input.title.trim()) form.append('title', input.title.trim());
  if (input.tolerance.trim()) form.append('tolerance', input.tolerance.trim());
  form.append('data', input.data);
  for (const photo of input.photos) form.append('photos', photo);
  return apiFormRequest<BenchRunDetail>(apiPaths.benchRuns(projectId, designId, revisionNumber), form);
}

export function useUploadBenchRun(projectId: string, designId: string, revisionNumber: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BenchUploadInput) => uploadBenchRun(projectId, designId, revisionNumber, input),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: queryKeys.benchRuns.revision(projectId, designId, revisionNumber) }),
  });
}
