import { useCallback, useEffect, useRef, useState } from 'react';
import type { SizerRequest, SizerResult } from '@ladderwright/shared/sizing';
import { createSizerWorker } from '../create-sizer-worker';
import type { SizerWorkerAnswer, SizerWorkerRequest } from '../sizer-messages';

export interface SizerRun {
  outcome: { request: SizerRequest; result: SizerResult } | null;
  error: string | null;
  isRunning: boolean;
  run: (request: SizerRequest) => void;
  /** Stops the running search at once (the worker is terminated) and keeps the previous outcome. */
  cancel: () => void;
}

/** Runs sizeLadder in a Web Worker: the page stays responsive, and a run can be cancelled. */
export function useSizerRun(): SizerRun {
  const workerRef = useRef<Worker | null>(null);
  /** The run awaiting its answer; an answer for any other run (one cancelled meanwhile) is dropped. */
  const pendingRef = useRef<SizerWorkerRequest | null>(null);
  const runCountRef = useRef(0);
  const [outcome, setOutcome] = useState<SizerRun['outcome']>(null);
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
    worker.addEventListener('message', (event: MessageEvent<SizerWorkerAnswer>) => {
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
    (request: SizerRequest) => {
      runCountRef.current += 1;
      const message: SizerWorkerRequest = { runId: runCountRef.current, request };
      pendingRef.current = message;
      setError(null);
      setIsRunning(true);
      ensureWorker().postMessage(message);
    },
    [ensureWorker],
  );

  const cancel = useCallback(() => {
    pendingRef.current = null;
    stopWorker();
    setIsRunning(false);
  }, [stopWorker]);

  return { outcome, error, isRunning, run, cancel };
}
