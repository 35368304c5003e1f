import { Alert, Anchor, Loader, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams } from 'react-router-dom';
import { Trail } from '../../../components/trail';
import { paths } from '../../../config/paths';
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
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Anchor component={Link} to={paths.project.getHref(projectId)} size="sm">
          {project.data?.name ?? 'Project'}
        </Anchor>
        <Text size="sm">Members</Text>
      </Trail>
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
