import { Alert, Checkbox, List, Stack, Textarea } from '@mantine/core';
import type { GateReason } from '@ladderwright/shared/reviews';
import { OVERRIDE_REASON_MIN_LENGTH } from '@ladderwright/shared/reviews';

export interface OverrideDraft {
  isOverriding: boolean;
  reason: string;
}

/** Whether an override draft may be sent: the reason has the length the server requires. */
export function isOverrideReady(draft: OverrideDraft): boolean {
  return draft.isOverriding && [...draft.reason.trim()].length >= OVERRIDE_REASON_MIN_LENGTH;
}

/**
 * What holds back submit, approve and release, shown before the click, with the choice to record an override
 * and its reason (sent with the command; audited, mailed and printed on the spec sheet).
 */
export function SignOffGates({
  reasons,
  draft,
  onChange,
}: {
  reasons: GateReason[];
  draft: OverrideDraft;
  onChange: (draft: OverrideDraft) => void;
}) {
  if (reasons.length === 0) return null;
  const length = [...draft.reason.trim()].length;
  return (
    <Stack gap="xs">
      <Alert color="ember" title="Gates closed: submit, approve and release are held back" role="status">
        <List size="sm" aria-label="Gate reasons">
          {reasons.map((reason) => (
            <List.Item key={reason.code}>{reason.message}</List.Item>
          ))}
        </List>
      </Alert>
      <Checkbox
        label="Record an override and go past these gates"
        checked={draft.isOverriding}
        onChange={(event) => onChange({ ...draft, isOverriding: event.currentTarget.checked })}
      />
      {draft.isOverriding && (
        <Textarea
          label="Override reason"
          description={`Why it is right to go on anyway; at least ${OVERRIDE_REASON_MIN_LENGTH} characters (${length} so far). Recorded in the audit log, the mail and the spec sheet.`}
          required
          rows={2}
          maxLength={2000}
          value={draft.reason}
          error={length > 0 && length < OVERRIDE_REASON_MIN_LENGTH ? 'Too short for a recorded decision' : undefined}
          onChange={(event) => onChange({ ...draft, reason: event.currentTarget.value })}
        />
      )}
    </Stack>
  );
}
