import { lazy, Suspense, useCallback, useEffect, useLayoutEffect, useRef, useState, type RefObject } from 'react';
import { Alert, Anchor, Badge, Group, Stack, Text } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { Part, RevisionDetail, RevisionSummary, StaleBaseError } from '@ladderwright/shared/api';
import { canActInProject } from '@ladderwright/shared/auth';
import { simulationSourceLabel } from '@ladderwright/shared/analysis';
import type { Design } from '@ladderwright/shared/designs';
import { paths } from '../../../config/paths';
import { queryKeys } from '../../../lib/query-keys';
import { staleBaseOf, useCreateRevision } from '../../../features/designs/api/create-revision';
import { getDesignQueryOptions } from '../../../features/designs/api/get-design';
import { getRevisionQueryOptions } from '../../../features/designs/api/get-revision';
import { getPartsQueryOptions, useParts } from '../../../features/parts/api/get-parts';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { useSimulatedFigures } from '../../../features/workbench/api/get-simulated-figures';
import { LadderForm } from '../../../features/workbench/components/ladder-form';
import { VerdictStrip } from '../../../features/workbench/components/verdict-strip';
import { useDesignDraft } from '../../../features/workbench/hooks/use-design-draft';
import { useHeadlineSource } from '../../../features/workbench/hooks/use-headline-source';
import { useLiveAnalysis } from '../../../features/workbench/hooks/use-live-analysis';
import { requireUser } from './root';
import classes from './workbench.module.css';
import { WorkbenchHeader } from './workbench-header';
import { WorkbenchResults } from './workbench-results';
import { showNotification } from '../../../lib/show-notification';

// Shown only after a save conflict: it reads the field-label map, which the first paint does not need.
const WorkbenchStaleAlert = lazy(() =>
  import('./workbench-stale-alert').then((module) => ({ default: module.WorkbenchStaleAlert })),
);
// Shown only for part codes missing from the shelf, under their field labels.
const PartIssuesAlert = lazy(() =>
  import('../../../features/workbench/components/part-issues-alert').then((module) => ({
    default: module.PartIssuesAlert,
  })),
);

const noParts: readonly Part[] = [];

function revisionParam(request: Request | URLSearchParams): number | null {
  const params = request instanceof URLSearchParams ? request : new URL(request.url).searchParams;
  const value = Number(params.get('rev'));
  return Number.isInteger(value) && value >= 1 ? value : null;
}

export function workbenchLoader(queryClient: QueryClient) {
  return async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const projectId = params.projectId ?? '';
    const designId = params.designId ?? '';
    const [, design] = await Promise.all([
      queryClient.ensureQueryData(getProjectQueryOptions(projectId)),
      queryClient.ensureQueryData(getDesignQueryOptions(projectId, designId)),
      // The shelf is in hand before the first preview, so preview and stored report use the same ratings.
      queryClient.ensureQueryData(getPartsQueryOptions(projectId)),
    ]);
    const revisionNumber = revisionParam(request);
    // The address names the revision being edited, so a refetched design (someone saved meanwhile)
    // never swaps the open revision, and the user's edits, for the new latest.
    if (revisionNumber === null)
      return redirect(paths.design.getHref(projectId, designId, design.latestRevisionNumber));
    await queryClient.ensureQueryData(getRevisionQueryOptions(projectId, designId, revisionNumber));
    return null;
  };
}

/**
 * The Workbench: a revision's document as a form with live results, saved as new revisions. A member who may not
 * write designs (a reviewer) sees it read-only.
 */
export function WorkbenchRoute() {
  const { projectId = '', designId = '' } = useParams();
  const [searchParams] = useSearchParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  const { data: design } = useSuspenseQuery(getDesignQueryOptions(projectId, designId));
  const revisionNumber = revisionParam(searchParams) ?? design.latestRevisionNumber;
  const { data: revision } = useSuspenseQuery(getRevisionQueryOptions(projectId, designId, revisionNumber));
  useDocumentTitle(`${design.name} r${revision.number} · Workbench · Ladderwright`);

  return (
    <Stack gap="md">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Text size="sm">{design.name}</Text>
      </Trail>
      <EditableRevision
        key={`${designId}-${revision.number}`}
        projectId={projectId}
        revision={revision}
        latestRevisionNumber={design.latestRevisionNumber}
        revisions={design.revisions}
        isReadOnly={!canActInProject(project, 'design.write')}
        isArchived={project.isArchived}
      />
    </Stack>
  );
}

interface EditableRevisionProps {
  projectId: string;
  revision: RevisionDetail;
  latestRevisionNumber: number;
  revisions: readonly RevisionSummary[];
  isReadOnly: boolean;
  /** The project is archived: read-only for everyone, simulations included. */
  isArchived: boolean;
}

/**
 * Keeps two measures on the layout as CSS variables, without a render: `--lw-summary-height`, the Results summary's
 * height, so that a form section scrolled to in the stacked layout stops below the sticky summary instead of under
 * it; and `--lw-layout-top`, where the layout starts on the page, so that the side-by-side columns end at the foot of
 * the window and each scrolls on its own without the page scrolling first.
 */
function useLayoutMeasures(layoutRef: RefObject<HTMLElement | null>, summaryRef: RefObject<HTMLElement | null>) {
  useEffect(() => {
    const layout = layoutRef.current;
    const summary = summaryRef.current;
    if (!layout || !summary || typeof ResizeObserver === 'undefined') return;
    const measure = () => {
      layout.style.setProperty('--lw-summary-height', `${Math.ceil(summary.getBoundingClientRect().height)}px`);
      const top = layout.getBoundingClientRect().top + window.scrollY;
      layout.style.setProperty('--lw-layout-top', `${Math.ceil(top)}px`);
    };
    const observer = new ResizeObserver(measure);
    observer.observe(summary);
    // What sits above the layout (title, alerts) changes the page around it.
    if (layout.parentElement) observer.observe(layout.parentElement);
    return () => observer.disconnect();
  }, [layoutRef, summaryRef]);
}

/** Scrolled this far down (px), the result tabs condense the summary; back within `CONDENSE_UNTIL_PX` of their top, it opens. */
const CONDENSE_FROM_PX = 48;
const CONDENSE_UNTIL_PX = 4;

/**
 * Marks the Results summary `data-condensed` while the result tabs (their own scroll box side by side from 80em) are
 * scrolled down, without a render; the stylesheet then drops the lines under each figure. The two thresholds keep
 * the summary from flickering when its change of height moves the scroll position.
 */
function useCondensedSummary(resultsRef: RefObject<HTMLElement | null>, summaryRef: RefObject<HTMLElement | null>) {
  useEffect(() => {
    const results = resultsRef.current;
    const summary = summaryRef.current;
    if (!results || !summary) return;
    const onScroll = () => {
      const isCondensed = summary.dataset.condensed === 'true';
      if (!isCondensed && results.scrollTop > CONDENSE_FROM_PX) summary.dataset.condensed = 'true';
      else if (isCondensed && results.scrollTop < CONDENSE_UNTIL_PX) summary.dataset.condensed = 'false';
    };
    results.addEventListener('scroll', onScroll, { passive: true });
    return () => results.removeEventListener('scroll', onScroll);
  }, [resultsRef, summaryRef]);
}

function EditableRevision({
  projectId,
  revision,
  latestRevisionNumber,
  revisions,
  isReadOnly,
  isArchived,
}: EditableRevisionProps) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const draft = useDesignDraft(revision.document, { isReadOnly });
  const [baseRevisionNumber, setBaseRevisionNumber] = useState(revision.number);
  const [stale, setStale] = useState<StaleBaseError | null>(null);
  const { data: shelf } = useParts(projectId);
  const live = useLiveAnalysis(draft.draft, shelf);
  const { analyzeAhead } = live;
  const { setDraft } = draft;
  // The worker starts on an edit before React renders it, so the engine and the keystroke's render overlap.
  const onFormChange = useCallback(
    (next: Design, key?: string) => {
      analyzeAhead(next);
      setDraft(next, key);
    },
    [analyzeAhead, setDraft],
  );
  const isDirty = draft.isDirty;
  const partIssues = (isDirty ? live.partIssues : revision.report.partIssues) ?? [];
  // The saved revision's figures come from its current stored simulation where there is one; a draft's are estimates.
  const simulated = useSimulatedFigures(projectId, revision.designId, revision.number, !isDirty);
  const simulation = simulated.data?.simulation ?? null;
  const headline = useHeadlineSource(isDirty ? null : revision.report, simulation, revision.document.targets);
  const report = isDirty ? live.report : (headline?.report ?? revision.report);
  const issueCount = Object.keys(live.issues).length;
  const save = useCreateRevision(projectId, revision.designId);

  const submit = (changeNote: string) => {
    save.mutate(
      { baseRevisionNumber, document: draft.draft, changeNote },
      {
        onSuccess: (saved) => {
          setStale(null);
          showNotification({
            title: `Saved as r${saved.number}`,
            message: 'The results shown are the server’s for this revision.',
          });
          void navigate(paths.design.getHref(projectId, saved.designId, saved.number));
        },
        onError: (error) => {
          const staleBase = staleBaseOf(error);
          setStale(staleBase);
          // The revision list and the latest number changed under us; the open revision stays (it is in the address).
          if (staleBase)
            void queryClient.invalidateQueries({
              queryKey: queryKeys.designs.detail(projectId, revision.designId),
              exact: true,
            });
        },
      },
    );
  };

  const layoutRef = useRef<HTMLDivElement>(null);
  const summaryRef = useRef<HTMLElement>(null);
  const resultsRef = useRef<HTMLElement>(null);
  useLayoutMeasures(layoutRef, summaryRef);
  useCondensedSummary(resultsRef, summaryRef);

  // The header is memoized: Save reaches the latest submit through a ref, so its handler keeps its identity.
  const submitRef = useRef(submit);
  useLayoutEffect(() => {
    submitRef.current = submit;
  });
  const onSave = useCallback((changeNote: string) => submitRef.current(changeNote), []);

  return (
    <Stack gap="sm">
      <WorkbenchHeader
        projectId={projectId}
        revision={revision}
        latestRevisionNumber={latestRevisionNumber}
        isDirty={isDirty}
        canUndo={draft.canUndo}
        canRedo={draft.canRedo}
        onUndo={draft.undo}
        onRedo={draft.redo}
        onDiscard={draft.discard}
        isReadOnly={isReadOnly}
        isArchived={isArchived}
        isSaving={save.isPending}
        issueCount={issueCount}
        onSave={onSave}
      />
      {stale && (
        <Suspense fallback={null}>
          <WorkbenchStaleAlert
            projectId={projectId}
            designId={revision.designId}
            stale={stale}
            baseRevisionNumber={baseRevisionNumber}
            onSaveOnTop={() => {
              setBaseRevisionNumber(stale.latestRevisionNumber);
              setStale(null);
            }}
          />
        </Suspense>
      )}
      {save.isError && !stale && (
        <Alert color="red" title="Not saved">
          {save.error.message}
        </Alert>
      )}

      <div className={classes.layout} ref={layoutRef}>
        <div className={classes.editing}>
          <section
            ref={summaryRef}
            className={classes.summary}
            aria-label="Results summary"
            data-live-pending={live.isPending ? 'true' : 'false'}
          >
            <Group gap="xs" mb={6}>
              <Text size="sm" fw={600}>
                Results
              </Text>
              <Badge
                variant="dot"
                color={isDirty ? 'ember' : 'verdigris'}
                radius="sm"
                tt="none"
                aria-live="polite"
                style={{ maxWidth: 'none' }}
              >
                {isDirty
                  ? live.isPending
                    ? 'live preview, updating…'
                    : 'live preview (unsaved edits)'
                  : `server result of r${revision.number} · ${headline?.source === 'simulation' ? `figures ${simulationSourceLabel(headline)}` : 'estimate'}`}
              </Badge>
            </Group>
            {live.engineError && isDirty && (
              <Alert color="red" title="The engine could not analyse this document">
                {live.engineError}
              </Alert>
            )}
            {!report && issueCount > 0 && (
              <Alert color="ember" title="Results wait for valid inputs">
                {issueCount} field{issueCount === 1 ? '' : 's'} to correct (marked beside each field and in the Form
                index).
              </Alert>
            )}
            {report && <VerdictStrip report={report} targets={draft.draft.targets} headline={headline} />}
          </section>
          <section className={classes.inputs} aria-label="Design inputs">
            <LadderForm
              document={draft.draft}
              onChange={onFormChange}
              issues={live.issues}
              parts={shelf ?? noParts}
              isReadOnly={isReadOnly}
            />
          </section>
        </div>
        <section className={classes.results} aria-label="Result tabs" ref={resultsRef}>
          {report && partIssues.length > 0 && (
            <Suspense fallback={null}>
              <PartIssuesAlert issues={partIssues} />
            </Suspense>
          )}
          {report && (
            <WorkbenchResults
              projectId={projectId}
              revision={revision}
              revisions={revisions}
              draft={draft.draft}
              isDirty={isDirty}
              report={report}
              canSimulate={!isArchived}
              headline={headline}
              shelf={shelf ?? noParts}
              {...(isReadOnly ? {} : { onDraftChange: (next: Design) => draft.setDraft(next) })}
            />
          )}
        </section>
      </div>
    </Stack>
  );
}
