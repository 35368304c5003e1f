import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { designExamples } from '../../src/designs/design-examples';

const repoRoot = join(__dirname, '../../..');
const fixtures = join(__dirname, '../fixtures/designs');

function ladderwright(...args: string[]): { status: number | null; stdout: string; stderr: string } {
  // Through npx from the repository root, as a user runs it: no build step.
  const result = spawnSync('npx', ['--no-install', 'ladderwright', ...args], {
    cwd: repoRoot,
    encoding: 'utf8',
    timeout: 60_000,
  });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

const reportFields = [
  'noLoadOutputV',
  'outputMeanV',
  'outputMinV',
  'outputMaxV',
  'ripplePeakToPeakV',
  'droopV',
  'outputImpedanceOhm',
  'optimumStages',
  'textbookRippleV',
  'textbookDropV',
  'storedEnergyJ',
  'storedChargeC',
  'dischargeTimeS',
  'checks',
];

describe('ladderwright command line', () => {
  it('ladder: the n = 8 cascade with prefixed values reproduces the published ripple and ΔV0', () => {
    const run = ladderwright(
      'ladder',
      '--topology',
      'half-wave',
      '--stages',
      '8',
      '--peak',
      '125 kV',
      '--freq',
      '150',
      '--cap',
      '0.05u',
      '--load-current',
      '5m',
      '--diode-is',
      '1e-300',
      '--diode-n',
      '1e-9',
      '--diode-rs',
      '0',
    );
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    for (const field of reportFields) expect(report).toHaveProperty(field);
    // FOSSEE companion ch. 6 example (read), REFERENCES.md §1: ΔV0 248.0 kV, ripple 24.0 kV; printed to 0.1 kV.
    expect(Math.abs(report.textbookDropV - 248.0e3)).toBeLessThan(0.05e3);
    expect(Math.abs(report.ripplePeakToPeakV - 24.0e3)).toBeLessThan(0.05e3);
    expect(report.dischargeTimeS).toBeNull(); // no bleeder, no safe voltage
  });

  it('ladder: with a bleeder and a safe voltage it reports the discharge time and its check', () => {
    const run = ladderwright(
      'ladder',
      '--cells',
      '4',
      '--peak',
      '1k',
      '--freq',
      '20k',
      '--cap',
      '10n',
      '--bleeder',
      '100M',
      '--safe-voltage',
      '50',
    );
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    expect(report.dischargeTimeS).toBeGreaterThan(0);
    expect(report.checks.find((c: { id: string }) => c.id === 'discharge-time')).toBeDefined();
    expect(report.caution).toMatch(/High voltage can kill/);
  });

  it('ladder --caps takes per-capacitor values in the documented order and a bridge topology', () => {
    const run = ladderwright(
      'ladder',
      '--topology',
      'bridge',
      '--caps',
      '1u,1u',
      '--peak',
      '1k',
      '--freq',
      '50',
      '--load-r',
      '10M',
      '--text',
    );
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/no-load output\s+2 kV/);
  });

  it('analyze: prints the full JSON report of an ok fixture', () => {
    const run = ladderwright('analyze', join(fixtures, 'ok/bench-four-cell.json'));
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    for (const field of reportFields) expect(report).toHaveProperty(field);
    expect(report.designName).toBe('Bench doubler');
    // Four cells on a 1 kV peak: no-load 4 kV minus the drop the bleeder current causes (< 1 %).
    expect(report.noLoadOutputV).toBeLessThan(4000);
    expect(report.noLoadOutputV).toBeGreaterThan(3960);
  });

  it('analyze: a driver design carries the estimate under the simulation’s names, the closed-form optimum beside the whole one', () => {
    const dir = mkdtempSync(join(tmpdir(), 'lw-analyze-'));
    const file = join(dir, 'driver.json');
    writeFileSync(file, JSON.stringify(designExamples.surfaceChargeTester));
    const run = ladderwright('analyze', file);
    expect(run.status).toBe(0);
    const report = JSON.parse(run.stdout);
    for (const field of [
      'oscillationFrequencyHz',
      'dutyOnFraction',
      'primaryCurrentPeakA',
      'collectorVoltagePeakV',
      'secondaryVoltagePeakPositiveV',
      'secondaryVoltagePeakNegativeV',
      'inputPowerW',
      'outputPowerW',
      'efficiency',
      'losses',
    ])
      expect(report, field).toHaveProperty(field);
    expect(report.efficiency).toBe(report.driver.energy.efficiency);
    expect(report.secondaryVoltagePeakNegativeV).toBeLessThan(0);
    expect(Number.isInteger(report.optimumStages)).toBe(true);
    expect(typeof report.optimumStagesClosedForm).toBe('number');
    expect(Number.isInteger(report.optimumStagesClosedForm)).toBe(false);
  });

  it.each([
    ['several-problems.json', ['outputNetwork.bleeder.count', 'load.resistanceOhm']],
    ['negative-capacitance.json', ['multiplier.capacitors[3].valueF']],
  ])('analyze: not-ok fixture %s exits non-zero naming each field on stderr', (name, paths) => {
    const fixture = JSON.parse(readFileSync(join(fixtures, 'not-ok', name), 'utf8'));
    const dir = mkdtempSync(join(tmpdir(), 'ladderwright-'));
    const file = join(dir, 'design.json');
    writeFileSync(file, JSON.stringify(fixture.design));
    const run = ladderwright('analyze', file);
    expect(run.status).toBe(1);
    for (const path of paths) expect(run.stderr).toContain(path);
    expect(run.stderr).toMatch(/invalid_design/);
  });

  it('ladder: a malformed value exits non-zero with the flag and what was expected', () => {
    const run = ladderwright('ladder', '--stages', '2', '--peak', '1k', '--freq', '50', '--cap', '4x7');
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/invalid_quantity: cap: .*expected a number/);
  });

  it('size: ranked candidates for the ionizer target, each meeting output and ripple', () => {
    const run = ladderwright(
      'size',
      '--target',
      '-6kV',
      '--load-current',
      '30u',
      '--ripple',
      '30',
      '--peak',
      '480',
      '--freq',
      '25k',
      '--rs',
      '150',
      '--count',
      '3',
    );
    expect(run.status).toBe(0);
    const result = JSON.parse(run.stdout);
    expect(result.candidates).toHaveLength(3);
    for (const c of result.candidates) {
      expect(c.outputMeanV).toBeLessThanOrEqual(-6000);
      expect(c.ripplePeakToPeakV).toBeLessThanOrEqual(30);
    }
  });

  it('spread: the same seed gives the same distribution', () => {
    const file = join(fixtures, 'ok/bench-four-cell.json');
    const first = ladderwright('spread', file, '--trials', '200', '--seed', '11');
    const second = ladderwright('spread', file, '--trials', '200', '--seed', '11');
    expect(first.status).toBe(0);
    expect(JSON.parse(first.stdout)).toEqual(JSON.parse(second.stdout));
  });

  it('an unknown command exits non-zero with the usage', () => {
    const run = ladderwright('frobnicate');
    expect(run.status).toBe(2);
    expect(run.stderr).toMatch(/Usage: ladderwright/);
  });
});
