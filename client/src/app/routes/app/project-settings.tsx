import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { useProject } from '../../../features/projects/api/get-project';
import { ProjectSettingsForm } from '../../../features/project-settings/components/project-settings-form';
import { requireProjectLoader } from './root';

export function projectSettingsLoader(queryClient: QueryClient) {
  return requireProjectLoader(queryClient);
}

export function ProjectSettingsRoute() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  useDocumentTitle(`Settings · ${project.data?.name ?? 'Project'} · Ladderwright`);
  return (
    <Stack gap="lg">
      <div>
        <Title order={1} size="h2">
          Project settings
        </Title>
        <Text c="dimmed" size="sm">
          {project.data?.name}
        </Text>
      </div>
      {project.isPending && <Loader size="sm" aria-label="Loading the project" />}
      {project.isError && <Alert color="red">{project.error.message}</Alert>}
      {project.data &&
        (project.data.myRole === 'lead' ? (
          <ProjectSettingsForm key={project.data.id} project={project.data} />
        ) : (
          <Alert color="gray">Only a lead of this project changes its settings.</Alert>
        ))}
    </Stack>
  );
}
