import { Alert, Anchor, Text } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { ProjectSummary } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';

/** Shown above every page of an archived project: it reads, it takes no changes; a lead may unarchive it. */
export function ArchivedProjectNotice({ project }: { project: ProjectSummary }) {
  return (
    <Alert color="gray" title={`${project.name} is archived`} mb="md" data-archived-project={project.id}>
      <Text size="sm">
        Everything here can be read and exported; nothing can be saved, submitted, uploaded or changed.
        {project.myRole === 'lead' && (
          <>
            {' '}
            <Anchor component={Link} to={paths.projectSettings.getHref(project.id)} size="sm">
              Unarchive it in Settings
            </Anchor>
            .
          </>
        )}
      </Text>
    </Alert>
  );
}
