import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { ReviewComment } from '@ladderwright/shared/api';
import { jsonResponse, renderWithApp } from '../../../testing/render';
import { CommentThreads } from './comment-threads';

const thread: ReviewComment = {
  id: '5b4a3c1e-0000-4000-8000-000000000001',
  parentId: null,
  authorId: 'u-rev',
  authorName: 'Northfold Reviewer',
  body: 'Why 2.2 nF here?',
  anchor: { kind: 'input', path: 'multiplier.capacitors[0].valueF' },
  isResolved: false,
  resolvedByName: null,
  resolvedAt: null,
  createdAt: '2025-03-04T10:00:00.000Z',
  replies: [
    {
      id: '5b4a3c1e-0000-4000-8000-000000000002',
      parentId: '5b4a3c1e-0000-4000-8000-000000000001',
      authorId: 'u-eng',
      authorName: 'Northfold Engineer',
      body: 'Ripple target.',
      anchor: null,
      isResolved: false,
      resolvedByName: null,
      resolvedAt: null,
      createdAt: '2025-03-04T11:00:00.000Z',
      replies: [],
    },
  ],
};

const commentsUrl = '/api/projects/p-1/designs/d-1/revisions/2/comments';
const fetchMock = vi.fn<typeof fetch>();

function callsTo(method: string) {
  return fetchMock.mock.calls
    .filter(([, init]) => (init?.method ?? 'GET') === method)
    .map(([url, init]) => ({
      url: String(url),
      body: typeof init?.body === 'string' ? JSON.parse(init.body) : undefined,
    }));
}

function renderThreads(comments: ReviewComment[]) {
  fetchMock.mockImplementation(async (_url, init) =>
    (init?.method ?? 'GET') === 'GET' ? jsonResponse(comments) : jsonResponse({ ...thread, id: 'new' }, 201),
  );
  return renderWithApp(
    <CommentThreads
      projectId="p-1"
      designId="d-1"
      revisionNumber={2}
      anchorOptions={{
        inputPaths: ['multiplier.stages', 'multiplier.capacitors[0].valueF'],
        resultKeys: ['ripplePeakToPeakV'],
      }}
      canComment
    />,
  );
}

describe('CommentThreads', () => {
  beforeEach(() => {
    fetchMock.mockReset();
    vi.stubGlobal('fetch', fetchMock);
  });

  it('starts a thread anchored to the chosen result key', async () => {
    renderThreads([]);
    await screen.findByText('No comments on this revision yet.');
    const start = screen.getByRole('button', { name: 'Start thread' });
    expect(start).toBeDisabled();

    fireEvent.change(screen.getByLabelText('New comment'), { target: { value: 'Ripple is at the limit' } });
    fireEvent.change(screen.getByLabelText(/Anchor/), { target: { value: 'result:ripplePeakToPeakV' } });
    fireEvent.click(start);

    await waitFor(() => expect(callsTo('POST')).toHaveLength(1));
    expect(callsTo('POST')[0]).toEqual({
      url: commentsUrl,
      body: { body: 'Ripple is at the limit', anchor: { kind: 'result', path: 'ripplePeakToPeakV' } },
    });
  });

  it('starts a thread without an anchor when none is chosen', async () => {
    renderThreads([]);
    await screen.findByText('No comments on this revision yet.');
    fireEvent.change(screen.getByLabelText('New comment'), { target: { value: 'General question' } });
    fireEvent.click(screen.getByRole('button', { name: 'Start thread' }));
    await waitFor(() => expect(callsTo('POST')).toHaveLength(1));
    expect(callsTo('POST')[0]?.body).toEqual({ body: 'General question' });
  });

  it('shows a thread with its anchor and replies, replies to it and resolves it', async () => {
    renderThreads([thread]);
    const article = await screen.findByRole('article', { name: /Why 2.2 nF here/ });
    expect(within(article).getByText('input · C1 capacitance')).toBeInTheDocument();
    expect(within(article).getByText('open')).toBeInTheDocument();
    expect(within(article).getByText('Ripple target.')).toBeInTheDocument();

    fireEvent.change(within(article).getByLabelText('Reply'), { target: { value: 'Thanks' } });
    fireEvent.click(within(article).getByRole('button', { name: 'Reply' }));
    await waitFor(() => expect(callsTo('POST')).toHaveLength(1));
    expect(callsTo('POST')[0]?.body).toEqual({ body: 'Thanks', parentId: thread.id });

    fireEvent.click(within(article).getByRole('button', { name: 'Resolve' }));
    await waitFor(() => expect(callsTo('PATCH')).toHaveLength(1));
    expect(callsTo('PATCH')[0]).toEqual({ url: `${commentsUrl}/${thread.id}`, body: { isResolved: true } });
  });
});
