import { canActInProject } from '@ladderwright/shared/auth';
import { Anchor, Button, Group, Paper, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDocumentTitle } from '@mantine/hooks';
import { useSuspenseQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { apiPaths, paths } from '../../../config/paths';
import { AddPartForm } from '../../../features/parts/components/add-part-form';
import { PartsImport } from '../../../features/parts/components/parts-import';
import { PartsTable } from '../../../features/parts/components/parts-table';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { requireProjectLoader } from './root';

export const partsShelfLoader = requireProjectLoader;

/** The project's Parts shelf: everyone reads it; leads add, import and remove parts. */
export function PartsShelfRoute() {
  const { projectId = '' } = useParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  useDocumentTitle(`${project.name} · Parts shelf · Ladderwright`);
  const canManage = canActInProject(project, 'parts.manage');
  // Rows pasted into the Add-a-part form go to the import's preview.
  const [pasted, setPasted] = useState<{ file: File; serial: number } | null>(null);
  return (
    <Stack gap="lg">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.name}
        </Anchor>
        <Text size="sm">Parts shelf</Text>
      </Trail>
      <Group justify="space-between">
        <Title order={1} size="h2">
          Parts shelf
        </Title>
        <Button component="a" variant="default" href={apiPaths.exportParts(projectId)} download>
          Export CSV
        </Button>
      </Group>
      <Stack gap={4}>
        <PartsTable projectId={projectId} canManage={canManage} />
        <Text size="xs" c="dimmed">
          Unit costs are in the team’s currency; wire and tape per metre.
        </Text>
      </Stack>
      {canManage ? (
        <>
          <Paper withBorder p="md">
            <Title order={2} size="h4" mb="sm">
              Add a part
            </Title>
            <AddPartForm
              projectId={projectId}
              onPasteRows={(file) => setPasted((last) => ({ file, serial: (last?.serial ?? 0) + 1 }))}
            />
          </Paper>
          <Paper withBorder p="md">
            <Title order={2} size="h4" mb="sm">
              Import from CSV
            </Title>
            <PartsImport key={pasted?.serial ?? 0} projectId={projectId} pasted={pasted?.file ?? null} />
          </Paper>
        </>
      ) : (
        <Text size="sm" c="dimmed">
          {project.isArchived
            ? 'The project is archived: the shelf can be read and exported but not changed.'
            : 'The project lead manages this shelf.'}
        </Text>
      )}
    </Stack>
  );
}
