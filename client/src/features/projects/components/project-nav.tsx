import { NavLink, ScrollArea, Skeleton, Stack, Text } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';

export interface ProjectNavProps {
  projects: readonly ProjectSummary[] | undefined;
  activeProjectId: string | null;
  isLoading: boolean;
}

/** The navigation column: all projects, each opening onto its sections (Designs for now). */
export function ProjectNav({ projects, activeProjectId, isLoading }: ProjectNavProps) {
  return (
    <Stack gap={4} component="nav" aria-label="Projects">
      <NavLink
        component={Link}
        to={paths.projects.getHref()}
        label="All projects"
        active={activeProjectId === null}
        aria-current={activeProjectId === null ? 'page' : undefined}
        fw={500}
      />
      <Text size="xs" fw={600} c="dimmed" tt="uppercase" px="sm" pt="sm" pb={4}>
        Projects
      </Text>
      <ScrollArea.Autosize mah="calc(100vh - 160px)" type="auto">
        {isLoading && <Skeleton height={28} radius="sm" aria-label="Loading projects" />}
        {projects?.map((project) => {
          const isActive = project.id === activeProjectId;
          return (
            <div key={project.id}>
              <NavLink
                component={Link}
                to={paths.project.getHref(project.id)}
                label={project.name}
                description={project.productLine}
                fw={isActive ? 600 : 400}
              />
              {isActive && (
                <NavLink
                  component={Link}
                  to={paths.project.getHref(project.id)}
                  label="Designs"
                  active
                  aria-current="page"
                  pl="xl"
                />
              )}
              {isActive && (
                <NavLink
                  component={Link}
                  to={paths.compareDesigns.getHref(project.id)}
                  label="Compare designs"
                  pl="xl"
                />
              )}
              {isActive && <NavLink component={Link} to={paths.sizer.getHref(project.id)} label="Sizer" pl="xl" />}
              {isActive && (
                <NavLink component={Link} to={paths.partsShelf.getHref(project.id)} label="Parts shelf" pl="xl" />
              )}
            </div>
          );
        })}
      </ScrollArea.Autosize>
    </Stack>
  );
}
