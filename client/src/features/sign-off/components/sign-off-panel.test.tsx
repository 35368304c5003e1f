import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { SignOff } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { SignOffPanel } from './sign-off-panel';

const base: SignOff = {
  projectId: 'p-1',
  designId: 'd-1',
  designName: 'Bias supply',
  revisionNumber: 3,
  state: 'submitted',
  authorId: 'u-eng',
  authorName: 'Northfold Engineer',
  reviewers: [
    { userId: 'u-rev', displayName: 'Northfold Reviewer', email: 'reviewer@northfold.test', projectRole: 'reviewer' },
  ],
  candidateReviewers: [
    { userId: 'u-rev', displayName: 'Northfold Reviewer', email: 'reviewer@northfold.test', projectRole: 'reviewer' },
    { userId: 'u-lead', displayName: 'Northfold Lead', email: 'lead@northfold.test', projectRole: 'lead' },
  ],
  availableCommands: ['return', 'approve'],
  approvals: [],
  gateReasons: [],
  overrides: [],
  history: [
    {
      id: 't-1',
      command: 'submit',
      fromState: 'draft',
      toState: 'submitted',
      actorId: 'u-eng',
      actorName: 'Northfold Engineer',
      note: 'Ready for a look',
      at: '2025-03-04T10:00:00.000Z',
    },
  ],
};

const fetchMock = vi.fn<typeof fetch>();

function lastCall(): { url: string; method: string | undefined; body: unknown } {
  const call = fetchMock.mock.calls.at(-1);
  const init = call?.[1];
  return {
    url: String(call?.[0]),
    method: init?.method,
    body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined,
  };
}

describe('SignOffPanel', () => {
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });

  it('shows only the commands the server offers', () => {
    renderWithApp(<SignOffPanel signOff={base} />);
    expect(screen.getByRole('button', { name: 'Approve' })).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Return with note' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Release' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Withdraw' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Submit for Sign-off' })).not.toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();
    expect(screen.getByText(/waiting for Northfold Reviewer/)).toBeInTheDocument();
  });

  it('shows the closed gates before the click and approves only with an override reason of 20+ characters', async () => {
    const gated: SignOff = {
      ...base,
      gateReasons: [{ code: 'failing_checks', message: '1 Check fails: c1-voltage (C1)', checkIds: ['c1-voltage'] }],
    };
    fetchMock.mockResolvedValue(jsonResponse({ ...gated, state: 'approved', availableCommands: [] }));
    renderWithApp(<SignOffPanel signOff={gated} />);
    expect(screen.getByText('1 Check fails: c1-voltage (C1)')).toBeInTheDocument();
    const approve = screen.getByRole('button', { name: 'Approve' });
    expect(approve).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Return with note' })).toBeDisabled();

    fireEvent.click(screen.getByRole('checkbox', { name: /Record an override/ }));
    const reason = screen.getByLabelText(/Override reason/);
    fireEvent.change(reason, { target: { value: 'short reason' } });
    expect(approve).toBeDisabled();
    fireEvent.change(reason, { target: { value: 'C1 is swapped for a 1 kV part at build' } });
    expect(approve).toBeEnabled();
    fireEvent.click(approve);

    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    expect(lastCall()).toEqual({
      url: '/api/projects/p-1/designs/d-1/revisions/3/approve',
      method: 'POST',
      body: { override: { reason: 'C1 is swapped for a 1 kV part at build' } },
    });
  });

  it('lists recorded overrides with their reasons', () => {
    renderWithApp(
      <SignOffPanel
        signOff={{
          ...base,
          overrides: [
            {
              command: 'submit',
              actorId: 'u-eng',
              actorName: 'Northfold Engineer',
              reason: 'Pilot build only, agreed with the lead',
              overridden: [{ code: 'open_threads', message: '1 comment thread is still open', threadCount: 1 }],
              at: '2025-03-04T10:00:00.000Z',
            },
          ],
        }}
      />,
    );
    const overrides = screen.getByRole('list', { name: 'Overrides' });
    expect(overrides).toHaveTextContent(/override on submit.*Northfold Engineer.*Pilot build only/);
    expect(overrides).toHaveTextContent('Past: 1 comment thread is still open');
  });

  it('says an approved revision with no step on record was stored approved, not that it awaits approval', () => {
    renderWithApp(
      <SignOffPanel signOff={{ ...base, state: 'approved', availableCommands: [], history: [], reviewers: [] }} />,
    );
    expect(screen.queryByText('Not approved yet.')).not.toBeInTheDocument();
    expect(screen.getByText(/No approval on record: the revision was stored approved/)).toBeInTheDocument();
    expect(screen.getByText('No Sign-off step on record: the revision was stored approved.')).toBeInTheDocument();
  });

  it('says so when no command is open to the caller', () => {
    renderWithApp(<SignOffPanel signOff={{ ...base, availableCommands: [] }} />);
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    expect(screen.getByText(/No Sign-off command is open to you/)).toBeInTheDocument();
  });

  it('tells a reviewer of an approved revision that a lead releases it', () => {
    renderWithApp(<SignOffPanel signOff={{ ...base, state: 'approved', availableCommands: [] }} />);
    expect(
      screen.getByText(
        'No Sign-off command is open to you on this revision in its approved state: a project lead releases it next.',
      ),
    ).toBeInTheDocument();
  });

  it('names whom a submitted revision went to when the caller is not among them', () => {
    const lead = {
      userId: 'u-lead',
      displayName: 'Northfold Lead',
      email: 'lead@northfold.test',
      projectRole: 'lead' as const,
    };
    renderWithApp(<SignOffPanel signOff={{ ...base, state: 'submitted', reviewers: [lead], availableCommands: [] }} />);
    expect(
      screen.getByText(/No Sign-off command is open to you .* submitted state: it was submitted to Northfold Lead\./),
    ).toBeInTheDocument();
  });

  it('returns only with a note and posts it', async () => {
    fetchMock.mockResolvedValue(jsonResponse({ ...base, state: 'returned', availableCommands: [] }));
    renderWithApp(<SignOffPanel signOff={base} />);
    const returnButton = screen.getByRole('button', { name: 'Return with note' });
    expect(returnButton).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Approve' })).toBeEnabled();

    fireEvent.change(screen.getByLabelText(/Note/), { target: { value: '  C3 is too close to its PIV rating  ' } });
    expect(returnButton).toBeEnabled();
    fireEvent.click(returnButton);

    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    expect(lastCall()).toEqual({
      url: '/api/projects/p-1/designs/d-1/revisions/3/return',
      method: 'POST',
      body: { note: 'C3 is too close to its PIV rating' },
    });
  });

  it('submits to the chosen reviewers with the note', async () => {
    const draft: SignOff = { ...base, state: 'draft', reviewers: [], availableCommands: ['submit'] };
    fetchMock.mockResolvedValue(jsonResponse({ ...draft, state: 'submitted', availableCommands: ['withdraw'] }));
    renderWithApp(<SignOffPanel signOff={draft} />);
    const submit = screen.getByRole('button', { name: 'Submit for Sign-off' });
    expect(submit).toBeDisabled();

    const reviewers = screen.getByRole('group', { name: /Reviewers/ });
    fireEvent.click(within(reviewers).getByRole('checkbox', { name: 'Northfold Lead (lead)' }));
    fireEvent.change(screen.getByLabelText(/Note/), { target: { value: 'First pass' } });
    fireEvent.click(submit);

    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    expect(lastCall()).toEqual({
      url: '/api/projects/p-1/designs/d-1/revisions/3/submit',
      method: 'POST',
      body: { reviewerIds: ['u-lead'], note: 'First pass' },
    });
  });

  it('shows the server’s reason when it refuses a command with 409', async () => {
    fetchMock.mockResolvedValue(
      jsonResponse(
        {
          statusCode: 409,
          code: 'illegal_transition',
          message: 'A approved revision cannot be approved; it must be submitted.',
        },
        409,
      ),
    );
    renderWithApp(<SignOffPanel signOff={base} />);
    fireEvent.click(screen.getByRole('button', { name: 'Approve' }));
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Refused: the Sign-off does not allow this now');
    expect(alert).toHaveTextContent('A approved revision cannot be approved; it must be submitted. (HTTP 409)');
  });

  it('lists approvals with names and the history with who, from, to and note', () => {
    renderWithApp(
      <SignOffPanel
        signOff={{
          ...base,
          state: 'approved',
          availableCommands: [],
          approvals: [
            { userId: 'u-rev', displayName: 'Northfold Reviewer', note: 'Looks right', at: '2025-03-05T09:00:00.000Z' },
          ],
        }}
      />,
    );
    expect(screen.getByRole('list', { name: 'Approvals' })).toHaveTextContent(
      /approved by Northfold Reviewer on .*Looks right/,
    );
    const history = screen.getByRole('table', { name: 'Sign-off history' });
    const row = within(history).getAllByRole('row')[1];
    expect(row).toHaveTextContent(/Northfold Engineer.*draft.*submitted.*Ready for a look/);
  });
});
