import { answerSizerRequest, type SizerWorkerRequest } from './sizer-messages';

// The Sizer's search takes the thread for a while; here it runs off the page's thread.
const scope = globalThis as unknown as {
  addEventListener(type: 'message', listener: (event: MessageEvent<SizerWorkerRequest>) => void): void;
  postMessage(message: unknown): void;
};

scope.addEventListener('message', (event) => {
  scope.postMessage(answerSizerRequest(event.data));
});
