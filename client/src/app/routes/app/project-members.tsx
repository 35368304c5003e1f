import { Alert, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { useMe } from '../../../features/auth/api/get-me';
import { MemberRequestsPanel } from '../../../features/members/components/member-requests-panel';
import { MembersPanel } from '../../../features/members/components/members-panel';
import { useProject } from '../../../features/projects/api/get-project';
import { requireProjectLoader } from './root';

export function projectMembersLoader(queryClient: QueryClient) {
  return requireProjectLoader(queryClient);
}

export function ProjectMembersRoute() {
  const { projectId = '' } = useParams();
  const project = useProject(projectId);
  const { data: me } = useMe();
  useDocumentTitle(`Members · ${project.data?.name ?? 'Project'} · Ladderwright`);
  return (
    <Stack gap="lg">
      <div>
        <Title order={1} size="h2">
          Members
        </Title>
        <Text c="dimmed" size="sm">
          {project.data?.name}
          {project.data?.isArchived ? ' · archived' : ''}
        </Text>
      </div>
      {project.isPending && <Loader size="sm" aria-label="Loading the members" />}
      {project.isError && <Alert color="red">{project.error.message}</Alert>}
      {project.data && me && <MembersPanel project={project.data} myUserId={me.id} />}
      {project.data && <MemberRequestsPanel project={project.data} />}
    </Stack>
  );
}
