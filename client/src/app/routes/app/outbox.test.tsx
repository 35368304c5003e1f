import { screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Outbox } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { OutboxRoute } from './outbox';

const outbox: Outbox = {
  mails: [
    {
      id: 'm-2',
      from: 'ladderwright@northfold.test',
      to: ['reviewer@northfold.test'],
      subject: 'Sign-off waiting: Bias supply r1',
      text: 'Northfold Engineer submitted Bias supply r1.\nhttp://127.0.0.1/projects/p-1/designs/d-1/revisions/1/sign-off',
      receivedAt: '2025-03-04T10:00:01.000Z',
    },
  ],
  queue: { pending: 1, failed: 0 },
};

describe('OutboxRoute', () => {
  it('renders the captured mail with subject, recipients, text and the queue for an admin', async () => {
    const api = vi.fn<typeof fetch>(async () => jsonResponse(outbox));
    vi.stubGlobal('fetch', api);
    renderWithApp(<OutboxRoute />, { route: '/outbox' });

    expect(await screen.findByText('Sign-off waiting: Bias supply r1')).toBeInTheDocument();
    expect(screen.getByText('To: reviewer@northfold.test')).toBeInTheDocument();
    expect(screen.getByText(/revisions\/1\/sign-off/)).toBeInTheDocument();
    expect(screen.getByText('Queue: 1 pending, 0 failed')).toBeInTheDocument();
    expect(String(api.mock.calls[0]?.[0])).toBe('/api/outbox');
  });

  it('shows the refusal when the caller is not an admin', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async () =>
        jsonResponse({ statusCode: 403, code: 'forbidden', message: 'Only an admin may read the Outbox.' }, 403),
      ),
    );
    renderWithApp(<OutboxRoute />, { route: '/outbox' });
    expect(await screen.findByText('Only an admin may read the Outbox.')).toBeInTheDocument();
    expect(screen.queryByText(/Queue:/)).not.toBeInTheDocument();
  });
});
