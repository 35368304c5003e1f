import { canActInProject } from '@ladderwright/shared/auth';
import { Anchor, Button, Group, Stack, Text, Title } from '@mantine/core';
import { Trail } from '../../../components/trail';
import { useDisclosure, useDocumentTitle } from '@mantine/hooks';
import { useSuspenseQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { CreateDesignModal } from '../../../features/designs/components/create-design-modal';
import { DesignTable } from '../../../features/designs/components/design-table';
import { getProjectQueryOptions } from '../../../features/projects/api/get-project';
import { ProjectRoleBadge } from '../../../features/projects/components/project-role-badge';
import { requireProjectLoader } from './root';

export const projectDesignsLoader = requireProjectLoader;

/** A project's home: its Designs, with search, filters and the ways to start a new design. */
export function ProjectDesignsRoute() {
  const { projectId = '' } = useParams();
  const { data: project } = useSuspenseQuery(getProjectQueryOptions(projectId));
  useDocumentTitle(`${project.name} · Designs · Ladderwright`);
  const [isCreateOpen, createModal] = useDisclosure(false);
  const navigate = useNavigate();
  return (
    <Stack gap="lg">
      <Trail>
        <Anchor component={Link} to={paths.projects.getHref()} size="sm">
          Projects
        </Anchor>
        <Text size="sm">{project.name}</Text>
      </Trail>
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
        <Group justify="space-between" mb="md">
          <Title order={2} size="h3" id="designs-heading">
            Designs
          </Title>
          <Group gap="sm">
            {canActInProject(project, 'design.write') && (
              <>
                <Button variant="default" component={Link} to={paths.sizer.getHref(projectId)}>
                  Open the Sizer
                </Button>
                <Button onClick={createModal.open}>New design</Button>
              </>
            )}
          </Group>
        </Group>
        <DesignTable projectId={projectId} members={project.members} />
        <CreateDesignModal
          projectId={projectId}
          isOpen={isCreateOpen}
          onClose={createModal.close}
          onCreated={(design) => {
            createModal.close();
            void navigate(paths.design.getHref(projectId, design.id));
          }}
        />
      </section>
    </Stack>
  );
}
