import { Injectable } from '@nestjs/common';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { Inbox, InboxItem } from '@ladderwright/shared/api';
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

/** What waits for the signed-in user and what they submitted, across the projects they still belong to. */
@Injectable()
export class InboxService {
  constructor(private readonly sequelize: Sequelize) {}

  async forUser(userId: string): Promise<Inbox> {
    const [waiting, submitted] = await Promise.all([
      this.sequelize.query<InboxRow>(
        `${SELECT_ITEMS}
          WHERE r.state = 'submitted'
            AND EXISTS (SELECT 1 FROM revision_reviewers rr WHERE rr.revision_id = r.id AND rr.user_id = :userId)
          ORDER BY submitted_at ASC NULLS LAST LIMIT 200`,
        { replacements: { userId }, type: QueryTypes.SELECT },
      ),
      this.sequelize.query<InboxRow>(
        `${SELECT_ITEMS}
          WHERE r.author_id = :userId
            AND EXISTS (SELECT 1 FROM revision_transitions t WHERE t.revision_id = r.id AND t.command = 'submit')
          ORDER BY r.updated_at DESC LIMIT 200`,
        { replacements: { userId }, type: QueryTypes.SELECT },
      ),
    ]);
    return { waitingForMe: waiting.map(toItem), submittedByMe: submitted.map(toItem) };
  }
}
