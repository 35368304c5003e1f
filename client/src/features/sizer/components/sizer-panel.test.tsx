import { fireEvent, screen, waitFor } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Part } from '@ladderwright/shared/api';
import { renderWithApp } from '../../../testing/render';
import { shelfPart } from '../../../testing/shelf-part';
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

const shelf: Part[] = [
  shelfPart({
    code: 'NF-C103-3K',
    kind: 'capacitor',
    valueSi: 10e-9,
    tolerance: 0.1,
    ratedVoltageV: 3000,
    unitCost: 0.35,
  }),
  shelfPart({
    code: 'NF-D4K-50M',
    kind: 'diode',
    ratedVoltageV: 4000,
    ratedCurrentA: 0.05,
    ratedSurgeCurrentA: 5,
    unitCost: 0.3,
  }),
  shelfPart({
    code: 'NF-R100M-1K',
    kind: 'resistor',
    valueSi: 100e6,
    ratedVoltageV: 1000,
    ratedPowerW: 0.5,
    unitCost: 0.1,
  }),
  shelfPart({ code: 'NF-Q30-2A', kind: 'transistor', unitCost: 0.2 }),
];

describe('SizerPanel values from the Parts shelf', () => {
  beforeEach(() => {
    workers.length = 0;
    isAnswering = true;
  });

  it('sends no parts list with E-series values, and the shelf as the parts list when switched', async () => {
    renderWithApp(<SizerPanel onStartDesign={vi.fn()} isStarting={false} shelf={shelf} />);
    fireEvent.click(screen.getByRole('button', { name: 'Find ladders' }));
    expect(workers[0]?.posted[0]?.request.parts).toBeUndefined();
    await screen.findByRole('table', { name: 'Sizer candidates' }, { timeout: 20_000 });

    const source = screen.getByRole('radiogroup', { name: 'Values from' });
    expect(source).toBeInTheDocument();
    fireEvent.click(screen.getByRole('radio', { name: 'Parts shelf' }));
    fireEvent.click(screen.getByRole('button', { name: 'Find ladders' }));
    const parts = workers.flatMap((worker) => worker.posted).at(-1)?.request.parts;
    expect(parts?.capacitors).toEqual([{ valueF: 10e-9, ratedVoltageV: 3000, costEach: 0.35, partCode: 'NF-C103-3K' }]);
    expect(parts?.diodes?.map((diode) => diode.partCode)).toEqual(['NF-D4K-50M']);
    expect(parts?.resistors?.map((resistor) => resistor.partCode)).toEqual(['NF-R100M-1K']);

    // Every candidate is built from shelf parts only, so each row names them and has a cost.
    await waitFor(
      () => {
        const rows = [...screen.getByRole('table', { name: 'Sizer candidates' }).querySelectorAll('tbody tr')];
        expect(rows.length).toBeGreaterThan(0);
        expect(rows[0]?.textContent).toContain('NF-C103-3K, NF-D4K-50M, NF-R100M-1K');
      },
      { timeout: 20_000 },
    );
    const firstRow = screen.getByRole('table', { name: 'Sizer candidates' }).querySelector('tbody tr');
    expect(firstRow?.textContent).toMatch(/\d+\.\d\d/);
  }, 60_000);

  it('offers the Parts shelf only when the shelf has parts', () => {
    renderWithApp(<SizerPanel onStartDesign={vi.fn()} isStarting={false} shelf={[]} />);
    expect(screen.getByRole('radio', { name: 'Parts shelf' })).toBeDisabled();
    expect(screen.getByRole('radio', { name: 'E-series' })).toBeChecked();
  });
});
