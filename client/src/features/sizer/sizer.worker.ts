import {
  answerDriverSizerRequest,
  answerSizerRequest,
  type DriverSizerWorkerRequest,
  type SizerWorkerRequest,
} from './sizer-messages';

// The Sizer's search takes the thread for a while; here it runs off the page's thread.
const scope = globalThis as unknown as {
  addEventListener(
    type: 'message',
    listener: (event: MessageEvent<SizerWorkerRequest | DriverSizerWorkerRequest>) => void,
  ): void;
  postMessage(message: unknown): void;
};

scope.addEventListener('message', (event) => {
  const message = event.data;
  scope.postMessage('kind' in message ? answerDriverSizerRequest(message) : answerSizerRequest(message));
});
