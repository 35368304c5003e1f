import { signInDelayS } from './sign-in-delay.service';

// Exponential backoff capped at one minute after four free failures: common practice, no source.
describe('signInDelayS', () => {
  it.each([
    [1, 0],
    [4, 0],
    [5, 1],
    [6, 2],
    [7, 4],
    [10, 32],
    [11, 60],
    [50, 60],
  ])('after %i failures in a row waits %i s', (failures, delayS) => {
    expect(signInDelayS(failures)).toBe(delayS);
  });
});
