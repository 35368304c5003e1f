import type { SchemaMigration } from './migration.types';

/**
 * Sign-off: who a revision is submitted to, the audit of every transition (append-only), threaded review
 * comments; mail: the outgoing queue written in the same transaction as the change it reports, and the
 * mail the local fake SMTP server captured (the Outbox).
 */
export const signOffAndMail: SchemaMigration = {
  name: '0004-sign-off-and-mail',
  async up(context) {
    await context.sequelize.query(`
      CREATE TABLE revision_reviewers (
        revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (revision_id, user_id)
      );
      CREATE INDEX revision_reviewers_user_id_idx ON revision_reviewers (user_id);

      CREATE TABLE revision_transitions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
        command text NOT NULL CHECK (command IN ('submit', 'withdraw', 'return', 'approve', 'release', 'supersede')),
        from_state text NOT NULL,
        to_state text NOT NULL,
        actor_id uuid REFERENCES users (id),
        note text NOT NULL DEFAULT '',
        created_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX revision_transitions_revision_id_idx ON revision_transitions (revision_id, created_at);
      CREATE FUNCTION revision_transitions_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'the Sign-off audit is append-only';
      END;
      $$;
      CREATE TRIGGER revision_transitions_append_only BEFORE UPDATE ON revision_transitions
        FOR EACH ROW EXECUTE FUNCTION revision_transitions_append_only();

      CREATE TABLE review_comments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        revision_id uuid NOT NULL REFERENCES revisions (id) ON DELETE CASCADE,
        parent_id uuid REFERENCES review_comments (id) ON DELETE CASCADE,
        author_id uuid NOT NULL REFERENCES users (id),
        body text NOT NULL CHECK (length(body) BETWEEN 1 AND 10000),
        anchor_kind text CHECK (anchor_kind IN ('input', 'result')),
        anchor_path text,
        resolved_at timestamptz,
        resolved_by_id uuid REFERENCES users (id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT review_comments_anchor_pair CHECK ((anchor_kind IS NULL) = (anchor_path IS NULL))
      );
      CREATE INDEX review_comments_revision_id_idx ON review_comments (revision_id, created_at);

      CREATE TABLE mail_queue (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        kind text NOT NULL,
        recipients text[] NOT NULL CHECK (cardinality(recipients) >= 1),
        subject text NOT NULL,
        body text NOT NULL,
        status text NOT NULL DEFAULT 'pending' CHECK (status IN ('pending', 'sent', 'failed')),
        attempts integer NOT NULL DEFAULT 0,
        next_attempt_at timestamptz NOT NULL DEFAULT now(),
        last_error text,
        sent_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX mail_queue_due_idx ON mail_queue (next_attempt_at) WHERE status = 'pending';

      CREATE TABLE captured_mails (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        envelope_from text NOT NULL,
        recipients text[] NOT NULL,
        subject text NOT NULL,
        body text NOT NULL,
        raw text NOT NULL,
        received_at timestamptz NOT NULL DEFAULT now()
      );
      CREATE INDEX captured_mails_received_at_idx ON captured_mails (received_at);
    `);
  },
  async down(context) {
    await context.sequelize.query(`
      DROP TABLE captured_mails; DROP TABLE mail_queue; DROP TABLE review_comments;
      DROP TABLE revision_transitions; DROP FUNCTION revision_transitions_append_only();
      DROP TABLE revision_reviewers;
    `);
  },
};
