import { useCallback, useEffect, useRef, useState } from 'react';
import type { SizerRequest, SizerResult } from '@ladderwright/shared/sizing';
import { createSizerWorker } from '../create-sizer-worker';

export interface WorkerRun<TRequest, TResult> {
  outcome: { request: TRequest; result: TResult } | null;
  error: string | null;
  isRunning: boolean;
  run: (request: TRequest) => void;
  /** Stops the running search at once (the worker is terminated) and keeps the previous outcome. */
  cancel: () => void;
}

export type SizerRun = WorkerRun<SizerRequest, SizerResult>;

type Answer<TResult> = { runId: number; isOk: true; result: TResult } | { runId: number; isOk: false; message: string };

/** Runs sizeLadder in a Web Worker: the page stays responsive, and a run can be cancelled. */
export function useSizerRun(): SizerRun {
  return useSizerWorkerRun<SizerRequest, SizerResult>(undefined);
}

/**
 * Runs one kind of Sizer search in a Web Worker (`kind` undefined: the ladder Sizer; 'driver': whole
 * driver-fed supplies), numbering each run so a late answer to a cancelled one is dropped.
 */
export function useSizerWorkerRun<TRequest, TResult>(kind: 'driver' | undefined): WorkerRun<TRequest, TResult> {
  const workerRef = useRef<Worker | null>(null);
  /** The run awaiting its answer; an answer for any other run (one cancelled meanwhile) is dropped. */
  const pendingRef = useRef<{ runId: number; request: TRequest } | null>(null);
  const runCountRef = useRef(0);
  const [outcome, setOutcome] = useState<WorkerRun<TRequest, TResult>['outcome']>(null);
  const [error, setError] = useState<string | null>(null);
  const [isRunning, setIsRunning] = useState(false);

  const stopWorker = useCallback(() => {
    workerRef.current?.terminate();
    workerRef.current = null;
  }, []);

  useEffect(() => stopWorker, [stopWorker]);

  // One worker serves run after run; only a cancel, a crash or an unmount ends it.
  const ensureWorker = useCallback((): Worker => {
    if (workerRef.current) return workerRef.current;
    const worker = createSizerWorker();
    worker.addEventListener('message', (event: MessageEvent<Answer<TResult>>) => {
      const pending = pendingRef.current;
      const answer = event.data;
      if (!pending || answer.runId !== pending.runId) return;
      pendingRef.current = null;
      if (answer.isOk) {
        setOutcome({ request: pending.request, result: answer.result });
        setError(null);
      } else {
        setOutcome(null);
        setError(answer.message);
      }
      setIsRunning(false);
    });
    worker.addEventListener('error', (event: ErrorEvent) => {
      event.preventDefault();
      pendingRef.current = null;
      setError(event.message || 'The Sizer stopped unexpectedly.');
      setIsRunning(false);
      stopWorker();
    });
    workerRef.current = worker;
    return worker;
  }, [stopWorker]);

  const run = useCallback(
    (request: TRequest) => {
      runCountRef.current += 1;
      const message = { runId: runCountRef.current, request };
      pendingRef.current = message;
      setError(null);
      setIsRunning(true);
      ensureWorker().postMessage(kind ? { ...message, kind } : message);
    },
    [ensureWorker, kind],
  );

  const cancel = useCallback(() => {
    pendingRef.current = null;
    stopWorker();
    setIsRunning(false);
  }, [stopWorker]);

  return { outcome, error, isRunning, run, cancel };
}
