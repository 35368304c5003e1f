import { describe, expect, it } from 'vitest';
import { calibrateDesign, inProcessPredictor, loadSweepEstimate } from '../../src/calibration';
import { designExamples } from '../../src/designs/design-examples';

// A sweep 3 % below the demo tester's own estimate cannot be explained by the transistor's gain: the fit runs to
// the end of the gain's prior range and ±t·se there reaches far past it (3119 on this log scale). The interval
// stops at the range's end: a bounded parameter's interval within its bounds (common practice, no source).
describe('linearized intervals at a prior bound', () => {
  it('stop at the prior range instead of running past it', async () => {
    const design = designExamples.surfaceChargeTester;
    const currents = [0, 2.5e-6, 5e-6, 7.5e-6, 10e-6, 12.5e-6];
    const measured = loadSweepEstimate(design, currents).map((v) => v * 0.97);
    const result = await calibrateDesign(
      {
        design,
        parameters: [{ id: 'transistorGain', prior: { min: 20, max: 500 } }],
        datasets: [
          {
            benchRunId: 'sweep',
            label: 'sweep',
            use: 'load-sweep',
            points: currents.map((x, i) => ({ x, y: measured[i]! })),
          },
        ],
      },
      inProcessPredictor(),
    );
    const gain = result.parameters[0]!;
    expect(gain.intervalMethod).toBe('linearized');
    expect(gain.interval).not.toBeNull();
    expect(gain.interval!.low).toBeGreaterThanOrEqual(20);
    expect(gain.interval!.high).toBeLessThanOrEqual(500);
    expect(gain.interval!.low).toBeLessThanOrEqual(gain.value);
    expect(gain.interval!.high).toBeGreaterThanOrEqual(gain.value);
  });
});
