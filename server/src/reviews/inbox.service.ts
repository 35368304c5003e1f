import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { Inbox, InboxComment, InboxItem, InboxMemberRequest } from '@ladderwright/shared/api';
import type { ProjectRole } from '@ladderwright/shared/auth';
import type { RevisionState } from '@ladderwright/shared/reviews';

interface InboxRow {
  project_id: string;
  project_name: string;
  design_id: string;
  design_name: string;
  number: number;
  state: RevisionState;
  author_name: string;
  reviewer_names: string[] | null;
  submitted_at: Date | null;
  updated_at: Date;
}

interface CommentRow {
  project_id: string;
  project_name: string;
  design_id: string;
  design_name: string;
  number: number;
  comment_id: string;
  author_name: string;
  body: string;
  at: Date;
}

interface MemberRequestRow {
  project_id: string;
  project_name: string;
  request_id: string;
  email: string;
  role: ProjectRole;
  requester_name: string | null;
  created_at: Date;
}

const INBOX_LIMIT = 200;

/** Pending member requests in the projects I lead (not archived), oldest first. */
const SELECT_MEMBER_REQUESTS = `
  SELECT p.id AS project_id, p.name AS project_name, q.id AS request_id, q.email, q.role,
         u.display_name AS requester_name, q.created_at
    FROM member_requests q
    JOIN projects p ON p.id = q.project_id
    JOIN project_members me ON me.project_id = p.id AND me.user_id = :userId AND me.role = 'lead'
    LEFT JOIN users u ON u.id = q.requester_id
   WHERE q.state = 'pending' AND p.archived_at IS NULL
   ORDER BY q.created_at ASC LIMIT ${INBOX_LIMIT}`;

function toMemberRequest(row: MemberRequestRow): InboxMemberRequest {
  return {
    projectId: row.project_id,
    projectName: row.project_name,
    requestId: row.request_id,
    email: row.email,
    role: row.role,
    requesterName: row.requester_name ?? '(a removed account)',
    createdAt: new Date(row.created_at).toISOString(),
  };
}

const SELECT_ITEMS = `
  SELECT p.id AS project_id, p.name AS project_name, d.id AS design_id, d.name AS design_name, r.number, r.state,
         a.display_name AS author_name,
         (SELECT array_agg(u.display_name ORDER BY u.display_name) FROM revision_reviewers rr
            JOIN users u ON u.id = rr.user_id WHERE rr.revision_id = r.id) AS reviewer_names,
         (SELECT max(t.created_at) FROM revision_transitions t WHERE t.revision_id = r.id AND t.command = 'submit') AS submitted_at,
         r.updated_at
    FROM revisions r
    JOIN designs d ON d.id = r.design_id
    JOIN projects p ON p.id = d.project_id
    JOIN users a ON a.id = r.author_id
    JOIN project_members me ON me.project_id = p.id AND me.user_id = :userId`;

/** Open threads on revisions of designs I own or revisions I wrote, whose latest comment is someone else's. */
const SELECT_COMMENTS = `
  SELECT p.id AS project_id, p.name AS project_name, d.id AS design_id, d.name AS design_name, r.number,
         c.id AS comment_id, la.display_name AS author_name, last.body, last.created_at AS at
    FROM review_comments c
    JOIN revisions r ON r.id = c.revision_id
    JOIN designs d ON d.id = r.design_id
    JOIN projects p ON p.id = d.project_id
    JOIN project_members me ON me.project_id = p.id AND me.user_id = :userId
    JOIN LATERAL (SELECT x.author_id, x.body, x.created_at FROM review_comments x
                   WHERE x.id = c.id OR x.parent_id = c.id ORDER BY x.created_at DESC LIMIT 1) last ON true
    JOIN users la ON la.id = last.author_id
   WHERE c.parent_id IS NULL AND c.resolved_at IS NULL AND p.archived_at IS NULL
     AND (d.owner_id = :userId OR r.author_id = :userId) AND last.author_id <> :userId
   ORDER BY last.created_at DESC LIMIT ${INBOX_LIMIT}`;

function toItem(row: InboxRow): InboxItem {
  return {
    projectId: row.project_id,
    projectName: row.project_name,
    designId: row.design_id,
    designName: row.design_name,
    revisionNumber: row.number,
    state: row.state,
    authorName: row.author_name,
    reviewerNames: row.reviewer_names ?? [],
    submittedAt: row.submitted_at ? new Date(row.submitted_at).toISOString() : null,
    updatedAt: new Date(row.updated_at).toISOString(),
  };
}

function toComment(row: CommentRow): InboxComment {
  return {
    projectId: row.project_id,
    projectName: row.project_name,
    designId: row.design_id,
    designName: row.design_name,
    revisionNumber: row.number,
    commentId: row.comment_id,
    authorName: row.author_name,
    excerpt: row.body.slice(0, 200),
    at: new Date(row.at).toISOString(),
  };
}

/** What waits for the signed-in user, by role, and what they submitted, across the projects they belong to. */
@Injectable()
export class InboxService {
  constructor(private readonly sequelize: Sequelize) {}

  async forUser(userId: string): Promise<Inbox> {
    const items = (where: string) =>
      this.sequelize
        .query<InboxRow>(`${SELECT_ITEMS} ${where} LIMIT ${INBOX_LIMIT}`, {
          replacements: { userId },
          type: QueryTypes.SELECT,
        })
        .then((rows) => rows.map(toItem));
    const [waitingForMe, returnedToMe, awaitingRelease, submittedByMe, newComments, memberRequests] = await Promise.all(
      [
        items(`WHERE r.state = 'submitted' AND p.archived_at IS NULL
               AND EXISTS (SELECT 1 FROM revision_reviewers rr WHERE rr.revision_id = r.id AND rr.user_id = :userId)
             ORDER BY submitted_at ASC NULLS LAST`),
        items(`WHERE r.state = 'returned' AND r.author_id = :userId AND p.archived_at IS NULL
               AND r.number = d.latest_revision_number
             ORDER BY r.updated_at DESC`),
        items(`WHERE r.state = 'approved' AND me.role = 'lead' AND p.archived_at IS NULL
             ORDER BY r.updated_at ASC`),
        items(`WHERE r.author_id = :userId
               AND EXISTS (SELECT 1 FROM revision_transitions t WHERE t.revision_id = r.id AND t.command = 'submit')
             ORDER BY r.updated_at DESC`),
        this.sequelize
          .query<CommentRow>(SELECT_COMMENTS, { replacements: { userId }, type: QueryTypes.SELECT })
          .then((rows) => rows.map(toComment)),
        this.sequelize
          .query<MemberRequestRow>(SELECT_MEMBER_REQUESTS, { replacements: { userId }, type: QueryTypes.SELECT })
          .then((rows) => rows.map(toMemberRequest)),
      ],
    );
    return {
      waitingForMe,
      returnedToMe,
      awaitingRelease,
      newComments,
      submittedByMe,
      memberRequests,
      actionCount:
        waitingForMe.length + returnedToMe.length + awaitingRelease.length + newComments.length + memberRequests.length,
    };
  }
}
