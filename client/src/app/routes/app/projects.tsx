import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { getProjectsQueryOptions, useProjects } from '../../../features/projects/api/get-projects';
import { ProjectList } from '../../../features/projects/components/project-list';
import { requireUser } from './root';

export function projectsLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.prefetchQuery(getProjectsQueryOptions());
    return null;
  };
}

export function ProjectsRoute() {
  useDocumentTitle('Projects · Ladderwright');
  const projects = useProjects();
  const { data: me } = useMe();
  return (
    <Stack gap="lg">
      <div>
        <Title order={1} size="h2">
          Projects
        </Title>
        <Text c="dimmed" size="sm">
          The product lines you work on. Open one to see its Designs.
        </Text>
      </div>
      {projects.isPending && <Loader size="sm" aria-label="Loading projects" />}
      {projects.isError && (
        <Alert color="red" variant="light" role="alert" title="Projects could not be loaded">
          {projects.error.message}
        </Alert>
      )}
      {projects.data && <ProjectList projects={projects.data} accountRole={me?.role} />}
    </Stack>
  );
}
