import { canActInProject } from '@ladderwright/shared/auth';
import { Anchor, Paper, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { useBenchRun } from '../../../features/bench-runs/api/get-bench-run';
import { useBenchRuns } from '../../../features/bench-runs/api/get-bench-runs';
import { CalibrationPanel } from '../../../features/calibrations/components/calibration-panel';
import { BenchOverlay } from '../../../features/bench-runs/components/bench-overlay';
import { BenchRunList } from '../../../features/bench-runs/components/bench-run-list';
import { BenchRunUpload } from '../../../features/bench-runs/components/bench-run-upload';
import { getDesignQueryOptions } from '../../../features/designs/api/get-design';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { requireProjectLoader } from './root';

export const benchRunsLoader = requireProjectLoader;

/** Bench runs of one revision: upload measured data, see it over the prediction with the verdict. */
export function BenchRunsRoute() {
  const { projectId = '', designId = '', revisionNumber: rawNumber = '' } = useParams();
  const revisionNumber = Number(rawNumber);
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  // The design's name for the trail: read when at hand, the page does not wait for it.
  const { data: design } = useQuery(getDesignQueryOptions(projectId, designId));
  useDocumentTitle(`${project.name} · Bench runs · Ladderwright`);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const selected = useBenchRun(projectId, designId, revisionNumber, selectedId);
  const canUpload = canActInProject(project, 'bench.upload');
  const benchRuns = useBenchRuns(projectId, designId, revisionNumber);
  const navigate = useNavigate();
  return (
    <Stack gap="lg">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Anchor component={Link} to={paths.design.getHref(projectId, designId, revisionNumber)} size="sm">
          {design ? `${design.name} r${revisionNumber}` : `Workbench, revision ${revisionNumber}`}
        </Anchor>
        <Text size="sm">Bench runs</Text>
      </Trail>
      <Title order={1} size="h2">
        Bench runs · revision {revisionNumber}
      </Title>
      {canUpload && (
        <Paper withBorder p="md">
          <BenchRunUpload
            projectId={projectId}
            designId={designId}
            revisionNumber={revisionNumber}
            onUploaded={(run) => setSelectedId(run.id)}
          />
        </Paper>
      )}
      <BenchRunList
        projectId={projectId}
        designId={designId}
        revisionNumber={revisionNumber}
        selectedId={selectedId}
        onSelect={setSelectedId}
        canDelete={canUpload}
        emptyHint={
          canUpload
            ? 'Upload a load sweep (current, voltage) or a scope capture (time, voltage) above: it is drawn over the prediction with a verdict.'
            : 'An engineer or lead of the project uploads them here.'
        }
      />
      {selected.data && (
        <Paper withBorder p="md">
          <Title order={2} size="h4" mb="sm">
            {selected.data.title || 'Measured on predicted'}
          </Title>
          <BenchOverlay run={selected.data} />
        </Paper>
      )}
      {selected.error && <Text c="red">{selected.error.message}</Text>}
      <Paper withBorder p="md">
        <CalibrationPanel
          projectId={projectId}
          designId={designId}
          revisionNumber={revisionNumber}
          runs={(benchRuns.data ?? []).map((run) => ({
            id: run.id,
            title: run.title,
            kind: run.kind,
            pointCount: run.pointCount,
          }))}
          canRun={canUpload}
          onRevisionStarted={(number) => void navigate(paths.design.getHref(projectId, designId, number))}
        />
      </Paper>
    </Stack>
  );
}
