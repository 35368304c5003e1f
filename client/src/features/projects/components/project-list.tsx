import { Card, EmptyState, Group, SimpleGrid, Stack, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';
import { ProjectRoleBadge } from './project-role-badge';

export interface ProjectListProps {
  projects: readonly ProjectSummary[];
}

function memberCountLabel(count: number): string {
  return count === 1 ? '1 member' : `${count} members`;
}

export function ProjectList({ projects }: ProjectListProps) {
  if (projects.length === 0) {
    return (
      <EmptyState
        title="No projects yet"
        description="You are not a member of any project. A lead can add you to one."
      />
    );
  }
  return (
    <SimpleGrid cols={{ base: 1, sm: 2, lg: 3 }} spacing="md" component="ul" p={0} m={0} style={{ listStyle: 'none' }}>
      {projects.map((project) => (
        <Card key={project.id} component="li" withBorder padding="md" aria-labelledby={`project-${project.id}-name`}>
          <Stack gap="xs" h="100%">
            <Group justify="space-between" align="flex-start" wrap="nowrap">
              <Title order={3} size="h4" id={`project-${project.id}-name`}>
                <Text component={Link} to={paths.project.getHref(project.id)} inherit c="inherit" td="none">
                  {project.name}
                </Text>
              </Title>
              <ProjectRoleBadge role={project.myRole} />
            </Group>
            <Text size="sm" c="dimmed">
              {project.productLine}
            </Text>
            <Text size="sm" lineClamp={3} style={{ flexGrow: 1 }}>
              {project.description}
            </Text>
            <Text size="xs" c="dimmed">
              {memberCountLabel(project.memberCount)}
            </Text>
          </Stack>
        </Card>
      ))}
    </SimpleGrid>
  );
}
