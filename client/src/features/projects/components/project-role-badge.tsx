import { Badge } from '@mantine/core';
import type { ProjectRole } from '@ladderwright/shared/auth';

const roleColors: Record<ProjectRole, string> = {
  engineer: 'verdigris',
  reviewer: 'indigo',
  lead: 'ember',
};

/** The user's role in a project, as a word (the colour is only a second cue). */
export function ProjectRoleBadge({ role }: { role: ProjectRole }) {
  return (
    <Badge variant="light" color={roleColors[role]} radius="sm" tt="none" style={{ flexShrink: 0 }}>
      {role}
    </Badge>
  );
}
