import { fireEvent, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { SimulationJob, SimulationSummary } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { dischargeSafeLevelV, WaveformsPanel } from './waveforms-panel';

const projectId = 'p-tester';

function succeededJob(summary: SimulationSummary): SimulationJob {
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
    result: { summary, waveforms: [] },
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

describe('dischargeSafeLevelV', () => {
  it('takes the level the run discharged to, and the design’s target only when the run gives none', () => {
    expect(dischargeSafeLevelV({ safeVoltageV: 60 }, 50)).toBe(60);
    expect(dischargeSafeLevelV({ safeVoltageV: null }, 50)).toBe(50);
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

  /** The panel on a saved revision whose design target is 50 V, with a run started. */
  function startRun() {
    renderWithApp(
      <WaveformsPanel
        projectId={projectId}
        source={{ designId: 'd-1', revisionNumber: 1 }}
        frequencyHz={25e3}
        safeVoltageV={50}
      />,
    );
    fireEvent.click(screen.getByRole('button', { name: 'Start simulation' }));
  }

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
});
