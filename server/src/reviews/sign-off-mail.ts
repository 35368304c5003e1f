import type { RevisionCommand } from '@ladderwright/shared/reviews';
import type { OutgoingMail } from '../mail/mail.service';

/** What a notification is about: one revision of one design. */
export interface MailSubject {
  designName: string;
  revisionNumber: number;
  /** Link to the revision's Sign-off page. */
  url: string;
}

const SUBJECT_PREFIX = '[Ladderwright]';

const HEADLINES: Record<Exclude<RevisionCommand, 'supersede'>, string> = {
  submit: 'Review requested',
  withdraw: 'Withdrawn from review',
  approve: 'Approved',
  return: 'Returned for changes',
  release: 'Released',
};

function revisionLabel(about: MailSubject): string {
  return `${about.designName}, revision ${about.revisionNumber}`;
}

function footer(about: MailSubject): string {
  return `\n\nOpen the Sign-off: ${about.url}\n\n-- \nLadderwright notification. High voltage can kill: the applicable standard, local codes and licensed practice govern.`;
}

/** The notification of one Sign-off transition. */
export function transitionMail(input: {
  command: Exclude<RevisionCommand, 'supersede'>;
  about: MailSubject;
  actorName: string;
  note: string;
  recipients: string[];
  supersededNumber?: number | null;
  /** Set when the actor went past closed gates. */
  override?: { reason: string; overridden: string[] } | null;
}): OutgoingMail {
  const { about, actorName, note } = input;
  const what: Record<Exclude<RevisionCommand, 'supersede'>, string> = {
    submit: `${actorName} submitted ${revisionLabel(about)} to you for Sign-off.`,
    withdraw: `${actorName} withdrew ${revisionLabel(about)} from review; it is a draft again.`,
    approve: `${actorName} approved ${revisionLabel(about)}. A lead may now release it.`,
    return: `${actorName} returned ${revisionLabel(about)} for changes. Save a new revision to address them.`,
    release: `${actorName} released ${revisionLabel(about)}.${
      input.supersededNumber ? ` It supersedes revision ${input.supersededNumber}.` : ''
    }`,
  };
  return {
    kind: `sign-off.${input.command}`,
    recipients: input.recipients,
    subject: `${SUBJECT_PREFIX} ${HEADLINES[input.command]}: ${revisionLabel(about)}`,
    body: `${what[input.command]}${note ? `\n\nNote: ${note}` : ''}${overrideText(input.override)}${footer(about)}`,
  };
}

function overrideText(override: { reason: string; overridden: string[] } | null | undefined): string {
  if (!override) return '';
  const held = override.overridden.map((reason) => `\n- ${reason}`).join('');
  return `\n\nOVERRIDE: the Sign-off gates were closed and overridden.${held}\nReason given: ${override.reason}`;
}

/** The notification of a new comment or reply. */
export function commentMail(input: {
  about: MailSubject;
  authorName: string;
  body: string;
  anchorLabel: string | null;
  isReply: boolean;
  recipients: string[];
}): OutgoingMail {
  const { about } = input;
  const on = input.anchorLabel ? ` on ${input.anchorLabel}` : '';
  return {
    kind: 'sign-off.comment',
    recipients: input.recipients,
    subject: `${SUBJECT_PREFIX} ${input.isReply ? 'Reply' : 'Comment'}: ${revisionLabel(about)}`,
    body: `${input.authorName} ${input.isReply ? 'replied' : 'commented'}${on}:\n\n${input.body}${footer(about)}`,
  };
}
