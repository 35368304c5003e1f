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
  const runIdRef = useRef(0);
  const [outcome, setOutcome] = useState<SizerRun['outcome']>(null);
  const [error, setError] = useState<string | null>(null);
  const [isRunning, setIsRunning] = useState(false);

  const stopWorker = useCallback(() => {
    workerRef.current?.terminate();
    workerRef.current = null;
  }, []);

  useEffect(() => stopWorker, [stopWorker]);

  const run = useCallback(
    (request: SizerRequest) => {
      const runId = ++runIdRef.current;
      // One worker serves run after run; only a cancel or an unmount ends it.
      const worker = workerRef.current ?? createSizerWorker();
      workerRef.current = worker;
      worker.onmessage = (event: MessageEvent<SizerWorkerAnswer>) => {
        const answer = event.data;
        if (answer.runId !== runIdRef.current) return;
        if (answer.isOk) {
          setOutcome({ request, result: answer.result });
          setError(null);
        } else {
          setOutcome(null);
          setError(answer.message);
        }
        setIsRunning(false);
      };
      worker.onerror = (event: ErrorEvent) => {
        if (runId !== runIdRef.current) return;
        event.preventDefault();
        setError(event.message || 'The Sizer stopped unexpectedly.');
        setIsRunning(false);
        stopWorker();
      };
      setError(null);
      setIsRunning(true);
      const message: SizerWorkerRequest = { runId, request };
      worker.postMessage(message);
    },
    [stopWorker],
  );

  const cancel = useCallback(() => {
    runIdRef.current += 1;
    stopWorker();
    setIsRunning(false);
  }, [stopWorker]);

  return { outcome, error, isRunning, run, cancel };
}
