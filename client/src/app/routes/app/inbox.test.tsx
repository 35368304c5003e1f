import { screen, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Inbox, InboxItem } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { InboxRoute } from './inbox';

function item(overrides: Partial<InboxItem>): InboxItem {
  return {
    projectId: 'p-1',
    projectName: 'Detector tube bias',
    designId: 'd-1',
    designName: 'Bias supply',
    revisionNumber: 1,
    state: 'submitted',
    authorName: 'Northfold Engineer',
    reviewerNames: ['Northfold Reviewer'],
    submittedAt: '2025-03-04T10:00:00.000Z',
    updatedAt: '2025-03-04T10:00:00.000Z',
    ...overrides,
  };
}

const inbox: Inbox = {
  waitingForMe: [item({ designId: 'd-7', designName: 'Ionizer bar HV', revisionNumber: 4 })],
  submittedByMe: [
    item({ designId: 'd-2', designName: 'Tester ladder', revisionNumber: 2, state: 'returned' }),
    item({ designId: 'd-3', designName: 'Hood cell', revisionNumber: 1, state: 'released' }),
  ],
  returnedToMe: [],
  awaitingRelease: [item({ designId: 'd-9', designName: 'Precipitator cell', revisionNumber: 2, state: 'approved' })],
  newComments: [],
  memberRequests: [
    {
      projectId: 'p-1',
      projectName: 'Cleanroom ionizer bar',
      requestId: 'q-1',
      email: 'technician@northfold.test',
      role: 'reviewer',
      requesterName: 'Edda Engineer',
      createdAt: '2026-12-01T09:00:00.000Z',
    },
  ],
  actionCount: 3,
};

describe('InboxRoute', () => {
  beforeEach(() => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async () => jsonResponse(inbox)),
    );
  });

  it('lists what waits for me and what I submitted, each with its state and a link to its Sign-off', async () => {
    renderWithApp(<InboxRoute />, { route: '/inbox' });
    const tables = await screen.findAllByRole('table');
    expect(tables).toHaveLength(4);
    expect(screen.getByRole('heading', { name: 'Waiting for me' })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Approved, waiting for release' })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Submitted by me' })).toBeInTheDocument();

    const waiting = screen.getByRole('table', { name: 'Waiting for me' });
    const submitted = screen.getByRole('table', { name: 'Submitted by me' });
    const waitingRows = within(waiting).getAllByRole('row').slice(1);
    expect(waitingRows).toHaveLength(1);
    expect(waitingRows[0]).toHaveTextContent(/Ionizer bar HV.*r4.*submitted.*Northfold Engineer/);
    // The revision as every other screen writes it ("r4"), its state in the same badge as on the Designs list.
    expect(within(waitingRows[0]!).getByRole('cell', { name: 'r4' })).toBeInTheDocument();
    expect(within(waiting).getByRole('link', { name: 'Ionizer bar HV' })).toHaveAttribute(
      'href',
      '/projects/p-1/designs/d-7/revisions/4/sign-off',
    );

    const requests = screen.getByRole('table', { name: 'Member requests' });
    expect(within(requests).getAllByRole('row')[1]).toHaveTextContent(
      /technician@northfold.test.*reviewer.*Edda Engineer/,
    );
    expect(within(requests).getByRole('link', { name: 'technician@northfold.test' })).toHaveAttribute(
      'href',
      '/projects/p-1/members',
    );

    const release = screen.getByRole('table', { name: 'Waiting for release' });
    expect(within(release).getByRole('link', { name: 'Precipitator cell' })).toHaveAttribute(
      'href',
      '/projects/p-1/designs/d-9/revisions/2/sign-off',
    );

    const submittedRows = within(submitted).getAllByRole('row').slice(1);
    expect(submittedRows.map((row) => row.textContent)).toEqual([
      expect.stringMatching(/Tester ladder.*returned/),
      expect.stringMatching(/Hood cell.*released/),
    ]);
  });

  it('says so when a group is empty', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async () =>
        jsonResponse({
          waitingForMe: [],
          submittedByMe: [],
          returnedToMe: [],
          awaitingRelease: [],
          newComments: [],
          memberRequests: [],
          actionCount: 0,
        }),
      ),
    );
    renderWithApp(<InboxRoute />, { route: '/inbox' });
    expect(await screen.findByText('Nothing is waiting for your Sign-off.')).toBeInTheDocument();
    expect(screen.getByText('You have not submitted a revision yet.')).toBeInTheDocument();
    expect(screen.getByText('None of your revisions is waiting for changes.')).toBeInTheDocument();
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
  });
});
