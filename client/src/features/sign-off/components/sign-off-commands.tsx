import { useState } from 'react';
import { Button, Checkbox, Group, Stack, Text, Textarea } from '@mantine/core';
import type { SignOff } from '@ladderwright/shared/api';
import { useRunSignOffCommand, type NoteCommand } from '../api/run-sign-off-command';
import { useSubmitRevision } from '../api/submit-revision';
import { SignOffError } from './sign-off-error';
import { isOverrideReady, type OverrideDraft, SignOffGates } from './sign-off-gates';

const commandLabels: Record<NoteCommand, string> = {
  withdraw: 'Withdraw',
  approve: 'Approve',
  return: 'Return with note',
  release: 'Release',
};

const noteCommands: readonly NoteCommand[] = ['approve', 'return', 'release', 'withdraw'];

/** The commands the Sign-off gates hold back (shared/src/reviews GATED_COMMANDS). */
const gatedCommands: readonly string[] = ['submit', 'approve', 'release'];

/** The commands the server offers the caller, as buttons; submit names reviewers; return needs a note. */
export function SignOffCommands({ signOff }: { signOff: SignOff }) {
  const { projectId, designId, revisionNumber, availableCommands } = signOff;
  const [note, setNote] = useState('');
  const [reviewerIds, setReviewerIds] = useState<string[]>([]);
  const [override, setOverride] = useState<OverrideDraft>({ isOverriding: false, reason: '' });
  const submit = useSubmitRevision(projectId, designId, revisionNumber);
  const command = useRunSignOffCommand(projectId, designId, revisionNumber);
  const offered = noteCommands.filter((name) => availableCommands.includes(name));
  const canSubmit = availableCommands.includes('submit');
  const trimmedNote = note.trim();
  const isBusy = submit.isPending || command.isPending;
  const onDone = () => {
    setNote('');
    setReviewerIds([]);
    setOverride({ isOverriding: false, reason: '' });
  };
  const hasGatedCommand = availableCommands.some((name) => gatedCommands.includes(name));
  const gateReasons = hasGatedCommand ? signOff.gateReasons : [];
  const isHeldBack = gateReasons.length > 0 && !isOverrideReady(override);
  const overrideField =
    gateReasons.length > 0 && isOverrideReady(override) ? { override: { reason: override.reason.trim() } } : {};

  if (!canSubmit && offered.length === 0) {
    return (
      <Text size="sm" c="dimmed">
        No Sign-off command is open to you on this revision in its {signOff.state} state{nextStepOf(signOff)}
      </Text>
    );
  }

  return (
    <Stack gap="sm">
      {canSubmit &&
        (signOff.candidateReviewers.length === 0 ? (
          <Text size="sm" c="dimmed">
            No reviewer or lead in this project can take this revision.
          </Text>
        ) : (
          <Checkbox.Group
            label="Reviewers"
            description="Who should sign this revision off"
            value={reviewerIds}
            onChange={setReviewerIds}
          >
            <Stack gap={6} mt={6}>
              {signOff.candidateReviewers.map((person) => (
                <Checkbox
                  key={person.userId}
                  value={person.userId}
                  label={`${person.displayName} (${person.projectRole})`}
                />
              ))}
            </Stack>
          </Checkbox.Group>
        ))}
      <SignOffGates reasons={gateReasons} draft={override} onChange={setOverride} />
      <Textarea
        label="Note"
        description={offered.includes('return') ? 'Required to return the revision' : 'Optional'}
        placeholder="What the next person should know"
        rows={2}
        value={note}
        onChange={(event) => setNote(event.currentTarget.value)}
      />
      <Group gap="sm">
        {canSubmit && (
          <Button
            loading={submit.isPending}
            disabled={isBusy || reviewerIds.length === 0 || isHeldBack}
            onClick={() =>
              submit.mutate(
                { reviewerIds, ...(trimmedNote ? { note: trimmedNote } : {}), ...overrideField },
                { onSuccess: onDone },
              )
            }
          >
            Submit for Sign-off
          </Button>
        )}
        {offered.map((name) => (
          <Button
            key={name}
            variant={name === 'approve' || name === 'release' ? 'filled' : 'default'}
            color={name === 'return' ? 'ember' : undefined}
            loading={command.isPending && command.variables?.command === name}
            disabled={
              isBusy || (name === 'return' && trimmedNote === '') || (gatedCommands.includes(name) && isHeldBack)
            }
            onClick={() =>
              command.mutate(
                {
                  command: name,
                  request: {
                    ...(trimmedNote ? { note: trimmedNote } : {}),
                    ...(gatedCommands.includes(name) ? overrideField : {}),
                  },
                },
                { onSuccess: onDone },
              )
            }
          >
            {commandLabels[name]}
          </Button>
        ))}
      </Group>
      <SignOffError error={submit.error ?? command.error} fallbackTitle="The Sign-off did not change" />
    </Stack>
  );
}

/** What happens next to a revision the caller cannot move, so a reviewer is not left waiting on nothing. */
function nextStepOf(signOff: SignOff): string {
  switch (signOff.state) {
    case 'submitted':
      return signOff.reviewers.length > 0
        ? `: it was submitted to ${signOff.reviewers.map((person) => person.displayName).join(', ')}.`
        : '.';
    case 'approved':
      return ': a project lead releases it next.';
    case 'released':
      return ': changes go into a new revision.';
    default:
      return '.';
  }
}
