import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { ladderInputOf, resolveDrive } from '../analysis/analyze-design';
import { analyzeLadder, prepareLadder, terminalMeanAt } from './analyze-ladder';
import { ladderCurves, resizeCapacitors } from './ladder-curves';
import type { LadderInput } from './ladder.types';

// Ideal diode: Shockley drop below 1e-7 V at these currents (see analyze-ladder.test.ts).
const idealDiode = { saturationCurrentA: 1e-300, emissionCoefficient: 1e-9, seriesResistanceOhm: 0 };
const cascade: LadderInput = {
  topology: 'half-wave',
  capacitorsF: Array(16).fill(0.05e-6),
  drive: { kind: 'sine', peakV: 125e3, frequencyHz: 150, sourceResistanceOhm: 0 },
  diode: idealDiode,
  polarity: 1,
  load: { kind: 'current', currentA: 5e-3 },
  bleederOhm: null,
  seriesOutputResistanceOhm: 0,
};

describe('ladderCurves', () => {
  const curves = ladderCurves(cascade);

  it('optimum stage count within one stage of n_opt = √(Vmax f C / I) = 13.7 (J. Lux; FOSSEE companion, read)', () => {
    expect(Math.abs(curves.optimumStages - 13.7)).toBeLessThanOrEqual(1);
  });

  it('maximum output near (4/3)·n_opt·Vmax (derived in REFERENCES.md §1), lower by the half-cycle discharge term', () => {
    const estimate = (4 / 3) * Math.sqrt((125e3 * 150 * 0.05e-6) / 5e-3) * 125e3;
    // The exact mean drop exceeds ΔV0 by n·q/(2C) (see analyze-ladder.test.ts): about 3 % here; tolerance 5 %.
    expect(curves.optimumOutputV).toBeLessThan(estimate);
    expect(curves.optimumOutputV / estimate).toBeGreaterThan(0.95);
  });

  it('regulation curve starts at the no-load output, falls monotonically and reaches zero at short circuit', () => {
    const first = curves.regulation[0];
    const last = curves.regulation[curves.regulation.length - 1];
    expect(first?.x).toBe(0);
    expect(Math.abs((first?.y ?? NaN) - analyzeLadder(cascade).noLoadOutputV)).toBeLessThan(1e-6);
    for (let i = 1; i < curves.regulation.length; i += 1) {
      expect(curves.regulation[i]?.y ?? NaN).toBeLessThan(curves.regulation[i - 1]?.y ?? NaN);
    }
    expect(last?.y).toBeLessThan(1e-6 * (first?.y ?? 1));
    // With ideal diodes the model is linear in current: short circuit = no-load / output impedance (1e-6 relative).
    const z = analyzeLadder(cascade).outputImpedanceOhm;
    expect(Math.abs(curves.shortCircuitCurrentA / ((first?.y ?? NaN) / z) - 1)).toBeLessThan(1e-6);
  });
});

describe('ladderCurves: the sampled stage scan against the full scan of every stage count', () => {
  // The demo designs' own ladders (sine drives and the driver's pulse drive) and the textbook cascade above.
  const inputs: Array<[string, LadderInput]> = [
    ['cascade', cascade],
    ...Object.entries(designExamples).map(([name, design]): [string, LadderInput] => {
      const resolved = resolveDrive(design);
      return [name, ladderInputOf(design, resolved.drive, resolved.currentLimitA)];
    }),
  ];
  const fullScan = (input: LadderInput, lastStages: number) =>
    Array.from({ length: lastStages }, (_, i) =>
      terminalMeanAt(prepareLadder({ ...input, capacitorsF: resizeCapacitors(input, i + 1) }), 0),
    );

  it.each(inputs)(
    '%s: the same optimum, every plotted count exact, the counts between within 1 % of the straight line',
    (_, input) => {
      const curves = ladderCurves(input);
      const points = curves.outputVsStages;
      const last = points[points.length - 1] as { x: number; y: number };
      const exact = fullScan(input, last.x);
      // Optimum: the first maximum of the full scan, exactly (the same model at the same counts).
      const maximum = Math.max(...exact);
      expect(curves.optimumStages).toBe(exact.indexOf(maximum) + 1);
      expect(curves.optimumOutputV).toBe(maximum);
      for (const p of points) expect(p.y).toBe(exact[p.x - 1]);
      // Between plotted counts the chart draws straight lines: within 1 % of the maximum output (the curve is
      // near linear far from the optimum and sampled at every count close to it).
      for (let k = 1; k < points.length; k += 1) {
        const a = points[k - 1] as { x: number; y: number };
        const b = points[k] as { x: number; y: number };
        for (let n = a.x + 1; n < b.x; n += 1) {
          const lineV = a.y + ((b.y - a.y) * (n - a.x)) / (b.x - a.x);
          expect(Math.abs(lineV - (exact[n - 1] as number))).toBeLessThan(0.01 * maximum);
        }
      }
      // The scan ends with the maximum clearly passed: 2 % below it.
      expect(last.y).toBeLessThanOrEqual(0.98 * maximum);
    },
  );

  it.each(inputs)('%s: short-circuit current as 80 halvings of the bracket find it (1e-9 relative)', (_, input) => {
    const prepared = prepareLadder({ ...input, load: null });
    let low = 0;
    let high = 1e-9;
    while (terminalMeanAt(prepared, high) > 0) high *= 2;
    for (let i = 0; i < 80; i += 1) {
      const mid = (low + high) / 2;
      if (terminalMeanAt(prepared, mid) > 0) low = mid;
      else high = mid;
    }
    // 1e-9: both resolve the root far below that; the model's float noise near short circuit is larger than 1e-12.
    expect(Math.abs(ladderCurves(input).shortCircuitCurrentA / high - 1)).toBeLessThan(1e-9);
  });
});

describe('resizeCapacitors on a one-cell half-wave ladder', () => {
  // The single capacitor of a one-cell half-wave ladder stands for both columns when the stage scan grows it;
  // before, the scan looped for ever on it (the capacitor list it grew from was empty).
  const oneCell: LadderInput = { ...cascade, capacitorsF: [0.05e-6] };

  it('grows the ladder from its single capacitor', () => {
    expect(resizeCapacitors(oneCell, 3)).toEqual(Array(6).fill(0.05e-6));
  });

  it('gives a finite optimum for the stage scan', () => {
    const curves = ladderCurves(oneCell);
    expect(Number.isFinite(curves.optimumOutputV)).toBe(true);
    // Same capacitors and load as the 16-cell cascade above: the optimum is the same, 13.7 (J. Lux) within one.
    expect(Math.abs(curves.optimumStages - 13.7)).toBeLessThanOrEqual(1);
  });
});

/** A pulse-driven cascade of unequal capacitors: the kept networks carry flat-top rates too. */
const pulse: LadderInput = {
  ...cascade,
  capacitorsF: [2.2e-9, 3.3e-9, 2.2e-9, 3.3e-9],
  drive: {
    kind: 'pulse',
    forwardPeakV: 200,
    flybackPeakV: 1500,
    frequencyHz: 3e4,
    dutyCycle: 0.8,
    sourceResistanceOhm: 60,
  },
  load: { kind: 'current', currentA: 2e-6 },
};

describe('ladderCurves stage scan kept between calls', () => {
  it('scans a ladder edited in all but its capacitors as freshly prepared networks do', () => {
    // The second call changes drive, diode, load and bleeder.
    ladderCurves(pulse);
    const edited: LadderInput = {
      ...pulse,
      drive: {
        kind: 'pulse',
        forwardPeakV: 180,
        flybackPeakV: 1400,
        frequencyHz: 2.5e4,
        dutyCycle: 0.7,
        sourceResistanceOhm: 80,
      },
      diode: { saturationCurrentA: 2e-9, emissionCoefficient: 8, seriesResistanceOhm: 40 },
      load: { kind: 'current', currentA: 5e-6 },
      bleederOhm: 4e8,
    };
    const scan = ladderCurves(edited).outputVsStages;
    expect(scan.length).toBeGreaterThan(5);
    for (const { x, y } of scan) {
      expect(y).toBe(terminalMeanAt(prepareLadder({ ...edited, capacitorsF: resizeCapacitors(edited, x) }), 0));
    }
  });
});

describe('ladderCurves stage scan after capacitor edits', () => {
  it('scans edited capacitors on taken-over networks as freshly prepared networks do', () => {
    // More edits than the scan remembers, so later scans take over earlier ones' networks; unequal values
    // change the flat-top rates, and one edit makes a capacitor ten times larger.
    for (let edit = 0; edit < 12; edit += 1) {
      const capacitorsF = pulse.capacitorsF.map((f, c) =>
        c === edit % 4 ? f * (edit === 7 ? 10 : 1 + 0.05 * edit) : f,
      );
      const edited: LadderInput = { ...pulse, capacitorsF };
      const scan = ladderCurves(edited).outputVsStages;
      expect(scan.length).toBeGreaterThan(5);
      for (const { x, y } of scan) {
        expect(y).toBe(terminalMeanAt(prepareLadder({ ...edited, capacitorsF: resizeCapacitors(edited, x) }), 0));
      }
    }
  });
});
