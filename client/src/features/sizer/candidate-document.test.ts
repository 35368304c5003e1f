import { validateDesign } from '@ladderwright/shared/designs';
import { sizeLadder, type SizerRequest } from '@ladderwright/shared/sizing';
import { describe, expect, it } from 'vitest';
import { candidateDocument } from './candidate-document';

// The Sizer page's own defaults (sizer-panel.tsx) and a positive 4 kV request that picks the taller diodes.
const requests: SizerRequest[] = [
  {
    targetOutputV: -6000,
    loadCurrentA: 30e-6,
    rippleMaxV: 30,
    drive: { kind: 'sine', peakV: 480, frequencyHz: 25e3, sourceResistanceOhm: 150 },
    topologies: ['half-wave', 'full-wave'],
    safeVoltageV: 50,
    dischargeRule: '50V-1min',
    resultCount: 12,
  },
  {
    targetOutputV: 4000,
    loadCurrentA: 300e-6,
    rippleMaxV: 20,
    drive: { kind: 'sine', peakV: 600, frequencyHz: 25e3, sourceResistanceOhm: 150 },
    topologies: ['half-wave', 'full-wave'],
    safeVoltageV: 50,
    dischargeRule: '50V-1min',
    resultCount: 12,
  },
];

describe('candidateDocument', () => {
  it.each(requests.map((r) => [r.targetOutputV, r] as const))(
    'turns every Sizer candidate for %s V into a valid design document',
    (_, request) => {
      const { candidates } = sizeLadder(request);
      expect(candidates.length).toBeGreaterThan(0);
      for (const candidate of candidates) {
        const doc = candidateDocument(candidate, request, `Sizer: rank ${candidate.rank}`);
        expect(() => validateDesign(doc)).not.toThrow();
      }
    },
  );
});
