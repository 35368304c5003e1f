import { Badge } from '@mantine/core';
import type { RevisionState } from '@ladderwright/shared/reviews';

const stateColors: Record<RevisionState, string> = {
  draft: 'gray',
  submitted: 'blue',
  returned: 'ember',
  approved: 'verdigris',
  released: 'teal',
  superseded: 'dark',
};

/** A revision's Sign-off state: the word is always written, the colour only supports it. */
export function RevisionStateBadge({ state }: { state: RevisionState }) {
  return (
    <Badge
      variant="light"
      color={stateColors[state]}
      radius="sm"
      tt="none"
      style={{ maxWidth: 'none', overflow: 'visible', flexShrink: 0 }}
      styles={{ label: { overflow: 'visible' } }}
    >
      {state}
    </Badge>
  );
}
