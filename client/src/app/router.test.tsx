import { screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ApiErrorBody, ProjectDetail, SignInResponse } from '@ladderwright/shared/api';
import { createTestQueryClient, jsonResponse, renderRoutes } from '../testing/render';
import { createAppRoutes } from './router';

const session: SignInResponse = {
  user: { id: 'u-1', email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' },
};
const detectorBias: ProjectDetail = {
  id: 'p-bias',
  name: 'Detector tube bias',
  productLine: 'Detector supplies',
  description: 'About 900 V from one lithium-ion cell.',
  myRole: 'engineer',
  memberCount: 1,
  isArchived: false,
  settings: { defaultTargets: {}, acceptance: { coverage: 0.95, benchAllowanceFraction: 0.01 } },
  members: [{ userId: 'u-1', email: 'engineer@northfold.test', displayName: 'Northfold Engineer', role: 'engineer' }],
};
const unauthorized: ApiErrorBody = { statusCode: 401, code: 'unauthorized', message: 'Sign in first.' };
const notFound: ApiErrorBody = { statusCode: 404, code: 'not_found', message: 'No such project.' };

/** A fake API: answers by path, 404 for anything else. */
function serveApi(answers: Record<string, () => Response>) {
  return vi.fn<typeof fetch>(async (input) => {
    const answer = answers[String(input)];
    return answer ? answer() : jsonResponse(notFound, 404);
  });
}

function renderApp(route: string) {
  const queryClient = createTestQueryClient();
  return renderRoutes(createAppRoutes(queryClient), { route, queryClient });
}

describe('app routes', () => {
  beforeEach(() => vi.stubGlobal('fetch', vi.fn()));
  afterEach(() => vi.unstubAllGlobals());

  it('sends a visitor without a session to sign-in, remembering the page asked for', async () => {
    const api = serveApi({ '/api/auth/me': () => jsonResponse(unauthorized, 401) });
    vi.stubGlobal('fetch', api);
    const { router } = renderApp('/projects/p-bias');

    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Fprojects%2Fp-bias');
    // Page loaders wait for the session check: no project request goes out without a session.
    expect(api.mock.calls.map(([url]) => String(url))).toEqual(['/api/auth/me']);
  });

  it('shows the projects list inside the shell for a signed-in user', async () => {
    vi.stubGlobal(
      'fetch',
      serveApi({
        '/api/auth/me': () => jsonResponse(session),
        '/api/projects': () => jsonResponse([detectorBias]),
      }),
    );
    renderApp('/');

    expect(await screen.findByRole('heading', { name: 'Projects', level: 1 })).toBeInTheDocument();
    expect(await screen.findByRole('listitem', { name: 'Detector tube bias' })).toBeInTheDocument();
    expect(screen.getByRole('note', { name: 'High-voltage caution' })).toBeInTheDocument();
  });

  it('opens a project onto its Designs, empty until designs exist', async () => {
    vi.stubGlobal(
      'fetch',
      serveApi({
        '/api/auth/me': () => jsonResponse(session),
        '/api/projects': () => jsonResponse([detectorBias]),
        '/api/projects/p-bias': () => jsonResponse(detectorBias),
        '/api/projects/p-bias/designs?sort=updatedAt&order=desc&page=1&pageSize=20': () =>
          jsonResponse({ items: [], total: 0, page: 1, pageSize: 20 }),
      }),
    );
    renderApp('/projects/p-bias');

    expect(await screen.findByRole('heading', { name: 'Detector tube bias', level: 1 })).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Designs', level: 2 })).toBeInTheDocument();
    expect(await screen.findByText('No designs in this project yet')).toBeInTheDocument();
  });

  it('shows the server’s not-found message for a project the user cannot see', async () => {
    vi.stubGlobal(
      'fetch',
      serveApi({ '/api/auth/me': () => jsonResponse(session), '/api/projects': () => jsonResponse([]) }),
    );
    renderApp('/projects/p-elsewhere');

    expect(await screen.findByText('No such project.')).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Not found' })).toBeInTheDocument();
    expect(screen.getByRole('note', { name: 'High-voltage caution' })).toBeInTheDocument();
  });

  it('shows a not-found page for an unknown address', async () => {
    renderApp('/no/such/page');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeInTheDocument();
    await waitFor(() => expect(screen.getByRole('link', { name: 'Go to projects' })).toHaveAttribute('href', '/'));
  });
});
