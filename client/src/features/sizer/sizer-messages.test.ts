import { describe, expect, it } from 'vitest';
import type { SizerRequest } from '@ladderwright/shared/sizing';
import { answerSizerRequest } from './sizer-messages';

const request: SizerRequest = {
  targetOutputV: -3000,
  loadCurrentA: 20e-6,
  rippleMaxV: 30,
  drive: { kind: 'sine', peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 },
  topologies: ['half-wave'],
  safeVoltageV: 50,
  dischargeRule: '50V-1min',
  resultCount: 3,
};

describe('answerSizerRequest', () => {
  it('answers a run with its number and the engine result', () => {
    const answer = answerSizerRequest({ runId: 7, request });
    expect(answer.runId).toBe(7);
    if (!answer.isOk) throw new Error(answer.message);
    expect(answer.result.candidates.length).toBeGreaterThan(0);
    expect(answer.result.candidates.length).toBeLessThanOrEqual(3);
  }, 20_000);

  it('turns an engine refusal into an answer that carries its message', () => {
    const answer = answerSizerRequest({ runId: 8, request: { ...request, targetOutputV: 0 } });
    expect(answer).toMatchObject({ runId: 8, isOk: false });
    if (answer.isOk) throw new Error('a zero target was accepted');
    expect(answer.message).toContain('target output');
  });
});
