import { NavLink, ScrollArea, Skeleton, Stack, Text } from '@mantine/core';
import { Link, useLocation } from 'react-router-dom';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';

export interface ProjectNavProps {
  projects: readonly ProjectSummary[] | undefined;
  activeProjectId: string | null;
  isLoading: boolean;
}

/** The navigation column: all projects, each opening onto its sections (Designs for now). */
export function ProjectNav({ projects, activeProjectId, isLoading }: ProjectNavProps) {
  const { pathname } = useLocation();
  /** A section link of the open project, marked current when its page is open. */
  const section = (href: string, label: string, isCurrent = pathname === href) => (
    <NavLink
      component={Link}
      to={href}
      label={label}
      active={isCurrent}
      aria-current={isCurrent ? 'page' : undefined}
      pl="xl"
    />
  );
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
                description={project.isArchived ? `${project.productLine} · archived` : project.productLine}
                fw={isActive ? 600 : 400}
              />
              {isActive && (
                <>
                  {section(
                    paths.project.getHref(project.id),
                    'Designs',
                    !pathname.endsWith('/sizer') &&
                      !pathname.endsWith('/parts') &&
                      !pathname.endsWith('/members') &&
                      !pathname.endsWith('/settings') &&
                      !pathname.endsWith('/compare'),
                  )}
                  {section(paths.compareDesigns.getHref(project.id), 'Compare designs')}
                  {section(paths.sizer.getHref(project.id), 'Sizer')}
                  {section(paths.partsShelf.getHref(project.id), 'Parts shelf')}
                  {section(paths.projectMembers.getHref(project.id), 'Members')}
                  {project.myRole === 'lead' && section(paths.projectSettings.getHref(project.id), 'Settings')}
                </>
              )}
            </div>
          );
        })}
      </ScrollArea.Autosize>
    </Stack>
  );
}
