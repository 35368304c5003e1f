import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { ProjectDetail } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { MembersPanel } from './members-panel';

const project: ProjectDetail = {
  id: 'p-1',
  name: 'Detector tube bias',
  productLine: 'Detector supplies',
  description: '',
  myRole: 'lead',
  memberCount: 2,
  isArchived: false,
  settings: { defaultTargets: {}, acceptance: { coverage: 0.95, benchAllowanceFraction: 0.01 } },
  members: [
    { userId: 'u-eng', email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' },
    { userId: 'u-lead', email: 'lead@northfold.test', displayName: 'Northfold Lead', role: 'lead' },
  ],
};

const fetchMock = vi.fn<typeof fetch>();

// The first render loads Mantine's Select and Table: allow for a loaded machine.
describe('MembersPanel', { timeout: 20_000 }, () => {
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });

  it('keeps the last lead: no removal and no other role offered', () => {
    renderWithApp(<MembersPanel project={project} myUserId="u-lead" />);
    expect(screen.getByRole('button', { name: 'Remove lead@northfold.test' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Remove engineer@northfold.test' })).toBeEnabled();
    expect(screen.getByText(/The last lead cannot be removed/)).toBeInTheDocument();
  });

  it('adds a member by e-mail with the chosen project role', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse({ userId: 'u-new', email: 'new@northfold.test', displayName: 'New', role: 'engineer' }, 201),
    );
    renderWithApp(<MembersPanel project={project} myUserId="u-lead" />);
    fireEvent.change(screen.getByLabelText(/E-mail of the account/), { target: { value: ' new@northfold.test ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add' }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalled());
    const [url, init] = fetchMock.mock.calls[0] ?? [];
    expect(String(url)).toBe('/api/projects/p-1/members');
    expect(JSON.parse(String(init?.body))).toEqual({ email: 'new@northfold.test', role: 'engineer' });
  });

  it('shows a plain list without controls to a member who is not a lead', () => {
    renderWithApp(<MembersPanel project={{ ...project, myRole: 'engineer' }} myUserId="u-eng" />);
    const table = screen.getByRole('table', { name: 'Members' });
    expect(within(table).queryByRole('button')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Add' })).not.toBeInTheDocument();
    expect(within(table).getByText('Northfold Engineer (you)')).toBeInTheDocument();
  });
});
