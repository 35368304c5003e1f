import { lazy, Suspense, useState } from 'react';
import {
  Alert,
  Anchor,
  Badge,
  Breadcrumbs,
  Button,
  Grid,
  Loader,
  Group,
  List,
  Stack,
  Tabs,
  Text,
  TextInput,
  Title,
} from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import { notifications } from '@mantine/notifications';
import { useQueryClient, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, redirect, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import type { RevisionDetail, StaleBaseError } from '@ladderwright/shared/api';
import type { Design } from '@ladderwright/shared/designs';
import { paths } from '../../../config/paths';
import { queryKeys } from '../../../lib/query-keys';
import { staleBaseOf, useCreateRevision } from '../../../features/designs/api/create-revision';
import { getDesignQueryOptions } from '../../../features/designs/api/get-design';
import { getRevisionQueryOptions } from '../../../features/designs/api/get-revision';
import { RevisionStateBadge } from '../../../features/designs/components/revision-state-badge';
import { getPartsQueryOptions, useParts } from '../../../features/parts/api/get-parts';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { HeadlineFigures } from '../../../features/workbench/components/headline-figures';
import { LadderCharts } from '../../../features/workbench/components/ladder-charts';
import { LadderForm } from '../../../features/workbench/components/ladder-form';
import { useLiveAnalysis } from '../../../features/workbench/hooks/use-live-analysis';
import { requireUser } from './root';

// Result tabs other than the first load with their tab (keepMounted is off), not with the page.
const RevisionHistory = lazy(() =>
  import('../../../features/designs/components/revision-history').then((module) => ({
    default: module.RevisionHistory,
  })),
);
const BomCost = lazy(() =>
  import('../../../features/parts/components/bom-cost').then((module) => ({ default: module.BomCost })),
);
const WaveformsPanel = lazy(() =>
  import('../../../features/simulations/components/waveforms-panel').then((module) => ({
    default: module.WaveformsPanel,
  })),
);
const ChecksTable = lazy(() =>
  import('../../../features/workbench/components/checks-table').then((module) => ({ default: module.ChecksTable })),
);
const DriverPanel = lazy(() =>
  import('../../../features/workbench/components/driver-panel').then((module) => ({ default: module.DriverPanel })),
);
const LadderDiagram = lazy(() =>
  import('../../../features/workbench/components/ladder-diagram').then((module) => ({ default: module.LadderDiagram })),
);

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

/** The Workbench: a revision's document as a form with live results, saved as new revisions. */
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
      <Breadcrumbs>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Text size="sm">{design.name}</Text>
      </Breadcrumbs>
      <EditableRevision
        key={`${designId}-${revision.number}`}
        projectId={projectId}
        revision={revision}
        latestRevisionNumber={design.latestRevisionNumber}
        revisions={design.revisions}
      />
    </Stack>
  );
}

interface EditableRevisionProps {
  projectId: string;
  revision: RevisionDetail;
  latestRevisionNumber: number;
  revisions: Parameters<typeof RevisionHistory>[0]['revisions'];
}

function EditableRevision({ projectId, revision, latestRevisionNumber, revisions }: EditableRevisionProps) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [draft, setDraft] = useState<Design>(revision.document);
  const [baseRevisionNumber, setBaseRevisionNumber] = useState(revision.number);
  const [changeNote, setChangeNote] = useState('');
  const [stale, setStale] = useState<StaleBaseError | null>(null);
  const isDirty = draft !== revision.document;
  const { data: shelf } = useParts(projectId);
  const live = useLiveAnalysis(draft, shelf);
  const partIssues = (isDirty ? live.partIssues : revision.report.partIssues) ?? [];
  const report = isDirty ? live.report : revision.report;
  const save = useCreateRevision(projectId, revision.designId);

  const submit = () => {
    save.mutate(
      { baseRevisionNumber, document: draft, changeNote: changeNote.trim() },
      {
        onSuccess: (saved) => {
          setStale(null);
          notifications.show({
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

  return (
    <Stack gap="md">
      <Group justify="space-between" align="flex-end" wrap="wrap">
        <div>
          <Group gap="sm">
            <Title order={1} size="h2">
              Workbench
            </Title>
            <Badge variant="outline" radius="sm" tt="none">
              r{revision.number}
              {revision.number === latestRevisionNumber ? ' (latest)' : ` of ${latestRevisionNumber}`}
            </Badge>
            <RevisionStateBadge state={revision.state} />
            <Anchor
              component={Link}
              size="sm"
              to={paths.signOff.getHref(projectId, revision.designId, revision.number)}
            >
              Sign-off of r{revision.number}
            </Anchor>
            <Anchor
              component={Link}
              size="sm"
              to={paths.benchRuns.getHref(projectId, revision.designId, revision.number)}
            >
              Bench runs of r{revision.number}
            </Anchor>
          </Group>
          <Text size="sm" c="dimmed">
            {revision.changeNote || 'No change note'} · by {revision.authorName} · engine {revision.engineVersion}
          </Text>
        </div>
        <form
          onSubmit={(event) => {
            event.preventDefault();
            submit();
          }}
        >
          <Group gap="sm" align="flex-end">
            <TextInput
              label="Change note"
              placeholder="What changed and why"
              value={changeNote}
              onChange={(e) => setChangeNote(e.currentTarget.value)}
              w={300}
              required
            />
            <Button
              type="submit"
              loading={save.isPending}
              disabled={!isDirty || changeNote.trim() === '' || Object.keys(live.issues).length > 0}
            >
              Save revision
            </Button>
            {isDirty && (
              <Button variant="subtle" color="gray" onClick={() => setDraft(revision.document)}>
                Discard edits
              </Button>
            )}
          </Group>
        </form>
      </Group>

      {stale && (
        <Alert color="ember" title={`Someone saved r${stale.latestRevisionNumber} meanwhile: your edits are kept`}>
          <Text size="sm">
            Fields changed between r{baseRevisionNumber} and r{stale.latestRevisionNumber}:
          </Text>
          <List size="sm" my="xs">
            {stale.changedFields.map((field) => (
              <List.Item key={field}>
                <Text span ff="monospace" size="sm">
                  {field}
                </Text>
              </List.Item>
            ))}
          </List>
          <Group gap="sm">
            <Button
              size="xs"
              onClick={() => {
                setBaseRevisionNumber(stale.latestRevisionNumber);
                setStale(null);
              }}
            >
              Keep my edits, save on top of r{stale.latestRevisionNumber}
            </Button>
            <Button
              size="xs"
              variant="default"
              component={Link}
              to={paths.design.getHref(projectId, revision.designId, stale.latestRevisionNumber)}
            >
              Open r{stale.latestRevisionNumber} (drops my edits)
            </Button>
          </Group>
        </Alert>
      )}
      {save.isError && !stale && (
        <Alert color="red" title="Not saved">
          {save.error.message}
        </Alert>
      )}

      <Grid gap="lg">
        <Grid.Col span={{ base: 12, lg: 5 }}>
          <LadderForm document={draft} onChange={setDraft} issues={live.issues} parts={shelf ?? []} />
        </Grid.Col>
        <Grid.Col span={{ base: 12, lg: 7 }}>
          <Stack gap="sm" pos="sticky" top={64}>
            <Group gap="xs">
              <Text size="sm" fw={600}>
                Results
              </Text>
              <Badge variant="dot" color={isDirty ? 'ember' : 'verdigris'} radius="sm" tt="none" aria-live="polite">
                {isDirty
                  ? live.isPending
                    ? 'live preview, updating…'
                    : 'live preview (unsaved edits)'
                  : `server result of r${revision.number}`}
              </Badge>
            </Group>
            {live.engineError && isDirty && (
              <Alert color="red" title="The engine could not analyse this document">
                {live.engineError}
              </Alert>
            )}
            {!report && Object.keys(live.issues).length > 0 && (
              <Alert color="ember" title="Results wait for valid inputs">
                {Object.keys(live.issues).length} field{Object.keys(live.issues).length === 1 ? '' : 's'} to correct
                (marked beside each field).
              </Alert>
            )}
            {report && partIssues.length > 0 && (
              <Alert color="ember" title="Part codes not on this project's Parts shelf">
                <Text size="sm">Checked on the ratings written in the design instead:</Text>
                <List size="sm">
                  {partIssues.map((partIssue) => (
                    <List.Item key={partIssue.path}>
                      <Text span ff="monospace" size="sm">
                        {partIssue.path}
                      </Text>{' '}
                      {partIssue.message}
                    </List.Item>
                  ))}
                </List>
              </Alert>
            )}
            {report && (
              <>
                <HeadlineFigures report={report} targets={draft.targets} />
                <Tabs defaultValue="plots" keepMounted={false}>
                  <Tabs.List>
                    <Tabs.Tab value="plots">Plots</Tabs.Tab>
                    {report.driver && <Tabs.Tab value="driver">Driver</Tabs.Tab>}
                    <Tabs.Tab value="ladder">Ladder</Tabs.Tab>
                    <Tabs.Tab value="checks">Checks</Tabs.Tab>
                    <Tabs.Tab value="bom">BOM cost</Tabs.Tab>
                    <Tabs.Tab value="waveforms">Waveforms</Tabs.Tab>
                    <Tabs.Tab value="history">History</Tabs.Tab>
                  </Tabs.List>
                  <Tabs.Panel value="plots" pt="sm">
                    <LadderCharts report={report} />
                  </Tabs.Panel>
                  {report.driver && (
                    <Tabs.Panel value="driver" pt="sm">
                      <Suspense fallback={<Loader size="sm" />}>
                        <DriverPanel driver={report.driver} />
                      </Suspense>
                    </Tabs.Panel>
                  )}
                  <Tabs.Panel value="ladder" pt="sm">
                    <Suspense fallback={<Loader size="sm" />}>
                      <LadderDiagram report={report} design={draft} />
                    </Suspense>
                  </Tabs.Panel>
                  <Tabs.Panel value="checks" pt="sm">
                    <Text size="xs" c="dimmed" mb="xs">
                      {report.caution}
                    </Text>
                    <Suspense fallback={<Loader size="sm" />}>
                      <ChecksTable checks={report.checks} />
                    </Suspense>
                  </Tabs.Panel>
                  <Tabs.Panel value="bom" pt="sm">
                    <Suspense fallback={<Loader size="sm" />}>
                      <BomCost projectId={projectId} design={draft} />
                    </Suspense>
                  </Tabs.Panel>
                  <Tabs.Panel value="waveforms" pt="sm">
                    <Suspense fallback={<Loader size="sm" />}>
                      <WaveformsPanel
                        projectId={projectId}
                        source={
                          isDirty
                            ? { document: draft }
                            : { designId: revision.designId, revisionNumber: revision.number }
                        }
                        frequencyHz={report.resolvedDrive.frequencyHz}
                        safeVoltageV={draft.targets.safeVoltageV}
                        isDriverDesign={draft.drive.kind === 'driver'}
                      />
                    </Suspense>
                  </Tabs.Panel>
                  <Tabs.Panel value="history" pt="sm">
                    <Suspense fallback={<Loader size="sm" />}>
                      <RevisionHistory
                        projectId={projectId}
                        designId={revision.designId}
                        revisions={revisions}
                        openRevisionNumber={revision.number}
                      />
                    </Suspense>
                  </Tabs.Panel>
                </Tabs>
              </>
            )}
          </Stack>
        </Grid.Col>
      </Grid>
    </Stack>
  );
}
