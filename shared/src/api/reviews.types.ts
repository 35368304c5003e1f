import type { ProjectRole } from '../auth';
import type { GateReason, GatedCommand, RevisionCommand, RevisionState } from '../reviews';

/** A project member a revision can be submitted to (reviewer or lead), or is submitted to. */
export interface SignOffPerson {
  userId: string;
  displayName: string;
  email: string;
  projectRole: ProjectRole;
}

/** One audit entry of the Sign-off: who moved the revision, when, from which state to which, and why. */
export interface SignOffTransition {
  id: string;
  command: RevisionCommand;
  fromState: RevisionState;
  toState: RevisionState;
  /** null for the entry written for the superseded revision when a newer one is released by someone else. */
  actorId: string | null;
  actorName: string | null;
  note: string;
  /** ISO 8601. */
  at: string;
}

/** An approval as the spec sheet and the Sign-off panel show it. */
export interface SignOffApproval {
  userId: string;
  displayName: string;
  note: string;
  at: string;
}

/** GET .../revisions/:revisionNumber/sign-off: the state, who it waits for, and what the caller may do next. */
export interface SignOff {
  projectId: string;
  designId: string;
  designName: string;
  revisionNumber: number;
  state: RevisionState;
  authorId: string;
  authorName: string;
  /** The members the revision is (or was last) submitted to. */
  reviewers: SignOffPerson[];
  /** Members who may be chosen as reviewers on submit (reviewers and leads other than the author). */
  candidateReviewers: SignOffPerson[];
  /** What the caller may do from here (for showing only the buttons that apply). */
  availableCommands: RevisionCommand[];
  approvals: SignOffApproval[];
  history: SignOffTransition[];
  /** What holds back submit, approve and release now; empty when the gates are clear. */
  gateReasons: GateReason[];
  /** Every override recorded on this revision, oldest first. */
  overrides: SignOffOverride[];
}

/** A recorded decision to go past the gates, with its reason and what it went past. */
export interface SignOffOverride {
  command: GatedCommand;
  actorId: string | null;
  actorName: string | null;
  reason: string;
  /** The gate reasons in force when the override was recorded. */
  overridden: GateReason[];
  at: string;
}

/** Sent with submit, approve or release to go past failing gates; the reason is recorded and audited. */
export interface OverrideRequest {
  reason: string;
}

/** The body of a 409 `gates_closed`: one entry per reason the command is held back. */
export interface GatesClosedBody {
  statusCode: 409;
  code: 'gates_closed';
  message: string;
  reasons: GateReason[];
}

/** POST .../submit. */
export interface SubmitRevisionRequest {
  /** One or more project members with the reviewer or lead role, not the author. */
  reviewerIds: string[];
  note?: string;
  override?: OverrideRequest;
}

/** POST .../withdraw, .../approve, .../release (note optional) and .../return (note required). */
export interface SignOffNoteRequest {
  note?: string;
  /** approve and release only. */
  override?: OverrideRequest;
}

/** Where a comment thread points: an input field path of the document or a result key of the report. */
export interface CommentAnchor {
  kind: 'input' | 'result';
  /** e.g. `multiplier.capacitors[2].valueF` (input) or `ripplePeakToPeakV` (result). */
  path: string;
}

/** One comment with its replies (threads are one level deep: replies to a reply join its thread). */
export interface ReviewComment {
  id: string;
  parentId: string | null;
  authorId: string;
  authorName: string;
  body: string;
  anchor: CommentAnchor | null;
  isResolved: boolean;
  resolvedByName: string | null;
  resolvedAt: string | null;
  createdAt: string;
  replies: ReviewComment[];
}

/** POST .../comments. `anchor` only on a thread's first comment; `parentId` for a reply. */
export interface CreateCommentRequest {
  body: string;
  parentId?: string;
  anchor?: CommentAnchor;
}

/** PATCH .../comments/:commentId: resolve or reopen a thread. */
export interface UpdateCommentRequest {
  isResolved: boolean;
}

/** One row of the Inbox. */
export interface InboxItem {
  projectId: string;
  projectName: string;
  designId: string;
  designName: string;
  revisionNumber: number;
  state: RevisionState;
  authorName: string;
  reviewerNames: string[];
  /** ISO 8601: the latest submission, or null when never submitted. */
  submittedAt: string | null;
  /** ISO 8601: the latest Sign-off change. */
  updatedAt: string;
}

/** An open comment thread on a revision of one of my designs, started or last answered by someone else. */
export interface InboxComment {
  projectId: string;
  projectName: string;
  designId: string;
  designName: string;
  revisionNumber: number;
  commentId: string;
  authorName: string;
  /** The first 200 characters of the latest comment in the thread. */
  excerpt: string;
  at: string;
}

/**
 * GET /api/inbox: what waits for me, by what I can do about it, and what I submitted. `actionCount` is the number
 * the top bar shows: everything in the first four lists.
 */
/** A pending member request in the Inbox of a project's leads. */
export interface InboxMemberRequest {
  projectId: string;
  projectName: string;
  requestId: string;
  email: string;
  role: ProjectRole;
  requesterName: string;
  createdAt: string;
}

export interface Inbox {
  /** Reviewer or lead: revisions submitted to me and waiting for a decision. */
  waitingForMe: InboxItem[];
  /** Engineer: my revisions returned for changes (the latest revision of their design). */
  returnedToMe: InboxItem[];
  /** Lead: approved revisions in projects I lead, waiting for release. */
  awaitingRelease: InboxItem[];
  /** Engineer: open comment threads on my designs' revisions where someone else spoke last. */
  newComments: InboxComment[];
  /** Revisions I submitted (any state since). */
  submittedByMe: InboxItem[];
  /** Lead: pending requests to add a person to a project I lead. */
  memberRequests: InboxMemberRequest[];
  actionCount: number;
}

/** One mail the local fake SMTP server captured. */
export interface OutboxMail {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

/** GET /api/outbox (admin): captured mail, newest first, and the delivery queue's state. */
export interface Outbox {
  mails: OutboxMail[];
  queue: { pending: number; failed: number };
}
