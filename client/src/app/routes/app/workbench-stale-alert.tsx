import { Alert, Button, Group, List, Text } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { StaleBaseError } from '@ladderwright/shared/api';
import { documentFieldLabel } from '@ladderwright/shared/designs';
import { paths } from '../../../config/paths';

export interface WorkbenchStaleAlertProps {
  projectId: string;
  designId: string;
  stale: StaleBaseError;
  baseRevisionNumber: number;
  onSaveOnTop: () => void;
}

/** Someone saved a newer revision while this one was edited: what changed meanwhile, and the two ways on. */
export function WorkbenchStaleAlert({
  projectId,
  designId,
  stale,
  baseRevisionNumber,
  onSaveOnTop,
}: WorkbenchStaleAlertProps) {
  return (
    <Alert color="ember" title={`Someone saved r${stale.latestRevisionNumber} meanwhile: your edits are kept`}>
      <Text size="sm">
        Fields changed between r{baseRevisionNumber} and r{stale.latestRevisionNumber}:
      </Text>
      <List size="sm" my="xs">
        {stale.changedFields.map((field) => (
          <List.Item key={field}>{documentFieldLabel(field).label}</List.Item>
        ))}
      </List>
      <Group gap="sm">
        <Button size="xs" onClick={onSaveOnTop}>
          Keep my edits, save on top of r{stale.latestRevisionNumber}
        </Button>
        <Button
          size="xs"
          variant="default"
          component={Link}
          to={paths.design.getHref(projectId, designId, stale.latestRevisionNumber)}
        >
          Open r{stale.latestRevisionNumber} (drops my edits)
        </Button>
      </Group>
    </Alert>
  );
}
