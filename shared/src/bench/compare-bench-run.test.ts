import { describe, expect, it } from 'vitest';
import {
  benchVerdict,
  captureFigures,
  compareBenchRun,
  interpolateCurve,
  predictionFromReport,
} from './compare-bench-run';
import { benchLimits, benchTextIssue } from './bench-limits';
import type { BenchPrediction } from './bench.types';

// Hand-checked case (worked by hand, no outside source): a straight regulation line from 1000 V at no load
// to 800 V at 200 µA. Float comparisons use 9 digits: the arithmetic is exact to far better than that.
const prediction: BenchPrediction = {
  regulation: [
    { x: 0, y: 1000 },
    { x: 100e-6, y: 900 },
    { x: 200e-6, y: 800 },
  ],
  outputMeanV: 900,
  ripplePeakToPeakV: 10,
  loadCurrentA: 100e-6,
};

describe('interpolateCurve', () => {
  it.each([
    [0, 1000],
    [50e-6, 950],
    [150e-6, 850],
    [200e-6, 800],
  ])('at %s A gives %s V', (x, expected) => {
    expect(interpolateCurve(prediction.regulation, x)).toBeCloseTo(expected, 9);
  });

  it('gives null outside the curve instead of extrapolating', () => {
    expect(interpolateCurve(prediction.regulation, 250e-6)).toBeNull();
    expect(interpolateCurve(prediction.regulation, -1e-6)).toBeNull();
  });

  it('sorts an unsorted curve first', () => {
    expect(interpolateCurve([...prediction.regulation].reverse(), 50e-6)).toBeCloseTo(950, 9);
  });
});

describe('benchVerdict', () => {
  // marginPct = (tol − worst)/tol·100; the thresholds 0 and 20 % follow the Checks (common practice, no source).
  it.each([
    [0.01, 0.05, 'pass', 80],
    [0.045, 0.05, 'marginal', 10],
    [0.06, 0.05, 'fail', -20],
    [0.04, 0.05, 'pass', 20],
  ] as const)('worst %s against ±%s is %s with margin %s %%', (worst, tolerance, verdict, margin) => {
    const result = benchVerdict(worst, tolerance);
    expect(result.verdict).toBe(verdict);
    expect(result.marginPct).toBeCloseTo(margin, 9);
  });

  it('refuses a tolerance that is not positive', () => {
    expect(() => benchVerdict(0.01, 0)).toThrow(/tolerance must be positive/);
  });
});

describe('compareBenchRun, load sweep', () => {
  const measured = [
    { x: 50e-6, y: 940 },
    { x: 150e-6, y: 830 },
    { x: 250e-6, y: 700 },
  ];

  it('finds the worst deviation among 500,000 points (a spread into Math.max overflows the stack)', () => {
    // Every point on the line except one 2 % low: (882 − 900)/900 = −0.02 at 100 µA.
    const many = Array.from({ length: 500_000 }, (_, i) => ({
      x: (i / 500_000) * 200e-6,
      y: 1000 - (i / 500_000) * 200,
    }));
    many[250_000] = { x: 100e-6, y: 882 };
    expect(compareBenchRun('load-sweep', many, prediction, 0.05).worstDeviation).toBeCloseTo(0.02, 9);
  });

  it('gives the deviation per point and skips the point beyond the curve', () => {
    const result = compareBenchRun('load-sweep', measured, prediction, 0.05);
    // (940 − 950)/950 = −0.0105263158; (830 − 850)/850 = −0.0235294118.
    expect(result.points[0]?.predictedV).toBeCloseTo(950, 9);
    expect(result.points[0]?.deviation).toBeCloseTo(-0.0105263158, 9);
    expect(result.points[1]?.deviation).toBeCloseTo(-0.0235294118, 9);
    expect(result.points[2]).toEqual({ x: 250e-6, measuredV: 700, predictedV: null, deviation: null });
    expect(result.worstDeviation).toBeCloseTo(0.0235294118, 9);
    expect(result.comparedCount).toBe(2);
    expect(result.skippedCount).toBe(1);
    // (0.05 − 0.0235294118)/0.05·100 = 52.941176 %.
    expect(result.verdict).toBe('pass');
    expect(result.marginPct).toBeCloseTo(52.9411765, 6);
  });

  it.each([
    [0.025, 'marginal', 5.8823529],
    [0.02, 'fail', -17.6470588],
  ] as const)('against ±%s gives %s with margin %s %%', (tolerance, verdict, margin) => {
    const result = compareBenchRun('load-sweep', measured, prediction, tolerance);
    expect(result.verdict).toBe(verdict);
    expect(result.marginPct).toBeCloseTo(margin, 6);
  });

  it('compares magnitudes, so a negative ladder measured as negative numbers gives the same result', () => {
    const negative = measured.map((point) => ({ x: -point.x, y: -point.y }));
    expect(compareBenchRun('load-sweep', negative, prediction, 0.05).worstDeviation).toBeCloseTo(0.0235294118, 9);
  });

  it('refuses a sweep with no point inside the predicted range', () => {
    expect(() =>
      compareBenchRun(
        'load-sweep',
        [
          { x: 1, y: 5 },
          { x: 2, y: 4 },
        ],
        prediction,
        0.05,
      ),
    ).toThrow(/predicted load range/);
  });
});

describe('compareBenchRun, scope capture', () => {
  it('compares mean output and peak-to-peak ripple with the prediction', () => {
    // Triangle 895 -> 905 -> 895 over 2 ms: mean 900 V, ripple 10 V -> both deviations 0.
    const capture = [
      { x: 0, y: -895 },
      { x: 1e-3, y: -905 },
      { x: 2e-3, y: -895 },
    ];
    const result = compareBenchRun('scope-capture', capture, prediction, 0.05);
    expect(result.figures.map((figure) => figure.key)).toEqual(['outputMeanV', 'ripplePeakToPeakV']);
    expect(result.figures[0]?.measured).toBeCloseTo(900, 9);
    expect(result.figures[1]?.measured).toBeCloseTo(10, 9);
    expect(result.worstDeviation).toBeCloseTo(0, 9);
    expect(result.verdict).toBe('pass');
    expect(result.marginPct).toBeCloseTo(100, 9);
  });

  it('weights the mean by time for uneven sampling', () => {
    // 0..1 ms at 900 V, then 1..3 ms ramp 900 -> 960: area 0.9 + 1.86 = 2.76 V·ms over 3 ms = 920 V.
    expect(
      captureFigures([
        { x: 0, y: 900 },
        { x: 1e-3, y: 900 },
        { x: 3e-3, y: 960 },
      ]).meanV,
    ).toBeCloseTo(920, 9);
  });
});

describe('predictionFromReport', () => {
  it('reads the curve, mean and ripple of a stored report as magnitudes', () => {
    const report = {
      outputMeanV: -900,
      ripplePeakToPeakV: 10,
      analysis: { loadCurrentA: 1e-4 },
      curves: {
        regulation: [
          { x: 0, y: 1000 },
          { x: 2e-4, y: 800 },
        ],
      },
    };
    expect(predictionFromReport(report)).toEqual({
      regulation: [
        { x: 0, y: 1000 },
        { x: 2e-4, y: 800 },
      ],
      outputMeanV: 900,
      ripplePeakToPeakV: 10,
      loadCurrentA: 1e-4,
    });
  });

  it('refuses a report without a regulation curve', () => {
    expect(() => predictionFromReport({ outputMeanV: 1 })).toThrow(/no predicted output curve/);
  });
});

describe('benchTextIssue', () => {
  it('passes a file at the row limit and refuses one row more, naming the data file', () => {
    const file = (rows: number) => `current (uA),voltage (V)\n${'1,2\n'.repeat(rows)}`;
    expect(benchTextIssue(file(benchLimits.maxDataRows))).toBeNull();
    expect(benchTextIssue(file(benchLimits.maxDataRows + 51))).toMatchObject({ path: 'data' });
  });

  it('refuses a line longer than the limit before any CSV parsing', () => {
    expect(benchTextIssue(`time,voltage\n${','.repeat(benchLimits.maxLineLength + 1)}`)).toEqual({
      path: 'data',
      message: `line 2 is longer than ${benchLimits.maxLineLength} characters`,
    });
  });
});
