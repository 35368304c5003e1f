import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type {
  DesignDetail,
  ProjectDetail,
  RevisionDetail,
  RevisionSummary,
  SaveRevisionRequest,
  StaleBaseError,
} from '@ladderwright/shared/api';
import { designExamples, validateDesign } from '@ladderwright/shared/designs';
import { analyzeDesign } from '@ladderwright/shared/analysis';
import { paths } from '../../../config/paths';
import { queryKeys } from '../../../lib/query-keys';
import { createTestQueryClient, jsonResponse, renderRoutes } from '../../../testing/render';
import {
  answerLiveAnalysis,
  type LiveAnalysisAnswer,
  type LiveAnalysisRequest,
} from '../../../features/workbench/live-analysis-messages';
import { WorkbenchRoute } from './workbench';

// jsdom has no Worker: the live preview's worker answers through the same handler, a tick later.
vi.mock('../../../features/workbench/create-live-analysis-worker', () => ({
  createLiveAnalysisWorker: () => {
    const listeners: Array<(event: MessageEvent<LiveAnalysisAnswer>) => void> = [];
    return {
      addEventListener: (type: string, listener: (event: MessageEvent<LiveAnalysisAnswer>) => void) => {
        if (type === 'message') listeners.push(listener);
      },
      postMessage: (request: LiveAnalysisRequest) => {
        setTimeout(() => {
          const data = answerLiveAnalysis(request);
          for (const listener of listeners) listener({ data } as MessageEvent<LiveAnalysisAnswer>);
        }, 0);
      },
      terminate: () => undefined,
    } as unknown as Worker;
  },
}));

const projectId = 'p-bias';
const designId = 'd-bias';
const templateDocument = designExamples.detectorBias;
const report = analyzeDesign(validateDesign(templateDocument));

const project: ProjectDetail = {
  id: projectId,
  name: 'Detector tube bias',
  productLine: 'Detector supplies',
  description: '',
  myRole: 'engineer',
  memberCount: 1,
  isArchived: false,
  settings: { defaultTargets: {}, acceptance: { coverage: 0.95, benchAllowanceFraction: 0.01 } },
  members: [],
};

function summary(number: number): RevisionSummary {
  return {
    number,
    state: 'draft',
    authorId: 'u-1',
    authorName: 'Northfold Engineer',
    createdAt: '2025-03-01T10:00:00.000Z',
    changeNote: number === 1 ? 'From the template' : `Change ${number}`,
    baseRevisionNumber: number === 1 ? null : number - 1,
    engineVersion: '1.0.0',
  };
}

function design(latest: number): DesignDetail {
  return {
    id: designId,
    projectId,
    name: templateDocument.name,
    ownerId: 'u-1',
    ownerName: 'Northfold Engineer',
    latestRevisionNumber: latest,
    latestState: 'draft',
    updatedAt: '2025-03-01T10:00:00.000Z',
    createdAt: '2025-03-01T10:00:00.000Z',
    revisions: Array.from({ length: latest }, (_, i) => summary(i + 1)),
  };
}

const revision1: RevisionDetail = { ...summary(1), designId, projectId, document: templateDocument, report };
const stale: StaleBaseError = {
  statusCode: 409,
  code: 'stale_base',
  message: 'Revision 2 was saved after revision 1.',
  latestRevisionNumber: 2,
  changedFields: ['multiplier.capacitors[1].valueF', 'targets.rippleMaxV'],
};

// jsdom has no FontFaceSet; Mantine's autosizing Textarea (the notes field) listens on it.
if (!(document as { fonts?: unknown }).fonts) {
  Object.defineProperty(document, 'fonts', {
    configurable: true,
    value: { addEventListener: () => undefined, removeEventListener: () => undefined },
  });
}

describe('Workbench save when someone saved meanwhile', () => {
  let saves: SaveRevisionRequest[];

  beforeEach(() => {
    saves = [];
    let latest = 1;
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async (input, init) => {
        const url = String(input);
        if (init?.method === 'POST' && url.endsWith(`/designs/${designId}/revisions`)) {
          const body = JSON.parse(String(init.body)) as SaveRevisionRequest;
          saves.push(body);
          if (body.baseRevisionNumber < 2) {
            latest = 2;
            return jsonResponse(stale, 409);
          }
          latest = 3;
          return jsonResponse({ ...summary(3), designId, projectId, document: body.document, report }, 201);
        }
        if (url === `/api/projects/${projectId}`) return jsonResponse(project);
        if (url === `/api/projects/${projectId}/designs/${designId}`) return jsonResponse(design(latest));
        return jsonResponse({ statusCode: 404, code: 'not_found', message: `no answer for ${url}` }, 404);
      }),
    );
  });
  afterEach(() => vi.unstubAllGlobals());

  it('shows the changed fields, keeps the edits and saves them on top of the latest revision', async () => {
    const queryClient = createTestQueryClient();
    queryClient.setQueryData(queryKeys.projects.detail(projectId), project);
    queryClient.setQueryData(queryKeys.designs.detail(projectId, designId), design(1));
    queryClient.setQueryData(queryKeys.designs.revision(projectId, designId, 1), revision1);
    const { router } = renderRoutes([{ path: paths.design.path, element: <WorkbenchRoute /> }], {
      route: paths.design.getHref(projectId, designId, 1),
      queryClient,
    });

    // The alert's module loads on demand (a save conflict is rare): transformed here first, so the test does not
    // wait on the transform under load.
    await import('./workbench-stale-alert');
    const c1 = await screen.findByLabelText('C1 capacitance');
    fireEvent.change(c1, { target: { value: '1n5' } });
    fireEvent.change(screen.getByLabelText(/Change note/), { target: { value: 'C1 down to 1.5 nF' } });
    const saveButton = screen.getByRole('button', { name: 'Save revision' });
    await waitFor(() => expect(saveButton).toBeEnabled());
    fireEvent.click(saveButton);

    const alert = await screen.findByRole('alert', { name: /Someone saved r2 meanwhile/ }, { timeout: 5000 });
    expect(within(alert).getByText('C2 capacitance')).toBeInTheDocument();
    expect(within(alert).getByText('Ripple limit')).toBeInTheDocument();
    expect(saves[0]?.baseRevisionNumber).toBe(1);
    // The edit and the note are still there, and nothing navigated away.
    expect(screen.getByLabelText('C1 capacitance')).toHaveValue('1n5');
    expect(screen.getByLabelText(/Change note/)).toHaveValue('C1 down to 1.5 nF');
    expect(router.state.location.search).toBe('?rev=1');

    fireEvent.click(within(alert).getByRole('button', { name: 'Keep my edits, save on top of r2' }));
    expect(screen.queryByRole('alert', { name: /Someone saved/ })).not.toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Save revision' }));

    await waitFor(() => expect(router.state.location.search).toBe('?rev=3'));
    expect(saves).toHaveLength(2);
    expect(saves[1]?.baseRevisionNumber).toBe(2);
    expect(saves[1]?.document.multiplier.capacitors[0]?.valueF).toBeCloseTo(1.5e-9, 15);
    expect(saves[1]?.changeNote).toBe('C1 down to 1.5 nF');
  }, 30_000);
});

/** The Workbench on revision 1, its project, design and revision already in the cache. */
function renderRevision1() {
  const queryClient = createTestQueryClient();
  queryClient.setQueryData(queryKeys.projects.detail(projectId), project);
  queryClient.setQueryData(queryKeys.designs.detail(projectId, designId), design(1));
  queryClient.setQueryData(queryKeys.designs.revision(projectId, designId, 1), revision1);
  renderRoutes([{ path: paths.design.path, element: <WorkbenchRoute /> }], {
    route: paths.design.getHref(projectId, designId, 1),
    queryClient,
  });
}

describe('Workbench results summary beside the result tabs', () => {
  beforeEach(() => {
    vi.stubGlobal(
      'fetch',
      vi.fn<typeof fetch>(async (input) => {
        const url = String(input);
        if (url === `/api/projects/${projectId}`) return jsonResponse(project);
        if (url === `/api/projects/${projectId}/designs/${designId}`) return jsonResponse(design(1));
        return jsonResponse({ statusCode: 404, code: 'not_found', message: `no answer for ${url}` }, 404);
      }),
    );
  });
  afterEach(() => vi.unstubAllGlobals());

  it('condenses while the result tabs are scrolled down and opens again back at their top', async () => {
    renderRevision1();
    const summaryBox = await screen.findByRole('region', { name: 'Results summary' });
    const tabs = screen.getByRole('region', { name: 'Result tabs' });
    const scrollTo = (px: number) => {
      tabs.scrollTop = px;
      fireEvent.scroll(tabs);
    };
    expect(summaryBox.dataset.condensed).toBeUndefined();
    scrollTo(30);
    expect(summaryBox.dataset.condensed).toBeUndefined();
    scrollTo(120);
    expect(summaryBox.dataset.condensed).toBe('true');
    // Between the two thresholds it stays as it is, so its own change of height does not flip it back.
    scrollTo(30);
    expect(summaryBox.dataset.condensed).toBe('true');
    scrollTo(0);
    expect(summaryBox.dataset.condensed).toBe('false');
  }, 30_000);

  it('keeps the row of result tabs in view while a tab first opened loads its code', async () => {
    renderRevision1();
    fireEvent.click(await screen.findByRole('tab', { name: 'Checks' }));
    // While the Checks code arrives only the panel waits: the tabs stay shown (a hidden row would not be found).
    expect(screen.getByRole('tab', { name: 'Plots' })).toBeInTheDocument();
    expect(await screen.findByRole('table', { name: 'Checks' }, { timeout: 10_000 })).toBeInTheDocument();
    expect(screen.getByRole('tab', { name: 'Checks' })).toHaveAttribute('aria-selected', 'true');
  }, 30_000);
});
