import { Button, Group, List, Modal, Stack, Text } from '@mantine/core';
import { formatQuantity } from '@ladderwright/shared/units';
import { placeLabel, type RoleChange } from '../../ladder-edits';

export interface CapacitorMoveDialogProps {
  /** The new shape: its count of cells (stages for a full-wave cascade) and the topology's label. */
  cellCount: number;
  isFullWave: boolean;
  topologyLabel: string;
  changes: RoleChange[];
  onCancel: () => void;
  /** Applies the new shape, with the values kept at their places or moved with their numbers. */
  onApply: (isKeepingPlaces: boolean) => void;
}

/** Asks before a change of shape moves capacitors to other places in the ladder, naming each one. */
export function CapacitorMoveDialog({
  cellCount,
  isFullWave,
  topologyLabel,
  changes,
  onCancel,
  onApply,
}: CapacitorMoveDialogProps) {
  return (
    <Modal opened onClose={onCancel} title="Capacitors change places" size="lg">
      <Stack gap="sm">
        <Text size="sm">
          With {cellCount} {isFullWave ? 'stages' : 'cells'} ({topologyLabel}), these capacitors keep their number and
          value but sit elsewhere in the ladder:
        </Text>
        <List size="sm" aria-label="Capacitors that move">
          {changes.map((change) => (
            <List.Item key={change.index}>
              C{change.index + 1} ({formatQuantity(change.capacitor.valueF, 'F')}, rated{' '}
              {formatQuantity(change.capacitor.ratedVoltageV, 'V')}): {placeLabel(change.from)} →{' '}
              {placeLabel(change.to)}
            </List.Item>
          ))}
        </List>
        <Group justify="flex-end" gap="sm">
          <Button variant="default" onClick={onCancel}>
            Cancel
          </Button>
          <Button variant="light" onClick={() => onApply(true)}>
            Keep values at their places
          </Button>
          <Button onClick={() => onApply(false)}>Move them</Button>
        </Group>
      </Stack>
    </Modal>
  );
}
