import { fireEvent, screen, waitFor } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { renderWithApp } from '../../../testing/render';
import { answerSizerRequest, type SizerWorkerRequest } from '../sizer-messages';
import { SizerPanel } from './sizer-panel';

/** Stands in for the module worker: answers through the same handler the worker runs, or stays silent. */
class FakeSizerWorker {
  posted: SizerWorkerRequest[] = [];
  isTerminated = false;
  private readonly listeners: Array<(event: MessageEvent) => void> = [];
  constructor(private readonly isAnswering: boolean) {}
  addEventListener(type: string, listener: (event: MessageEvent) => void) {
    if (type === 'message') this.listeners.push(listener);
  }
  postMessage(message: SizerWorkerRequest) {
    this.posted.push(message);
    if (!this.isAnswering) return;
    setTimeout(() => {
      if (this.isTerminated) return;
      for (const listener of this.listeners) listener({ data: answerSizerRequest(message) } as MessageEvent);
    }, 0);
  }
  terminate() {
    this.isTerminated = true;
  }
}

const workers: FakeSizerWorker[] = [];
let isAnswering = true;
vi.mock('../create-sizer-worker', () => ({
  createSizerWorker: () => {
    const worker = new FakeSizerWorker(isAnswering);
    workers.push(worker);
    return worker as unknown as Worker;
  },
}));

describe('SizerPanel', () => {
  beforeEach(() => {
    workers.length = 0;
    isAnswering = true;
  });

  it('sends the target to the Sizer worker and ranks the candidates it answers', async () => {
    renderWithApp(<SizerPanel onStartDesign={vi.fn()} isStarting={false} />);
    fireEvent.click(screen.getByRole('button', { name: 'Find ladders' }));

    expect(screen.getByRole('status')).toHaveTextContent('Searching ladders');
    expect(workers).toHaveLength(1);
    expect(workers[0]?.posted[0]?.request).toMatchObject({
      targetOutputV: -6000,
      loadCurrentA: 30e-6,
      topologies: ['half-wave', 'full-wave'],
    });
    const table = await screen.findByRole('table', { name: 'Sizer candidates' }, { timeout: 20_000 });
    expect(table.querySelectorAll('tbody tr').length).toBeGreaterThan(0);
    expect(screen.queryByRole('button', { name: 'Cancel search' })).not.toBeInTheDocument();
  }, 30_000);

  it('cancels a running search: the worker is terminated and the form is free again', async () => {
    isAnswering = false;
    renderWithApp(<SizerPanel onStartDesign={vi.fn()} isStarting={false} />);
    fireEvent.click(screen.getByRole('button', { name: 'Find ladders' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Cancel search' }));

    expect(workers[0]?.isTerminated).toBe(true);
    await waitFor(() => expect(screen.queryByRole('status')).not.toBeInTheDocument());
    expect(screen.getByRole('button', { name: 'Find ladders' })).toBeEnabled();
    expect(screen.queryByRole('table', { name: 'Sizer candidates' })).not.toBeInTheDocument();

    // The next search starts a fresh worker.
    fireEvent.click(screen.getByRole('button', { name: 'Find ladders' }));
    expect(workers).toHaveLength(2);
    expect(workers[1]?.posted[0]?.runId).toBeGreaterThan(workers[0]?.posted[0]?.runId ?? 0);
  });
});
