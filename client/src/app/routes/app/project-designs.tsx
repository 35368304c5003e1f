import { Anchor, Breadcrumbs, Group, Stack, Text, Title } from '@mantine/core';
import { useDocumentTitle } from '@mantine/hooks';
import { useSuspenseQuery, type QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { DesignsEmpty } from '../../../features/designs/components/designs-empty';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { ProjectRoleBadge } from '../../../features/projects/components/project-role-badge';
import { requireUser } from './root';

export function projectDesignsLoader(queryClient: QueryClient) {
  return async ({ params, request }: LoaderFunctionArgs) => {
    await requireUser(queryClient, request);
    await queryClient.ensureQueryData(getProjectQueryOptions(params.projectId ?? ''));
    return null;
  };
}

/** A project's home: its Designs (an empty state until designs arrive with their own endpoint). */
export function ProjectDesignsRoute() {
  const { projectId = '' } = useParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  useDocumentTitle(`${project.name} · Designs · Ladderwright`);
  return (
    <Stack gap="lg">
      <Breadcrumbs>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Text size="sm">{project.name}</Text>
      </Breadcrumbs>
      <div>
        <Group gap="sm" align="center">
          <Title order={1} size="h2">
            {project.name}
          </Title>
          <ProjectRoleBadge role={project.myRole} />
        </Group>
        <Text c="dimmed" size="sm">
          {project.productLine}
        </Text>
      </div>
      <section aria-labelledby="designs-heading">
        <Title order={2} size="h3" id="designs-heading" mb="md">
          Designs
        </Title>
        <DesignsEmpty />
      </section>
    </Stack>
  );
}
