import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { DesignPage, DesignSummary, ProjectMember } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { DesignTable } from './design-table';

const members: ProjectMember[] = [
  { userId: 'u-eng', email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' },
  { userId: 'u-lead', email: 'lead@northfold.test', displayName: 'Northfold Lead', role: 'lead' },
];

function summary(id: string, name: string, ownerId: string, state: DesignSummary['latestState']): DesignSummary {
  const owner = members.find((m) => m.userId === ownerId);
  return {
    id,
    projectId: 'p-ion',
    name,
    ownerId,
    ownerName: owner?.displayName ?? '',
    latestRevisionNumber: 2,
    latestState: state,
    updatedAt: '2025-03-04T10:00:00.000Z',
  };
}

const all = [
  summary('d-1', 'Ionizer bar, 14 cells', 'u-eng', 'draft'),
  summary('d-2', 'Ionizer bar, graded', 'u-lead', 'approved'),
  summary('d-3', 'Ionizer bar, 12 cells', 'u-eng', 'approved'),
];

/** A fake list endpoint that filters like the server: by state and owner from the query string. */
function serveDesigns() {
  return vi.fn<typeof fetch>(async (input) => {
    const url = new URL(String(input), 'http://localhost');
    const state = url.searchParams.get('state');
    const ownerId = url.searchParams.get('ownerId');
    const items = all.filter((d) => (!state || d.latestState === state) && (!ownerId || d.ownerId === ownerId));
    const page: DesignPage = { items, total: items.length, page: 1, pageSize: 20 };
    return jsonResponse(page);
  });
}

function rowNames(): string[] {
  const table = screen.getByRole('table', { name: 'Designs' });
  return Array.from(table.querySelectorAll('tbody tr a')).map((a) => a.textContent ?? '');
}

/** Opens a filter by its placeholder and picks one option (Mantine keeps closed dropdowns hidden in jsdom). */
async function pick(placeholder: string, option: string): Promise<void> {
  fireEvent.click(screen.getByPlaceholderText(placeholder));
  fireEvent.click(await screen.findByRole('option', { name: option, hidden: true }));
}

async function renderTable() {
  const api = serveDesigns();
  vi.stubGlobal('fetch', api);
  renderWithApp(<DesignTable projectId="p-ion" members={members} />, { route: '/projects/p-ion' });
  await screen.findByRole('link', { name: 'Ionizer bar, 14 cells' });
  return api;
}

describe('DesignTable', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('lists designs with their state written out and links to the Workbench', async () => {
    vi.stubGlobal('fetch', serveDesigns());
    renderWithApp(<DesignTable projectId="p-ion" members={members} />, { route: '/projects/p-ion' });

    const link = await screen.findByRole('link', { name: 'Ionizer bar, graded' });
    expect(link).toHaveAttribute('href', '/projects/p-ion/designs/d-2');
    expect(within(screen.getByRole('table', { name: 'Designs' })).getAllByText('approved')).toHaveLength(2);
    expect(screen.getByText('3 designs')).toBeInTheDocument();
  });

  it('asks the server for one state and shows only the matching designs', async () => {
    const api = await renderTable();

    await pick('Any state', 'approved');

    await waitFor(() => expect(rowNames()).toEqual(['Ionizer bar, graded', 'Ionizer bar, 12 cells']));
    const lastUrl = String(api.mock.calls.at(-1)?.[0]);
    expect(lastUrl).toContain('state=approved');
    expect(lastUrl).toContain('page=1');
  });

  it('combines the owner filter with the state filter', async () => {
    const api = await renderTable();

    await pick('Any state', 'approved');
    await pick('Anyone', 'Northfold Engineer');

    await waitFor(() => expect(rowNames()).toEqual(['Ionizer bar, 12 cells']));
    expect(String(api.mock.calls.at(-1)?.[0])).toContain('ownerId=u-eng');
  });

  it('sorts by name when the column header is pressed, toggling the order on a second press', async () => {
    const api = await renderTable();

    fireEvent.click(screen.getByRole('button', { name: /^Design/ }));
    await waitFor(() => expect(String(api.mock.calls.at(-1)?.[0])).toContain('sort=name&order=asc'));
    fireEvent.click(screen.getByRole('button', { name: /^Design/ }));
    await waitFor(() => expect(String(api.mock.calls.at(-1)?.[0])).toContain('sort=name&order=desc'));
  });
});
