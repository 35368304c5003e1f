import { useEffect, useRef, useState } from 'react';
import { useDebouncedValue } from '@mantine/hooks';
import type { Design } from '@ladderwright/shared/designs';
import type { ShelfPart } from '@ladderwright/shared/parts';
import { createLiveAnalysisWorker } from '../create-live-analysis-worker';
import type { LiveAnalysisAnswer, LiveAnalysisRequest, LiveAnalysisResult } from '../live-analysis-messages';

export interface LiveAnalysis extends LiveAnalysisResult {
  /** True while the shown figures lag behind the typed document. */
  isPending: boolean;
}

const debounceMs = 150;

const noResult: LiveAnalysisResult = { report: null, issues: {}, engineError: null, partIssues: [] };

/**
 * Runs the shared engine on the document being edited, ~150 ms after the last keystroke, in a Web Worker
 * (a driver design's analysis would otherwise hold up typing). With the project's `shelf`, the referenced
 * parts' ratings are filled in first, as the server does for a saved revision, so the preview and the stored
 * report agree. Each request is numbered; an answer to anything but the latest request is dropped.
 */
export function useLiveAnalysis(document: Design, shelf?: readonly ShelfPart[]): LiveAnalysis {
  const [debounced] = useDebouncedValue(document, debounceMs);
  const workerRef = useRef<Worker | null>(null);
  const latestRef = useRef<LiveAnalysisRequest | null>(null);
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
    let worker = workerRef.current;
    if (!worker) {
      worker = createLiveAnalysisWorker();
      worker.addEventListener('message', (event: MessageEvent<LiveAnalysisAnswer>) => {
        const latest = latestRef.current;
        if (!latest || event.data.sequence !== latest.sequence) return;
        setAnswered({ document: latest.document, result: event.data.result });
      });
      worker.addEventListener('error', (event: ErrorEvent) => {
        event.preventDefault();
        const latest = latestRef.current;
        workerRef.current?.terminate();
        workerRef.current = null;
        if (latest)
          setAnswered({
            document: latest.document,
            result: { ...noResult, engineError: event.message || 'The live preview stopped unexpectedly.' },
          });
      });
      workerRef.current = worker;
    }
    sequenceRef.current += 1;
    const request: LiveAnalysisRequest = {
      sequence: sequenceRef.current,
      document: debounced,
      ...(shelf ? { shelf } : {}),
    };
    latestRef.current = request;
    worker.postMessage(request);
  }, [debounced, shelf]);

  const result = answered?.result ?? noResult;
  return { ...result, isPending: debounced !== document || answered?.document !== debounced };
}
