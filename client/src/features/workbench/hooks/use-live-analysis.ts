import { useEffect, useRef, useState } from 'react';
import type { Design } from '@ladderwright/shared/designs';
import type { ShelfPart } from '@ladderwright/shared/parts';
import { createLiveAnalysisWorker } from '../create-live-analysis-worker';
import type { LiveAnalysisAnswer, LiveAnalysisRequest, LiveAnalysisResult } from '../live-analysis-messages';

export interface LiveAnalysis extends LiveAnalysisResult {
  /** True while the shown figures lag behind the typed document. */
  isPending: boolean;
}

function sameIssues(a: Readonly<Record<string, string>> | undefined, b: Readonly<Record<string, string>>): boolean {
  if (!a) return false;
  const keys = Object.keys(b);
  return keys.length === Object.keys(a).length && keys.every((key) => a[key] === b[key]);
}

const noResult: LiveAnalysisResult = { report: null, issues: {}, engineError: null, partIssues: [] };

/**
 * Runs the shared engine on the document being edited in a Web Worker (a driver design's analysis would otherwise
 * hold up typing). A keystroke is posted at once when the worker is idle; while it works, only the newest
 * document waits and is posted when the answer comes, so the figures follow typing as fast as the engine allows
 * and never fall behind by a queue. With the project's `shelf`, the referenced parts' ratings are filled in first,
 * as the server does for a saved revision, so the preview and the stored report agree. Each request is numbered;
 * an answer to anything but the latest request is dropped.
 */
export function useLiveAnalysis(document: Design, shelf?: readonly ShelfPart[]): LiveAnalysis {
  const workerRef = useRef<Worker | null>(null);
  const latestRef = useRef<LiveAnalysisRequest | null>(null);
  const isBusyRef = useRef(false);
  const waitingRef = useRef<Omit<LiveAnalysisRequest, 'sequence'> | null>(null);
  const sequenceRef = useRef(0);
  const [answered, setAnswered] = useState<{ document: Design; result: LiveAnalysisResult } | null>(null);

  useEffect(
    () => () => {
      workerRef.current?.terminate();
      workerRef.current = null;
    },
    [],
  );

  useEffect(() => {
    const post = (worker: Worker, body: Omit<LiveAnalysisRequest, 'sequence'>) => {
      sequenceRef.current += 1;
      const request: LiveAnalysisRequest = { sequence: sequenceRef.current, ...body };
      latestRef.current = request;
      isBusyRef.current = true;
      worker.postMessage(request);
    };
    let worker = workerRef.current;
    if (!worker) {
      const created = createLiveAnalysisWorker();
      created.addEventListener('message', (event: MessageEvent<LiveAnalysisAnswer>) => {
        isBusyRef.current = false;
        const waiting = waitingRef.current;
        waitingRef.current = null;
        const latest = latestRef.current;
        if (latest && event.data.sequence === latest.sequence)
          setAnswered((previous) => ({
            document: latest.document,
            // Unchanged issues keep their identity, so the form does not re-render for an answer that moves none.
            result: sameIssues(previous?.result.issues, event.data.result.issues)
              ? { ...event.data.result, issues: previous?.result.issues ?? event.data.result.issues }
              : event.data.result,
          }));
        if (waiting) post(created, waiting);
      });
      created.addEventListener('error', (event: ErrorEvent) => {
        event.preventDefault();
        const latest = latestRef.current;
        workerRef.current?.terminate();
        workerRef.current = null;
        isBusyRef.current = false;
        waitingRef.current = null;
        if (latest)
          setAnswered({
            document: latest.document,
            result: { ...noResult, engineError: event.message || 'The live preview stopped unexpectedly.' },
          });
      });
      workerRef.current = created;
      worker = created;
    }
    const body = { document, ...(shelf ? { shelf } : {}) };
    if (isBusyRef.current) waitingRef.current = body;
    else post(worker, body);
  }, [document, shelf]);

  const result = answered?.result ?? noResult;
  return { ...result, isPending: answered?.document !== document };
}
