import { headlineSource } from '@ladderwright/shared/analysis';
import { formatQuantity } from '@ladderwright/shared/units';
import { canActInProject } from '@ladderwright/shared/auth';
import { useMemo } from 'react';
import { Accordion, Anchor, Button, Grid, Group, Paper, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useQuery, useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { BenchRunList } from '../../../features/bench-runs/components/bench-run-list';
import { CalibrationList } from '../../../features/calibrations/components/calibration-list';
import { getDesignQueryOptions } from '../../../features/designs/api/get-design';
import { getRevisionQueryOptions } from '../../../features/designs/api/get-revision';
import { RevisionStateBadge } from '../../../components/revision-state-badge';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { anchorOptionsOf } from '../../../features/sign-off/anchor-options';
import { getSignOffQueryOptions } from '../../../features/sign-off/api/get-sign-off';
import { CommentThreads } from '../../../features/sign-off/components/comment-threads';
import { SignOffError } from '../../../features/sign-off/components/sign-off-error';
import { SignOffPanel } from '../../../features/sign-off/components/sign-off-panel';
import { SpecSheetDownload } from '../../../features/sign-off/components/spec-sheet-download';
import { useSimulatedFigures } from '../../../features/workbench/api/get-simulated-figures';
import { ChecksTable, checkRowCounts } from '../../../features/workbench/components/checks-table';
import { VerdictStrip } from '../../../features/workbench/components/verdict-strip';
import { requireUser } from './root';
import { formatDateTime } from '../../../lib/format-date';

function routeParams(params: Record<string, string | undefined>) {
  return {
    projectId: params.projectId ?? '',
    designId: params.designId ?? '',
    revisionNumber: Number(params.revisionNumber),
  };
}

export function signOffLoader(queryClient: QueryClient) {
  return async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    const { projectId, designId, revisionNumber } = routeParams(params);
    await Promise.all([
      queryClient.ensureQueryData(getProjectQueryOptions(projectId)),
      queryClient.ensureQueryData(getDesignQueryOptions(projectId, designId)),
      queryClient.ensureQueryData(getRevisionQueryOptions(projectId, designId, revisionNumber)),
      queryClient.prefetchQuery(getSignOffQueryOptions(projectId, designId, revisionNumber)),
    ]);
    return null;
  };
}

/** Sign-off of one revision: its results and Checks, the commands open to the caller, comments, history, Spec sheet. */
export function SignOffRoute() {
  const { projectId, designId, revisionNumber } = routeParams(useParams());
  const navigate = useNavigate();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  const { data: design } = useSuspenseQuery(getDesignQueryOptions(projectId, designId));
  const { data: revision } = useSuspenseQuery(getRevisionQueryOptions(projectId, designId, revisionNumber));
  const signOff = useQuery(getSignOffQueryOptions(projectId, designId, revisionNumber));
  const anchorOptions = useMemo(() => anchorOptionsOf(revision.document, revision.report), [revision]);
  useDocumentTitle(`${design.name} r${revisionNumber} · Sign-off · Ladderwright`);
  const state = signOff.data?.state ?? revision.state;
  // The revision's current stored simulation, where there is one, stands for the estimate as on the Workbench.
  const simulated = useSimulatedFigures(projectId, designId, revisionNumber, true);
  const simulation = simulated.data?.simulation ?? null;
  const headline = useMemo(
    () => headlineSource(revision.report, simulation, revision.document.targets),
    [revision, simulation],
  );
  const report = headline.report;
  const checkCounts = checkRowCounts(report.checks);

  return (
    <Stack gap="md">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Anchor component={Link} to={paths.design.getHref(projectId, designId, revisionNumber)} size="sm">
          {design.name}
        </Anchor>
        <Text size="sm">Sign-off</Text>
      </Trail>
      <Group justify="space-between" align="flex-end" wrap="wrap">
        <div>
          <Group gap="sm">
            <Title order={1} size="h2">
              Sign-off · {design.name} r{revisionNumber}
            </Title>
            <Text span size="sm" fw={600}>
              State:
            </Text>
            <span data-sign-off-state={state}>
              <RevisionStateBadge state={state} />
            </span>
          </Group>
          <Text size="sm" c="dimmed">
            {revision.changeNote ? `“${revision.changeNote}”` : 'No change note'} · by {revision.authorName} ·{' '}
            {formatDateTime(revision.createdAt)}
            {revisionNumber !== design.latestRevisionNumber && ` · the latest is r${design.latestRevisionNumber}`}
          </Text>
        </div>
        <Group gap="xs">
          <Button variant="default" component={Link} to={paths.design.getHref(projectId, designId, revisionNumber)}>
            Open in the Workbench
          </Button>
          {revisionNumber !== design.latestRevisionNumber && (
            <Button
              variant="subtle"
              component={Link}
              to={paths.signOff.getHref(projectId, designId, design.latestRevisionNumber)}
            >
              Sign-off of r{design.latestRevisionNumber}
            </Button>
          )}
        </Group>
      </Group>

      <Paper withBorder p="md">
        <Title order={2} size="h4" mb="xs">
          Results of r{revisionNumber} (
          {headline.source === 'simulation'
            ? `figures from its stored simulation${headline.notSettledWithinS === null ? '' : `, not settled within ${formatQuantity(headline.notSettledWithinS, 's')}`}`
            : 'estimate stored with the revision'}
          )
        </Title>
        <VerdictStrip report={revision.report} targets={revision.document.targets} headline={headline} />
      </Paper>
      <Grid gap="lg">
        <Grid.Col span={{ base: 12, lg: 7 }}>
          <Stack gap="md">
            {signOff.isPending && <Text size="sm">Loading the Sign-off…</Text>}
            <SignOffError error={signOff.error} fallbackTitle="The Sign-off could not be loaded" />
            {signOff.data && <SignOffPanel signOff={signOff.data} />}
            <Paper withBorder p="md">
              <CommentThreads
                projectId={projectId}
                designId={designId}
                revisionNumber={revisionNumber}
                anchorOptions={anchorOptions}
                canComment={signOff.isSuccess && canActInProject(project, 'review.comment')}
              />
            </Paper>
          </Stack>
        </Grid.Col>
        <Grid.Col span={{ base: 12, lg: 5 }}>
          <Stack gap="md">
            <Paper withBorder p="md">
              <Group justify="space-between" mb="xs">
                <Title order={2} size="h4">
                  Bench runs
                </Title>
                <Anchor component={Link} size="sm" to={paths.benchRuns.getHref(projectId, designId, revisionNumber)}>
                  Open Bench runs
                </Anchor>
              </Group>
              <BenchRunList
                projectId={projectId}
                designId={designId}
                revisionNumber={revisionNumber}
                selectedId={null}
                onSelect={() => void navigate(paths.benchRuns.getHref(projectId, designId, revisionNumber))}
                canDelete={false}
              />
            </Paper>
            <Paper withBorder p="md">
              <Title order={2} size="h4" mb="xs">
                Calibrations
              </Title>
              <CalibrationList projectId={projectId} designId={designId} revisionNumber={revisionNumber} />
            </Paper>
            <Paper withBorder p="md">
              <Title order={2} size="h4" mb="xs">
                Spec sheet (PDF)
              </Title>
              <SpecSheetDownload
                projectId={projectId}
                designId={designId}
                designName={design.name}
                revisionNumber={revisionNumber}
                state={state}
                projectRole={project.myRole}
              />
            </Paper>
            {revision.document.drive.kind === 'driver' &&
              revision.document.drive.driver.transformerChoice === 'designed' && (
                <Paper withBorder p="md">
                  <Title order={2} size="h4" mb="xs">
                    Transformer sheet (PDF)
                  </Title>
                  <SpecSheetDownload
                    projectId={projectId}
                    designId={designId}
                    designName={design.name}
                    revisionNumber={revisionNumber}
                    state={state}
                    projectRole={project.myRole}
                    sheet="transformer"
                  />
                </Paper>
              )}
          </Stack>
        </Grid.Col>
      </Grid>
      <Paper withBorder>
        <Accordion chevronPosition="left">
          <Accordion.Item value="checks">
            <Accordion.Control aria-label={`Checks: ${checkCounts}`}>
              <Text fw={600}>Checks: {checkCounts}</Text>
            </Accordion.Control>
            <Accordion.Panel>
              <Text size="xs" c="dimmed" mb="xs">
                {report.caution}
              </Text>
              <ChecksTable checks={report.checks} />
            </Accordion.Panel>
          </Accordion.Item>
        </Accordion>
      </Paper>
    </Stack>
  );
}
