import { describe, expect, it } from 'vitest';
import { DRIVER_SIZER_DEFAULTS, type SizerRequest } from '@ladderwright/shared/sizing';
import { answerDriverSizerRequest, answerSizerRequest } from './sizer-messages';

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

describe('answerDriverSizerRequest', () => {
  it('answers a driver run with supplies from the shared driver Sizer', () => {
    const answer = answerDriverSizerRequest({
      runId: 3,
      kind: 'driver',
      request: {
        targetOutputV: 1500,
        loadCurrentA: 5e-6,
        rippleMaxV: 20,
        stage: DRIVER_SIZER_DEFAULTS.stage,
        cellCounts: [2],
        ladderCells: [3],
        capacitorsF: [2.2e-9],
        bleedersOhm: [470e6],
      },
    });
    expect(answer.runId).toBe(3);
    if (!answer.isOk) throw new Error(answer.message);
    // ±3 %: the driver Sizer's stated tolerance.
    expect(Math.abs(answer.result.candidates[0]!.outputMeanV / 1500 - 1)).toBeLessThanOrEqual(0.03);
  }, 20_000);
});
