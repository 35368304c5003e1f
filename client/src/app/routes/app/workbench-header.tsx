import { memo, useState } from 'react';
import { ActionIcon, Anchor, Badge, Button, Group, Text, TextInput, Title, Tooltip } from '@mantine/core';
import { Link } from 'react-router-dom';
import type { RevisionDetail } from '@ladderwright/shared/api';
import { paths } from '../../../config/paths';
import { formatDateTime } from '../../../lib/format-date';
import { RevisionStateBadge } from '../../../components/revision-state-badge';
import { NATIVE_UNDO_ATTRIBUTE } from '../../../features/workbench/hooks/use-design-draft';

export interface WorkbenchHeaderProps {
  projectId: string;
  revision: RevisionDetail;
  latestRevisionNumber: number;
  /** The draft differs from the saved document. */
  isDirty: boolean;
  canUndo: boolean;
  canRedo: boolean;
  onUndo: () => void;
  onRedo: () => void;
  /** Back to the saved document (one step that can be undone). */
  onDiscard: () => void;
  /** A reviewer's view: no change note, no Save, no undo. */
  isReadOnly: boolean;
  /** Read-only because the project is archived (not because of the role). */
  isArchived: boolean;
  isSaving: boolean;
  /** Fields that block a save (validation issues). */
  issueCount: number;
  onSave: (changeNote: string) => void;
}

/**
 * The Workbench title with the revision, its state and links, and the save bar (change note, Save, undo, redo).
 * Memoized: a keystroke in the form renders it only when one of these props changes (e.g. undo becomes possible).
 */
export const WorkbenchHeader = memo(function WorkbenchHeader({
  projectId,
  revision,
  latestRevisionNumber,
  isDirty,
  canUndo,
  canRedo,
  onUndo,
  onRedo,
  onDiscard,
  isReadOnly,
  isArchived,
  isSaving,
  issueCount,
  onSave,
}: WorkbenchHeaderProps) {
  const [changeNote, setChangeNote] = useState('');
  return (
    <Group justify="space-between" align="flex-end" wrap="wrap" gap="sm">
      <div>
        <Group gap="sm" wrap="wrap">
          <Title order={1} size="h2">
            Workbench
          </Title>
          <Badge variant="outline" radius="sm" tt="none" style={{ flexShrink: 0, maxWidth: 'none' }}>
            r{revision.number}
            {revision.number === latestRevisionNumber ? ' (latest)' : ` of ${latestRevisionNumber}`}
          </Badge>
          <RevisionStateBadge state={revision.state} />
          {isReadOnly && (
            <Badge variant="light" color="gray" radius="sm" tt="none" style={{ flexShrink: 0, maxWidth: 'none' }}>
              {isArchived ? 'read-only (archived project)' : 'read-only (reviewer)'}
            </Badge>
          )}
          <Anchor component={Link} size="sm" to={paths.signOff.getHref(projectId, revision.designId, revision.number)}>
            Sign-off of r{revision.number}
          </Anchor>
          <Anchor
            component={Link}
            size="sm"
            to={paths.benchRuns.getHref(projectId, revision.designId, revision.number)}
          >
            Bench runs of r{revision.number}
          </Anchor>
          <Anchor component={Link} size="sm" to={paths.compareDesigns.getHref(projectId)}>
            Compare designs
          </Anchor>
        </Group>
        <Text size="sm" c="dimmed">
          {revision.changeNote ? `“${revision.changeNote}”` : 'No change note'} · by {revision.authorName},{' '}
          {formatDateTime(revision.createdAt)} · engine {revision.engineVersion}
        </Text>
      </div>
      {isReadOnly ? (
        <Text size="sm" c="dimmed" maw={360}>
          {isArchived
            ? 'This project is archived: its designs can be read and exported but not changed.'
            : 'Reviewers read the design here and comment or decide on its Sign-off page.'}
        </Text>
      ) : (
        <form
          onSubmit={(event) => {
            event.preventDefault();
            onSave(changeNote.trim());
          }}
        >
          <Group gap="xs" align="flex-end" wrap="wrap">
            <Tooltip label="Undo (Ctrl+Z)">
              <ActionIcon variant="default" size="lg" aria-label="Undo" disabled={!canUndo} onClick={onUndo}>
                <UndoGlyph />
              </ActionIcon>
            </Tooltip>
            <Tooltip label="Redo (Ctrl+Shift+Z)">
              <ActionIcon variant="default" size="lg" aria-label="Redo" disabled={!canRedo} onClick={onRedo}>
                <UndoGlyph isRedo />
              </ActionIcon>
            </Tooltip>
            <TextInput
              label="Change note"
              placeholder="What changed and why"
              value={changeNote}
              onChange={(e) => setChangeNote(e.currentTarget.value)}
              w={260}
              required
              {...{ [NATIVE_UNDO_ATTRIBUTE]: '' }}
            />
            <Button type="submit" loading={isSaving} disabled={!isDirty || changeNote.trim() === '' || issueCount > 0}>
              Save revision
            </Button>
            {isDirty && (
              <Button variant="subtle" color="gray" onClick={onDiscard}>
                Discard edits
              </Button>
            )}
          </Group>
        </form>
      )}
    </Group>
  );
});

function UndoGlyph({ isRedo = false }: { isRedo?: boolean }) {
  return (
    <svg
      width="18"
      height="18"
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.8"
      aria-hidden="true"
      style={isRedo ? { transform: 'scaleX(-1)' } : undefined}
    >
      <path d="M9 14 4 9l5-5" />
      <path d="M4 9h10a6 6 0 0 1 0 12h-3" />
    </svg>
  );
}
