import { answerLiveAnalysis, type LiveAnalysisRequest } from './live-analysis-messages';

// A driver design's analysis takes tens of milliseconds; here it runs off the page's thread, so typing stays smooth.
const scope = globalThis as unknown as {
  addEventListener(type: 'message', listener: (event: MessageEvent<LiveAnalysisRequest>) => void): void;
  postMessage(message: unknown): void;
};

scope.addEventListener('message', (event) => {
  scope.postMessage(answerLiveAnalysis(event.data));
});
