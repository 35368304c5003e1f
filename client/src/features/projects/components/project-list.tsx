import { Button, Card, EmptyState, Group, SimpleGrid, Stack, Text, Title } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { ProjectSummary } from '@ladderwright/shared/api';
import type { UserRole } from '@ladderwright/shared/auth';
import { paths } from '../../../config/paths';
import { ProjectRoleBadge } from './project-role-badge';

export interface ProjectListProps {
  projects: readonly ProjectSummary[];
  /** The signed-in account's role: an admin with no project is shown where the admin's own pages are. */
  accountRole?: UserRole;
}

function memberCountLabel(count: number): string {
  return count === 1 ? '1 member' : `${count} members`;
}

export function ProjectList({ projects, accountRole }: ProjectListProps) {
  if (projects.length === 0 && accountRole === 'admin') {
    // A project shows only to its members, and an admin account is a member of none until a lead adds it.
    return (
      <EmptyState
        title="No projects of yours"
        description="Projects show only to their members; an admin account sees one once a project’s lead adds it. The team’s accounts and the audit log are yours, and the Outbox above holds the captured mail."
      >
        <EmptyState.Actions>
          <Button component={Link} to={paths.accounts.getHref()} variant="light">
            Accounts
          </Button>
          <Button component={Link} to={paths.auditLog.getHref()} variant="default">
            Audit log
          </Button>
        </EmptyState.Actions>
      </EmptyState>
    );
  }
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
