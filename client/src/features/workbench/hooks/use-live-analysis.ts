import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import type { Design } from '@ladderwright/shared/designs';
import type { ShelfPart } from '@ladderwright/shared/parts';
import { createLiveAnalysisWorker } from '../create-live-analysis-worker';
import type { LiveAnalysisAnswer, LiveAnalysisRequest, LiveAnalysisResult } from '../live-analysis-messages';

export interface LiveAnalysis extends LiveAnalysisResult {
  /** True while the shown figures lag behind the typed document. */
  isPending: boolean;
  /**
   * Starts the analysis of a document about to be shown (called with the edit, before React renders it), so the
   * worker computes while the page renders the keystroke; the render that follows posts nothing more for it.
   */
  analyzeAhead: (document: Design) => void;
}

function sameIssues(a: Readonly<Record<string, string>>, b: Readonly<Record<string, string>>): boolean {
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
  /** The last document and shelf handed to the worker (posted or waiting). */
  const requestedRef = useRef<{ document: Design; shelf: readonly ShelfPart[] | undefined } | null>(null);
  const shelfRef = useRef(shelf);
  const sequenceRef = useRef(0);
  const [answered, setAnswered] = useState<{ document: Design; result: LiveAnalysisResult } | null>(null);

  useEffect(
    () => () => {
      workerRef.current?.terminate();
      workerRef.current = null;
      requestedRef.current = null;
    },
    [],
  );

  const request = useCallback((next: Design, nextShelf: readonly ShelfPart[] | undefined) => {
    const requested = requestedRef.current;
    if (requested && requested.document === next && requested.shelf === nextShelf) return;
    requestedRef.current = { document: next, shelf: nextShelf };
    const post = (worker: Worker, body: Omit<LiveAnalysisRequest, 'sequence'>) => {
      sequenceRef.current += 1;
      const numbered: LiveAnalysisRequest = { sequence: sequenceRef.current, ...body };
      latestRef.current = numbered;
      isBusyRef.current = true;
      worker.postMessage(numbered);
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
            result: sameIssues(previous?.result.issues ?? noResult.issues, event.data.result.issues)
              ? { ...event.data.result, issues: previous?.result.issues ?? noResult.issues }
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
        requestedRef.current = null;
        if (latest)
          setAnswered({
            document: latest.document,
            result: { ...noResult, engineError: event.message || 'The live preview stopped unexpectedly.' },
          });
      });
      workerRef.current = created;
      worker = created;
    }
    const body = { document: next, ...(nextShelf ? { shelf: nextShelf } : {}) };
    if (isBusyRef.current) waitingRef.current = body;
    else post(worker, body);
  }, []);

  useLayoutEffect(() => {
    shelfRef.current = shelf;
  });
  useEffect(() => request(document, shelf), [request, document, shelf]);
  const analyzeAhead = useCallback((next: Design) => request(next, shelfRef.current), [request]);

  const result = answered?.result ?? noResult;
  return { ...result, isPending: answered?.document !== document, analyzeAhead };
}
