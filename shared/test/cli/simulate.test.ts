import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { designExamples } from '../../src/designs/design-examples';
import { hasNgspice, runNgspice } from '../ngspice/run-ngspice';

// The commands as a user runs them: the package's bin script in a child process.
const bin = join(__dirname, '..', '..', 'bin', 'ladderwright.cjs');
const run = (...args: string[]): string =>
  execFileSync(process.execPath, [bin, ...args], { encoding: 'utf8', timeout: 60_000 });
const dir = mkdtempSync(join(tmpdir(), 'lw-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const ladderFlags = ['--stages', '2', '--peak', '1k', '--freq', '20k', '--cap', '10n', '--load-current', '100u'];

describe('ladderwright simulate', () => {
  it('prints the steady-state summary of a bare ladder from flags', () => {
    const out = JSON.parse(run('simulate', ...ladderFlags)) as Record<string, unknown>;
    expect(Object.keys(out)).toEqual(
      expect.arrayContaining(['outputMeanV', 'ripplePeakToPeakV', 'timeToSteadyStateS', 'cyclesSimulated', 'method']),
    );
    expect(out.method).toBe('periodic-steady-state');
    // A converged periodic steady state is the settled value: nothing left to drift.
    expect(out.isSettled).toBe(true);
    expect(out.remainingDriftV).toBe(0);
    // Textbook check (REFERENCES.md §1): n = 2, q/C = 0.5 V, ΔV0 = 0.5·(16/3 + 2 − 1/3) = 3.5 V below
    // 2n·Vmax = 4 kV; ripple (q/C)·n(n+1)/2 = 1.5 V. Within 1 % on the mean (the diodes' drop and the
    // textbook's idealization) and 50 % on the ripple (the textbook takes ideal diodes and a stiff source;
    // the measured ripple is 2.07 V).
    expect(Math.abs((out.outputMeanV as number) / (4000 - 3.5) - 1)).toBeLessThan(0.01);
    expect(Math.abs((out.ripplePeakToPeakV as number) / 1.5 - 1)).toBeLessThan(0.5);
  });

  it('adds the bleeder discharge time with --discharge', () => {
    const out = JSON.parse(
      run('simulate', ...ladderFlags, '--discharge', '--bleeder', '100M', '--safe-voltage', '50'),
    ) as Record<string, number>;
    // RC ln(V0/Vsafe) (REFERENCES.md §4) with the bleeder across the ladder top: the four 10 nF capacitors
    // discharge as two series columns, seen from the top about 10 nF, so t ≈ 1 s·ln(4000/50) = 4.4 s; the
    // trapped charge of the column structure makes it longer. Bound: between 1× and 2× that estimate.
    expect(out.dischargeTimeS).toBeGreaterThan(4.38);
    expect(out.dischargeTimeS).toBeLessThan(2 * 4.38);
  });

  it('simulates a design driven by its blocking oscillator whole: transistor, transformer and ladder', () => {
    // The demo tester with 100 pF capacitors, so that the ladder settles in about 10 ms of simulated time.
    const design = structuredClone(designExamples.surfaceChargeTester);
    design.multiplier.capacitors = design.multiplier.capacitors.map((c) => ({ ...c, valueF: 100e-12 }));
    const path = join(dir, 'driver-design.json');
    writeFileSync(path, JSON.stringify(design));
    const out = JSON.parse(run('simulate', path)) as {
      method: string;
      outputMeanV: number;
      energy: { suppliedJ: number; dissipatedJ: number; storedChangeJ: number };
      oscillationFrequencyHz: number;
      dutyOnFraction: number;
      inputPowerW: number;
      outputPowerW: number;
      efficiency: number;
      losses: Record<string, number>;
      timeTo90PercentS: number | null;
      timeTo1PercentS: number | null;
      isSettled: boolean;
      startUpFinalOutputV: number | null;
    };
    expect(out.method).toBe('transient');
    expect(out.outputMeanV).toBeGreaterThan(1000);
    expect(out.isSettled).toBe(true);
    // Bench figures in SI units over whole cycles: power in = power out + every loss (Tellegen's theorem
    // over whole cycles of a settled state), within 2 %; efficiency is their ratio, 0–1.
    const lossesW = Object.values(out.losses).reduce((a, b) => a + b, 0);
    expect(Math.abs((out.outputPowerW + lossesW) / out.inputPowerW - 1)).toBeLessThan(0.02);
    expect(out.efficiency).toBeCloseTo(out.outputPowerW / out.inputPowerW, 12);
    expect(out.dutyOnFraction).toBeGreaterThan(0);
    expect(out.dutyOnFraction).toBeLessThan(1);
    // The cold start settles on the warm steady state's output (1 %: both settle to 0.1 % projected) and
    // reaches 90 % before it stays within 1 %.
    expect(Math.abs(out.startUpFinalOutputV! / out.outputMeanV - 1)).toBeLessThan(0.01);
    expect(out.timeTo90PercentS!).toBeGreaterThan(0);
    expect(out.timeTo1PercentS!).toBeGreaterThan(out.timeTo90PercentS!);
    // Tellegen's theorem: supplied = dissipated + stored change, within 2 % (the bound).
    expect(Math.abs((out.energy.dissipatedJ + out.energy.storedChangeJ) / out.energy.suppliedJ - 1)).toBeLessThan(0.02);
    // Its netlist carries the transistor stage, not an ideal source.
    expect(run('netlist', path)).toMatch(/^Q1 col base 0 /m);
  });

  it.skipIf(!hasNgspice())('netlist DESIGN.json prints a .cir that ngspice runs', async () => {
    const path = join(dir, 'design.json');
    writeFileSync(path, JSON.stringify(designExamples.ionizerBar));
    const netlist = run('netlist', path);
    expect(netlist).toMatch(/^\.tran /m);
    const ng = await runNgspice(netlist, ['v(top)']);
    expect(ng.timeS.length).toBeGreaterThan(100);
  });
});
