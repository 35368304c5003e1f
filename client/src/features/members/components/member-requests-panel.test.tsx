import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { MemberRequest, ProjectDetail } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { MemberRequestsPanel } from './member-requests-panel';

const project: ProjectDetail = {
  id: 'p-1',
  name: 'Detector tube bias',
  productLine: 'Detector supplies',
  description: '',
  myRole: 'lead',
  memberCount: 2,
  isArchived: false,
  settings: { defaultTargets: {}, acceptance: { coverage: 0.95, benchAllowanceFraction: 0.01 } },
  members: [],
};

const pending: MemberRequest = {
  id: 'q-1',
  projectId: 'p-1',
  email: 'technician@northfold.test',
  role: 'reviewer',
  note: 'Checks the creepage',
  state: 'pending',
  requesterId: 'u-eng',
  requesterName: 'Northfold Engineer',
  createdAt: '2026-12-01T09:00:00.000Z',
  decidedByName: null,
  decidedAt: null,
  declineReason: null,
};

const fetchMock = vi.fn<typeof fetch>();

describe('MemberRequestsPanel', { timeout: 20_000 }, () => {
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });

  it('offers a lead Accept on a pending request and posts the decision', async () => {
    fetchMock.mockImplementation(async (url) =>
      String(url).endsWith('/accept') ? jsonResponse({ ...pending, state: 'accepted' }) : jsonResponse([pending]),
    );
    renderWithApp(<MemberRequestsPanel project={project} />);
    const row = (await screen.findByText('technician@northfold.test')).closest('tr');
    if (!row) throw new Error('no row for the request');
    expect(screen.queryByRole('button', { name: 'Send request' })).toBeNull();
    fireEvent.click(within(row).getByRole('button', { name: 'Accept' }));
    await waitFor(() =>
      expect(fetchMock.mock.calls.map(([url]) => String(url))).toContain(
        '/api/projects/p-1/member-requests/q-1/accept',
      ),
    );
  });

  it('gives an engineer the request form and the outcome, without decisions', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse([{ ...pending, state: 'declined', decidedByName: 'Northfold Lead', declineReason: 'Not now' }]),
    );
    renderWithApp(<MemberRequestsPanel project={{ ...project, myRole: 'engineer' }} />);
    expect(await screen.findByText(/declined by Northfold Lead.*Not now/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Send request' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Accept' })).toBeNull();
  });

  it('shows neither form nor decisions in an archived project', async () => {
    fetchMock.mockResolvedValue(jsonResponse([pending]));
    renderWithApp(<MemberRequestsPanel project={{ ...project, isArchived: true }} />);
    expect(await screen.findByText('waiting for a lead')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Accept' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Send request' })).toBeNull();
  });
});
