import { describe, expect, it } from 'vitest';
import { anchorFromValue, anchorOptionsOf, anchorValue } from './anchor-options';

describe('anchorOptionsOf', () => {
  it('lists scalar document fields as paths with indices and numeric report keys as results', () => {
    const options = anchorOptionsOf(
      { name: 'Bias', multiplier: { stages: 3, capacitors: [{ valueF: 1e-9 }, { valueF: 2e-9 }] }, notes: null },
      { outputMeanV: -900, ripplePeakToPeakV: 0.4, dischargeTimeS: null, checks: [{ id: 'x' }], caution: 'text' },
    );
    expect(options.inputPaths).toEqual([
      'name',
      'multiplier.stages',
      'multiplier.capacitors[0].valueF',
      'multiplier.capacitors[1].valueF',
      'notes',
    ]);
    expect(options.resultKeys).toEqual(['outputMeanV', 'ripplePeakToPeakV']);
  });
});

describe('anchorValue / anchorFromValue', () => {
  it('round-trips an anchor and refuses unknown kinds or empty paths', () => {
    const anchor = { kind: 'input', path: 'multiplier.capacitors[0].valueF' } as const;
    expect(anchorFromValue(anchorValue(anchor))).toEqual(anchor);
    expect(anchorFromValue('result:ripplePeakToPeakV')).toEqual({ kind: 'result', path: 'ripplePeakToPeakV' });
    expect(anchorFromValue('other:x')).toBeNull();
    expect(anchorFromValue('input:')).toBeNull();
    expect(anchorFromValue('')).toBeNull();
  });
});
