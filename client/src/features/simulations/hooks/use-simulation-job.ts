import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { SimulationResult, StartSimulationRequest } from '@ladderwright/shared/api';
import { useCancelSimulation } from '../api/cancel-simulation';
import { isSimulationActive, useSimulation } from '../api/get-simulation';
import { useStartSimulation } from '../api/start-simulation';
import { queryKeys } from '../../../lib/query-keys';

/**
 * One simulation job at a time for a project: start it, follow its status and progress, cancel it, and read
 * its result once it has succeeded. A new start replaces the job followed. A run that succeeds refreshes the
 * current simulation of every revision shown, whose figures then stand for the estimate.
 */
export function useSimulationJob(projectId: string) {
  const [jobId, setJobId] = useState<string | null>(null);
  const startMutation = useStartSimulation(projectId);
  const cancelMutation = useCancelSimulation(projectId);
  const query = useSimulation(projectId, jobId);
  const job = query.data;
  const result: SimulationResult | undefined = job?.status === 'succeeded' ? job.result : undefined;
  const queryClient = useQueryClient();
  const hasSucceeded = job?.status === 'succeeded';
  // A finished run may now be the current simulation of its revision: its figures replace the estimate's.
  useEffect(() => {
    if (hasSucceeded) void queryClient.invalidateQueries({ queryKey: queryKeys.simulations.currentAll });
  }, [hasSucceeded, jobId, queryClient]);
  return {
    jobId,
    job,
    result,
    /** Being started, queued or running (or started and not yet heard of). */
    isActive: startMutation.isPending || isSimulationActive(job) || (jobId !== null && !job),
    progressPct: job?.progressPct ?? 0,
    startError: startMutation.isError ? startMutation.error : null,
    isCancelling: cancelMutation.isPending,
    start: (request: StartSimulationRequest) =>
      startMutation.mutate(request, { onSuccess: (answer) => setJobId(answer.jobId) }),
    cancel: () => {
      if (jobId) cancelMutation.mutate(jobId);
    },
  };
}
