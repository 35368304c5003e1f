import { act, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { designExamples, type Design } from '@ladderwright/shared/designs';
import { answerLiveAnalysis, type LiveAnalysisAnswer, type LiveAnalysisRequest } from '../live-analysis-messages';
import { useLiveAnalysis } from './use-live-analysis';

/** Stands in for the module worker: keeps what is posted; the test answers when and in what order it likes. */
class FakeLiveWorker {
  posted: LiveAnalysisRequest[] = [];
  isTerminated = false;
  private listeners: Array<(event: MessageEvent<LiveAnalysisAnswer>) => void> = [];
  addEventListener(type: string, listener: (event: MessageEvent<LiveAnalysisAnswer>) => void) {
    if (type === 'message') this.listeners.push(listener);
  }
  postMessage(message: LiveAnalysisRequest) {
    this.posted.push(structuredClone(message));
  }
  terminate() {
    this.isTerminated = true;
  }
  answer(request: LiveAnalysisRequest) {
    const data = answerLiveAnalysis(request);
    for (const listener of this.listeners) listener({ data } as MessageEvent<LiveAnalysisAnswer>);
  }
}

const workers: FakeLiveWorker[] = [];

vi.mock('../create-live-analysis-worker', () => ({
  createLiveAnalysisWorker: () => {
    const worker = new FakeLiveWorker();
    workers.push(worker);
    return worker as unknown as Worker;
  },
}));

function withRippleTarget(rippleMaxV: number): Design {
  const copy = structuredClone(designExamples.detectorBias);
  copy.targets.rippleMaxV = rippleMaxV;
  return copy;
}

describe('useLiveAnalysis', () => {
  beforeEach(() => {
    workers.length = 0;
    vi.useFakeTimers();
  });
  afterEach(() => vi.useRealTimers());

  it('posts the document to one worker at once and shows the answer', () => {
    const { result } = renderHook(({ document }) => useLiveAnalysis(document), {
      initialProps: { document: designExamples.detectorBias },
    });
    expect(workers).toHaveLength(1);
    const first = workers[0]!.posted[0]!;
    expect(result.current.isPending).toBe(true);
    act(() => workers[0]!.answer(first));
    expect(result.current.isPending).toBe(false);
    expect(result.current.report?.designName).toBe(designExamples.detectorBias.name);
  });

  it('drops a late answer to an older document and keeps the latest one', () => {
    const { result, rerender } = renderHook(({ document }) => useLiveAnalysis(document), {
      initialProps: { document: designExamples.detectorBias },
    });
    const worker = workers[0]!;
    const bad = withRippleTarget(-1);
    rerender({ document: bad });
    // While the worker works on the first document, the second waits instead of queueing behind it.
    expect(worker.posted).toHaveLength(1);
    act(() => worker.answer(worker.posted[0]!));
    expect(worker.posted).toHaveLength(2);
    const [older, latest] = worker.posted as [LiveAnalysisRequest, LiveAnalysisRequest];
    expect(latest.sequence).toBeGreaterThan(older.sequence);
    expect(result.current.isPending).toBe(true);
    act(() => worker.answer(latest));
    expect(Object.keys(result.current.issues)).toContain('targets.rippleMaxV');
    // A late duplicate of the first document's answer is stale and must not replace the issues.
    act(() => worker.answer(older));
    expect(Object.keys(result.current.issues)).toContain('targets.rippleMaxV');
    expect(result.current.report).toBeNull();
    expect(result.current.isPending).toBe(false);
  });

  it('keeps only the newest of several edits made while the worker is busy', () => {
    const { result, rerender } = renderHook(({ document }) => useLiveAnalysis(document), {
      initialProps: { document: designExamples.detectorBias },
    });
    const worker = workers[0]!;
    rerender({ document: withRippleTarget(1) });
    rerender({ document: withRippleTarget(2) });
    const newest = withRippleTarget(3);
    rerender({ document: newest });
    act(() => worker.answer(worker.posted[0]!));
    expect(worker.posted).toHaveLength(2);
    expect(worker.posted[1]?.document.targets.rippleMaxV).toBe(3);
    act(() => worker.answer(worker.posted[1]!));
    expect(result.current.isPending).toBe(false);
    expect(result.current.report?.meetsTargets).toBeDefined();
  });

  it('posts an edit handed ahead before its render, and that render posts nothing more', () => {
    const { result, rerender } = renderHook(({ document }) => useLiveAnalysis(document), {
      initialProps: { document: designExamples.detectorBias },
    });
    const worker = workers[0]!;
    act(() => worker.answer(worker.posted[0]!));
    const edited = withRippleTarget(2);
    result.current.analyzeAhead(edited);
    // The worker has the edit before React renders it.
    expect(worker.posted).toHaveLength(2);
    expect(worker.posted[1]?.document.targets.rippleMaxV).toBe(2);
    rerender({ document: edited });
    expect(worker.posted).toHaveLength(2);
    expect(result.current.isPending).toBe(true);
    act(() => worker.answer(worker.posted[1]!));
    expect(result.current.isPending).toBe(false);
    expect(result.current.report?.designName).toBe(edited.name);
  });

  it('keeps the identity of unchanged issues from the first answer on, so the form need not render again', () => {
    const { result } = renderHook(({ document }) => useLiveAnalysis(document), {
      initialProps: { document: designExamples.detectorBias },
    });
    const before = result.current.issues;
    act(() => workers[0]!.answer(workers[0]!.posted[0]!));
    expect(result.current.report).not.toBeNull();
    expect(result.current.issues).toBe(before);
  });

  it('terminates its worker on unmount', () => {
    const { unmount } = renderHook(() => useLiveAnalysis(designExamples.detectorBias));
    unmount();
    expect(workers[0]?.isTerminated).toBe(true);
  });
});
