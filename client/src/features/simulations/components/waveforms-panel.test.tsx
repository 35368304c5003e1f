import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SimulationJob, SimulationSummary, WaveformTrace } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import {
  dischargeSafeLevelV,
  runMethodNote,
  startUpMarks,
  startUpViewEndS,
  startUpWindowIssue,
  WaveformsPanel,
} from './waveforms-panel';

const projectId = 'p-tester';

function succeededJob(summary: SimulationSummary, waveforms: WaveformTrace[] = []): SimulationJob {
  return {
    id: 'job-1',
    projectId,
    kind: 'full',
    status: 'succeeded',
    progressPct: 100,
    designId: 'd-1',
    revisionNumber: 1,
    requestedBy: 'u-1',
    createdAt: '2025-03-01T10:00:00.000Z',
    startedAt: '2025-03-01T10:00:01.000Z',
    finishedAt: '2025-03-01T10:00:05.000Z',
    result: { summary, waveforms },
  };
}

const summary: SimulationSummary = {
  outputMeanV: -2900,
  ripplePeakToPeakV: 4,
  timeToSteadyStateS: 0.02,
  dischargeTimeS: 3.5,
  safeVoltageV: 60,
  cyclesSimulated: 400,
  method: 'transient',
};

/** A trace sampled every 8 µs from 1 ms (invented values: the panel is tested for what it plots, not the numbers). */
function trace(name: string, phase: WaveformTrace['phase'], values: number[], unit: 'V' | 'A' = 'V'): WaveformTrace {
  return { name, phase, unit, timeS: values.map((_, i) => 1e-3 + i * 8e-6), values };
}

/** Ladder run: output over start-up, one ripple window and the discharge with one capacitor. */
const ladderWaveforms: WaveformTrace[] = [
  trace('V(top)', 'startup', [0, -800, -1900, -2850]),
  trace('V(top)', 'steady-state', [-2898, -2902, -2899, -2901]),
  trace('V(top)', 'discharge', [-2900, -900, -200, -55]),
  trace('V(C1)', 'discharge', [-1450, -450, -100, -27]),
];

/** Driver run: the ladder's traces plus collector, secondary and primary current over the steady state. */
const driverWaveforms: WaveformTrace[] = [
  ...ladderWaveforms,
  trace('V(col)', 'steady-state', [0.2, 14, 9, 0.3]),
  trace('V(s)', 'steady-state', [-600, 1450, 900, -580]),
  trace('I(Lp)', 'steady-state', [0.05, 0.4, 0.1, 0.02], 'A'),
];

const driverSummary: SimulationSummary = { ...summary, oscillationFrequencyHz: 31_250 };

describe('startUpWindowIssue', () => {
  it('accepts a window between 100 µs and 100 ms and names the range otherwise', () => {
    expect(startUpWindowIssue(2e-3)).toBeNull();
    expect(startUpWindowIssue(1e-4)).toBeNull();
    expect(startUpWindowIssue(0.1)).toBeNull();
    expect(startUpWindowIssue(5e-5)).toBe('the start-up window must be between 100 µs and 100 ms');
    expect(startUpWindowIssue(0.2)).toMatch(/between 100 µs and 100 ms/);
  });
});

describe('dischargeSafeLevelV', () => {
  it('takes the level the run discharged to, and the design’s target only when the run gives none', () => {
    expect(dischargeSafeLevelV({ safeVoltageV: 60 }, 50)).toBe(60);
    expect(dischargeSafeLevelV({ safeVoltageV: null }, 50)).toBe(50);
  });
});

describe('runMethodNote', () => {
  it('names how the steady state and the start-up were obtained in plain words', () => {
    expect(runMethodNote(summary)).toBe('Steady state from the last simulated cycles; 400 cycles simulated');
    expect(
      runMethodNote({
        ...summary,
        method: 'periodic-steady-state',
        startUpMethod: 'envelope-following',
        cyclesSimulated: 120,
      }),
    ).toBe(
      'Steady state solved directly as a periodic state; start-up by envelope following, plotted as cycle means; 120 cycles simulated',
    );
  });
});

describe('startUpMarks', () => {
  it('marks the times to 90 % and to within 1 % that the run gives, each tagged on the plot, the second set apart', () => {
    const envelope = { ...summary, startUpMethod: 'envelope-following' as const, timeTo1PercentS: 0.045 };
    expect(startUpMarks(envelope)).toEqual([
      { key: '90', label: 'time to 90 % (20 ms)', tag: '90 %', timeS: 0.02 },
      { key: '1', label: 'time to within 1 % (45 ms)', tag: '1 %', timeS: 0.045, isLater: true },
    ]);
    expect(startUpMarks({ ...envelope, timeTo1PercentS: null })).toEqual([
      { key: '90', label: 'time to 90 % (20 ms)', tag: '90 %', timeS: 0.02 },
    ]);
    const transient = {
      ...summary,
      startUpMethod: 'transient' as const,
      timeTo1PercentS: null,
      timeToSteadyStateS: null,
    };
    expect(startUpMarks(transient)).toEqual([]);
  });
});

describe('startUpViewEndS', () => {
  it('ends the first view of the start-up at 1.5× the time to within 1 %, else 3× the time to 90 %', () => {
    const envelope = { ...summary, startUpMethod: 'envelope-following' as const, timeTo1PercentS: 2e-3 };
    expect(startUpViewEndS(envelope)).toBeCloseTo(3e-3, 12);
    expect(startUpViewEndS({ ...envelope, timeTo1PercentS: null })).toBeCloseTo(0.06, 12);
    expect(startUpViewEndS({ ...envelope, timeTo1PercentS: null, timeToSteadyStateS: null })).toBeNull();
  });
});

describe('WaveformsPanel', () => {
  let job: SimulationJob;
  beforeEach(() => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async (input, init) => {
        const url = String(input);
        if (init?.method === 'POST' && url.endsWith('/simulations'))
          return jsonResponse({ jobId: job.id, status: 'queued' }, 202);
        if (url.endsWith(`/simulations/${job.id}`)) return jsonResponse(job);
        return jsonResponse({ statusCode: 404, code: 'not_found', message: `no answer for ${url}` }, 404);
      }),
    );
  });
  afterEach(() => vi.unstubAllGlobals());

  /** The panel on a saved revision whose design target is 50 V. */
  function renderPanel(isDriverDesign = false, hasStoredRun = false) {
    renderWithApp(
      <WaveformsPanel
        projectId={projectId}
        source={{ designId: 'd-1', revisionNumber: 1 }}
        frequencyHz={25e3}
        safeVoltageV={50}
        isDriverDesign={isDriverDesign}
        hasStoredRun={hasStoredRun}
      />,
    );
  }

  /** The panel with a run started. */
  function startRun(isDriverDesign = false) {
    renderPanel(isDriverDesign);
    fireEvent.click(screen.getByRole('button', { name: 'Start simulation' }));
  }

  /** The body of the POST that started the run. */
  function startBody(): Record<string, unknown> {
    const calls = vi.mocked(fetch).mock.calls.filter(([, init]) => init?.method === 'POST');
    expect(calls).toHaveLength(1);
    return JSON.parse(String(calls[0]?.[1]?.body)) as Record<string, unknown>;
  }

  it('plots a driver run’s collector and secondary, its primary current, and names the oscillation frequency', async () => {
    job = succeededJob(driverSummary, driverWaveforms);
    startRun(true);
    const collector = await screen.findByRole('figure', { name: 'Collector and secondary' });
    const primary = screen.getByRole('figure', { name: 'Primary current' });
    expect(within(collector).queryByText('This run has no trace for this phase.')).toBeNull();
    expect(within(primary).queryByText('This run has no trace for this phase.')).toBeNull();
    expect(screen.getByText('Oscillation frequency')).toBeTruthy();
    expect(screen.getByText('31.3 kHz')).toBeTruthy();
    // The output's own plots stay beside them.
    for (const title of ['Start-up', 'Ripple over one cycle', 'Discharge'])
      expect(screen.getByRole('figure', { name: title })).toBeTruthy();
  });

  it('says in plain words when the oscillation was irregular, beside its frequency', async () => {
    job = succeededJob({ ...driverSummary, isOscillationIrregular: true }, driverWaveforms);
    startRun(true);
    await screen.findByText('31.3 kHz');
    expect(
      screen.getByText(
        'Irregular oscillation: the transistor turns on in bursts and the cycles differ in length by more than 20 %, so the frequency is their mean.',
      ),
    ).toBeTruthy();
  });

  it('adds no irregularity note to a regular oscillation', async () => {
    job = succeededJob({ ...driverSummary, isOscillationIrregular: false }, driverWaveforms);
    startRun(true);
    await screen.findByText('31.3 kHz');
    expect(screen.queryByText(/Irregular oscillation/)).toBeNull();
  });

  it('keeps a ladder run to its three plots, without oscillator plots or frequency', async () => {
    job = succeededJob(summary, ladderWaveforms);
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    for (const title of ['Start-up', 'Ripple over one cycle', 'Discharge']) {
      const figure = screen.getByRole('figure', { name: title });
      expect(within(figure).queryByText('This run has no trace for this phase.')).toBeNull();
    }
    expect(screen.getAllByRole('figure')).toHaveLength(3);
    expect(screen.queryByRole('figure', { name: 'Collector and secondary' })).toBeNull();
    expect(screen.queryByRole('figure', { name: 'Primary current' })).toBeNull();
    expect(screen.queryByText('Oscillation frequency')).toBeNull();
  });

  it('sends a driver design’s start-up window with the run and none for a ladder design', async () => {
    job = succeededJob(driverSummary, driverWaveforms);
    renderPanel(true);
    const window = screen.getByLabelText('Start-up window');
    expect((window as HTMLInputElement).value).toBe('2 ms');
    fireEvent.change(window, { target: { value: '5m' } });
    fireEvent.click(screen.getByRole('button', { name: 'Start simulation' }));
    await screen.findByRole('figure', { name: 'Primary current' });
    expect(startBody()).toMatchObject({ kind: 'full', designId: 'd-1', options: { startUpWindowS: 5e-3 } });
  });

  it('offers no start-up window for a ladder design and starts its run without options', async () => {
    job = succeededJob(summary, ladderWaveforms);
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    expect(screen.queryByLabelText('Start-up window')).toBeNull();
    expect(startBody()).not.toHaveProperty('options');
  });

  it('does not say no simulation has run when a stored run of the revision gives the figures', () => {
    renderPanel();
    expect(screen.getByText(/^No simulation has run for this document yet\./)).toBeInTheDocument();
    cleanup();
    renderPanel(false, true);
    expect(screen.queryByText(/No simulation has run/)).toBeNull();
    expect(
      screen.getByText(/^Start-up, ripple over one cycle and discharge come from a simulation run/),
    ).toBeInTheDocument();
  });

  it('refuses to start a driver run over a window the server would reject', () => {
    job = succeededJob(driverSummary, driverWaveforms);
    renderPanel(true);
    fireEvent.change(screen.getByLabelText('Start-up window'), { target: { value: '1 s' } });
    expect(screen.getByText('the start-up window must be between 100 µs and 100 ms')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Start simulation' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('names the discharge by the run’s own safe level, not the design’s target', async () => {
    job = succeededJob(summary);
    startRun();
    expect(await screen.findByText('Discharge to 60 V')).toBeTruthy();
    expect(screen.queryByText('Discharge to 50 V')).toBeNull();
  });

  it('falls back to the design’s target when the run reports no safe level', async () => {
    job = succeededJob({ ...summary, safeVoltageV: null });
    startRun();
    expect(await screen.findByText('Discharge to 50 V')).toBeTruthy();
  });

  it('says a run that did not settle did not, with its estimated remaining drift', async () => {
    job = succeededJob({ ...summary, notSettledWithinS: 0.4, remainingDriftV: -12 }, ladderWaveforms);
    startRun();
    expect(await screen.findByText('Not settled')).toBeTruthy();
    expect(screen.getByText(/may still move by about -12 V/)).toBeTruthy();
  });

  it('shows no settling warning for a settled run', async () => {
    job = succeededJob({ ...summary, notSettledWithinS: null, remainingDriftV: 0 }, ladderWaveforms);
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    expect(screen.queryByText('Not settled')).toBeNull();
  });

  it('gives a ladder start-up by envelope following its times to 90 % and to within 1 %, and names the method', async () => {
    job = succeededJob(
      {
        ...summary,
        method: 'periodic-steady-state',
        startUpMethod: 'envelope-following',
        timeToSteadyStateS: 0.02,
        timeTo1PercentS: 0.045,
        notSettledWithinS: null,
      },
      ladderWaveforms,
    );
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    expect(screen.getByText('Time to 90 %').nextElementSibling?.textContent).toBe('20 ms');
    expect(screen.getByText('Time to within 1 %').nextElementSibling?.textContent).toBe('45 ms');
    expect(screen.getByText(/start-up by envelope following, plotted as cycle means/)).toBeTruthy();
  });

  it('shows a dash for the time to within 1 % when the start-up did not settle', async () => {
    job = succeededJob(
      { ...summary, method: 'periodic-steady-state', startUpMethod: 'envelope-following', timeTo1PercentS: null },
      ladderWaveforms,
    );
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    expect(screen.getByText('Time to within 1 %').nextElementSibling?.textContent).toBe('—');
  });

  it('leaves out the time to within 1 % for a ladder transient, which does not time it', async () => {
    job = succeededJob({ ...summary, startUpMethod: 'transient', timeTo1PercentS: null }, ladderWaveforms);
    startRun();
    await screen.findByRole('figure', { name: 'Start-up' });
    expect(screen.getByText('Time to 90 %')).toBeTruthy();
    expect(screen.queryByText('Time to within 1 %')).toBeNull();
  });
});
