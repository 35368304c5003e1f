import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { analyzeDesign, headlineSource, type SimulatedFigures } from '@ladderwright/shared/analysis';
import { designExamples } from '@ladderwright/shared/designs';
import { formatQuantity } from '@ladderwright/shared/units';
import { renderWithApp } from '../../../testing/render';
import { VerdictStrip } from './verdict-strip';

const tester = designExamples.surfaceChargeTester;
const report = analyzeDesign(tester);

function simulation(outputMeanV: number): SimulatedFigures {
  return {
    engineVersion: report.engineVersion,
    outputMeanV,
    ripplePeakToPeakV: report.ripplePeakToPeakV,
    dischargeTimeS: null,
    oscillationFrequencyHz: null,
    efficiency: null,
    finishedAt: '2026-12-04T21:00:00.000Z',
  };
}

const cell = (label: string) => screen.getByRole('listitem', { name: label });

describe('VerdictStrip with a stored simulation', () => {
  it('says nothing of sources when every figure is the estimate', () => {
    renderWithApp(<VerdictStrip report={report} targets={tester.targets} />);
    const output = cell('Output (mean, loaded)');
    expect(output).toHaveAttribute('data-source', 'estimate');
    expect(within(output).queryByText('from simulation')).not.toBeInTheDocument();
    expect(within(output).getByText(formatQuantity(report.outputMeanV, 'V'))).toBeInTheDocument();
  });

  it('reads a target as "target …" and a missing one as a plain phrase', () => {
    renderWithApp(<VerdictStrip report={report} targets={tester.targets} />);
    expect(within(cell('Ripple (peak-to-peak)')).getByText(/^target ≤ /)).toBeInTheDocument();
    // The demo tester sets no efficiency or battery-life target.
    expect(within(cell('Driver efficiency')).getByText('no target set')).toBeInTheDocument();
    expect(within(cell('Battery life')).getByText('no target set')).toBeInTheDocument();
    expect(screen.queryByText(/target no /)).not.toBeInTheDocument();
  });

  it('gives the discharge time to the level its target names (60 V under NFPA 79 6.5.1), not to the safe voltage', () => {
    const detector = designExamples.detectorBias;
    const detectorReport = analyzeDesign(detector);
    renderWithApp(<VerdictStrip report={detectorReport} targets={detector.targets} />);
    const discharge = cell('Discharge time');
    expect(within(discharge).getByText(/^target ≤ 60 V within 5 s/)).toBeInTheDocument();
    expect(within(discharge).getByText(formatQuantity(detectorReport.dischargeTimeToRuleS!, 's'))).toBeInTheDocument();
  });

  it('shows the simulated output, marks it, marks the rest as estimates and states a difference beyond tolerance', () => {
    // 10 % above the estimate: beyond the driver estimate's stated 5 % on the output (ESTIMATE_VALIDITY_BOUNDS).
    const simulatedV = report.outputMeanV * 1.1;
    const headline = headlineSource(report, simulation(simulatedV), tester.targets);
    renderWithApp(<VerdictStrip report={report} targets={tester.targets} headline={headline} />);
    const output = cell('Output (mean, loaded)');
    expect(output).toHaveAttribute('data-source', 'simulation');
    expect(within(output).getByText(formatQuantity(simulatedV, 'V'))).toBeInTheDocument();
    expect(within(output).getByText('from simulation')).toBeInTheDocument();
    // (e − s)/|s| = 1/1.1 − 1 = −9.1 %: in one short line, marked, with the whole sentence in its title.
    const difference = within(output).getByText(/^! estimate .+V \(−9\.1\s%\)$/);
    expect(difference).toHaveAttribute('data-figure-difference', 'beyond');
    expect(difference).toHaveAttribute(
      'title',
      expect.stringMatching(/9\.1 % below the simulation \(beyond the estimate's stated 5\.0 %\)$/),
    );
    expect(within(cell('Stored energy')).getByText('estimate')).toBeInTheDocument();
    // The ripple agrees exactly: from the simulation, with its (zero) difference stated, not flagged.
    const ripple = cell('Ripple (peak-to-peak)');
    expect(within(ripple).getByText('from simulation')).toBeInTheDocument();
    expect(within(ripple).getByText(/^estimate .+V \([+−]0\.0\s%\)$/)).toHaveAttribute(
      'data-figure-difference',
      'within',
    );
  });
});

describe('VerdictStrip with a load beyond the supply', () => {
  it('shows no output figure but says the load is beyond the supply, with what it holds', () => {
    const heavy = { ...tester, load: { kind: 'current' as const, currentA: 1e-3 } };
    const beyond = analyzeDesign(heavy);
    renderWithApp(<VerdictStrip report={beyond} targets={heavy.targets} />);
    const output = cell('Output (mean, loaded)');
    expect(output).toHaveAttribute('data-verdict', 'fail');
    expect(within(output).getByText('beyond supply')).toBeInTheDocument();
    const holds = formatQuantity(beyond.driver!.loadCapacity!.maxLoadCurrentA, 'A');
    expect(within(output).getByText(new RegExp(`holds ${holds}, asked 1 mA`))).toBeInTheDocument();
  });

  it('marks a figure of an unsettled simulation only as simulated, leaving the time to the summary status', () => {
    const headline = headlineSource(
      report,
      { ...simulation(report.outputMeanV), notSettledWithinS: 0.02 },
      tester.targets,
    );
    renderWithApp(<VerdictStrip report={report} targets={tester.targets} headline={headline} />);
    expect(within(cell('Output (mean, loaded)')).getByText('from simulation')).toBeInTheDocument();
    expect(screen.queryByText(/not settled/)).not.toBeInTheDocument();
  });
});
