import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs/design-examples';
import { analyzeDesign } from './analyze-design';
import { simulationSourceLabel, type SimulatedFigures } from './figure-source';
import { headlineSource } from './simulated-figures';

const tester = designExamples.surfaceChargeTester;
const report = analyzeDesign(tester);

function simulated(overrides: Partial<SimulatedFigures> = {}): SimulatedFigures {
  return {
    engineVersion: report.engineVersion,
    outputMeanV: report.outputMeanV,
    ripplePeakToPeakV: report.ripplePeakToPeakV,
    dischargeTimeS: report.dischargeTimeS,
    oscillationFrequencyHz: report.driver?.benchFigures.oscillationFrequencyHz ?? null,
    efficiency: report.driver?.figures.efficiency.value ?? null,
    finishedAt: '2026-12-04T21:00:00.000Z',
    ...overrides,
  };
}

describe('headlineSource', () => {
  it('keeps the estimate without a simulation, or with one from another engine version', () => {
    expect(headlineSource(report, null, tester.targets).source).toBe('estimate');
    const stale = headlineSource(report, simulated({ engineVersion: '0.9.0', outputMeanV: 1 }), tester.targets);
    expect(stale.source).toBe('estimate');
    expect(stale.report).toBe(report);
    expect(stale.differences).toEqual([]);
  });

  it('puts the simulated output, ripple, discharge time and efficiency in the report and says so', () => {
    const sim = simulated({
      outputMeanV: report.outputMeanV * 1.1,
      ripplePeakToPeakV: report.ripplePeakToPeakV * 2,
      efficiency: 0.45,
    });
    const headline = headlineSource(report, sim, tester.targets);
    expect(headline.source).toBe('simulation');
    expect(headline.simulatedKeys).toEqual(['output', 'ripple', 'discharge', 'efficiency']);
    expect(headline.report.outputMeanV).toBe(sim.outputMeanV);
    expect(headline.report.ripplePeakToPeakV).toBe(sim.ripplePeakToPeakV);
    expect(headline.report.driver?.figures.efficiency.value).toBe(0.45);
    expect(headline.report.driver?.figures.efficiency.method.methodId).toBe('stored-simulation');
    expect(headline.simulatedAt).toBe(sim.finishedAt);
    // The estimate is left as it was.
    expect(report.driver?.figures.efficiency.method.methodId).not.toBe('stored-simulation');
  });

  it('states each difference against the estimate’s tolerance, in words', () => {
    // Relative difference (e − s)/|s| by definition: an estimate 1.35 kV against a simulated 1.51 kV is 10.6 % low,
    // beyond the driver estimate's stated 5 % on the output; a frequency 3 % off is within its 10 %.
    const estimateV = report.outputMeanV;
    const frequencyHz = report.driver!.benchFigures.oscillationFrequencyHz;
    const headline = headlineSource(
      report,
      simulated({ outputMeanV: (estimateV * 1.51) / 1.35, oscillationFrequencyHz: frequencyHz / 1.03 }),
      tester.targets,
    );
    const output = headline.differences.find((entry) => entry.key === 'output')!;
    expect(output.difference).toBeCloseTo(1.35 / 1.51 - 1, 6);
    expect(output.tolerance).toBe(0.05);
    expect(output.exceedsTolerance).toBe(true);
    expect(output.text).toMatch(/^estimate .+V, 11 % below the simulation \(beyond the estimate's stated 5.0 %\)$/);
    expect(output.brief).toMatch(/^estimate .+V \(−11\u00a0%\)$/);
    const frequency = headline.differences.find((entry) => entry.key === 'frequency')!;
    expect(frequency.difference).toBeCloseTo(0.03, 6);
    expect(frequency.exceedsTolerance).toBe(false);
    expect(frequency.text).toContain("3.0 % above the simulation (within the estimate's stated 10 %)");
    expect(frequency.brief).toMatch(/ \(\+3\.0\u00a0%\)$/);
    // Efficiency differs in points, with no stated tolerance: beyond 2 points it is still called out.
    const estimated = report.driver!.figures.efficiency.value;
    const efficiency = headlineSource(
      report,
      simulated({ efficiency: estimated + 0.1 }),
      tester.targets,
    ).differences.find((entry) => entry.key === 'efficiency')!;
    expect(efficiency.difference).toBeCloseTo(-0.1, 9);
    expect(efficiency.exceedsTolerance).toBe(true);
    expect(efficiency.text).toMatch(/, 10 points below the simulation \(the estimate states no tolerance for it\)$/);
    expect(efficiency.brief).toMatch(/ \(−10\u00a0points\)$/);

    const onePoint = headlineSource(
      report,
      simulated({ efficiency: estimated + 0.01 }),
      tester.targets,
    ).differences.find((entry) => entry.key === 'efficiency')!;
    expect(onePoint.text).toMatch(/, 1 point below the simulation /);
  });

  it('says beside the frequency when the simulated oscillation is irregular, and not otherwise', () => {
    const irregular = headlineSource(report, simulated({ isOscillationIrregular: true }), tester.targets);
    expect(irregular.isOscillationIrregular).toBe(true);
    const frequency = irregular.differences.find((entry) => entry.key === 'frequency')!;
    expect(frequency.text).toMatch(
      /; irregular oscillation: the transistor turns on in bursts .+ the frequency is their mean$/,
    );
    const regular = headlineSource(report, simulated({ isOscillationIrregular: false }), tester.targets);
    expect(regular.isOscillationIrregular).toBe(false);
    expect(regular.differences.find((entry) => entry.key === 'frequency')!.text).not.toMatch(/irregular/);
  });

  it('evaluates the discharge-time check again on the simulated time, against the same limit', () => {
    // The ionizer bar's rule is a time (60 s); the tester's is met by its small stored charge instead.
    const ionizer = designExamples.ionizerBar;
    const ladderReport = analyzeDesign(ionizer);
    const check = ladderReport.checks.find((entry) => entry.id === 'discharge-time')!;
    expect(check.unit).toBe('s');
    const longer = headlineSource(
      ladderReport,
      { ...simulated(), outputMeanV: null, ripplePeakToPeakV: null, dischargeTimeS: check.limit * 3 },
      ionizer.targets,
    );
    expect(longer.simulatedKeys).toEqual(['discharge']);
    const again = longer.report.checks.find((entry) => entry.id === 'discharge-time')!;
    expect(again.limit).toBe(check.limit);
    expect(again.value).toBe(check.limit * 3);
    expect(again.verdict).toBe('fail');
  });

  it('sets a simulated discharge beside the estimate to the same level: the rule’s voltage, not the safe voltage', () => {
    // The detector-bias demo: safe voltage 50 V, rule '60V-5s' (NFPA 79 6.5.1, read), to whose 60 V a simulation runs.
    const detector = designExamples.detectorBias;
    const detectorReport = analyzeDesign(detector);
    const toRuleS = detectorReport.dischargeTimeToRuleS!;
    expect(toRuleS).toBeLessThan(detectorReport.dischargeTimeS!);
    const headline = headlineSource(
      detectorReport,
      { ...simulated(), outputMeanV: null, ripplePeakToPeakV: null, dischargeTimeS: toRuleS * 1.01 },
      detector.targets,
    );
    const difference = headline.differences.find((entry) => entry.key === 'discharge')!;
    expect(difference.estimate).toBe(toRuleS);
    expect(difference.difference).toBeCloseTo(1 / 1.01 - 1, 12);
    expect(headline.report.dischargeTimeToRuleS).toBe(toRuleS * 1.01);
    // The time to 50 V stays the estimate's: the run stopped at 60 V.
    expect(headline.report.dischargeTimeS).toBe(detectorReport.dischargeTimeS);
  });

  it('judges the targets on the simulated figures', () => {
    const low = headlineSource(report, simulated({ outputMeanV: tester.targets.outputV * 0.5 }), tester.targets);
    expect(low.report.meetsTargets.output).toBe(false);
  });

  it('takes an unsettled simulation’s figures and says it did not settle, with the time', () => {
    const unsettled = headlineSource(
      report,
      simulated({ outputMeanV: report.outputMeanV * 0.9, notSettledWithinS: 0.02 }),
      tester.targets,
    );
    expect(unsettled.source).toBe('simulation');
    expect(unsettled.report.outputMeanV).toBeCloseTo(report.outputMeanV * 0.9, 9);
    expect(unsettled.notSettledWithinS).toBe(0.02);
    expect(simulationSourceLabel(unsettled)).toBe('from simulation, not settled within 20 ms');
    // The difference from the estimate is still stated, against the same tolerance.
    const output = unsettled.differences.find((d) => d.key === 'output')!;
    expect(output.difference).toBeCloseTo(1 / 0.9 - 1, 9);
  });

  it('says plainly "from simulation" for a settled run, and for summaries written before settling was recorded', () => {
    const settled = headlineSource(report, simulated({ notSettledWithinS: null }), tester.targets);
    expect(simulationSourceLabel(settled)).toBe('from simulation');
    const older = headlineSource(report, simulated(), tester.targets);
    expect(older.notSettledWithinS).toBeNull();
    expect(simulationSourceLabel(older)).toBe('from simulation');
  });
});
