import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import type * as Nodemailer from 'nodemailer';
import { QueryTypes, type Transaction } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { Outbox } from '@ladderwright/shared/api';
import { APP_ENV, type AppEnv } from '../config/env';
import { CapturedMailModel } from './captured-mail.model';
import { MailQueueModel } from './mail-queue.model';

/** A notification to queue: one message to every recipient together. */
export interface OutgoingMail {
  kind: string;
  recipients: string[];
  subject: string;
  body: string;
}

interface ClaimedMail {
  id: string;
  recipients: string[];
  subject: string;
  body: string;
  attempts: number;
}

const MAX_RETRY_DELAY_MS = 10 * 60_000;
/** After this many failed attempts a mail is marked failed and left for an admin to look at. */
const MAX_ATTEMPTS = 25;
/** A claimed mail is not claimed again for this long, so two instances never send it twice at once. */
const CLAIM_LEASE_S = 120;
const BATCH_SIZE = 20;

/** nodemailer, loaded only by an instance that has an SMTP server to send to. */
function loadNodemailer(): typeof Nodemailer {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a lazy load; import() would need ESM here
  return require('nodemailer') as typeof Nodemailer;
}

/**
 * Notification mail through a queue table: `enqueue` writes in the caller's transaction, so a change and
 * its mail commit together; a retrying sender delivers over SMTP with exponential backoff. A failing
 * SMTP server delays mail; it never undoes or loses the change.
 */
@Injectable()
export class MailService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('Mail');
  private readonly transport: Nodemailer.Transporter | null;
  private timer: NodeJS.Timeout | null = null;
  private running: Promise<number> | null = null;
  private isStopped = false;

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    @InjectModel(MailQueueModel) private readonly queue: typeof MailQueueModel,
    @InjectModel(CapturedMailModel) private readonly captured: typeof CapturedMailModel,
    private readonly sequelize: Sequelize,
  ) {
    this.transport =
      env.smtpHost && env.smtpPort
        ? loadNodemailer().createTransport({
            host: env.smtpHost,
            port: env.smtpPort,
            secure: false,
            connectionTimeout: 5_000,
            greetingTimeout: 5_000,
            socketTimeout: 10_000,
          })
        : null;
  }

  onApplicationBootstrap(): void {
    if (!this.transport) {
      this.logger.warn('no SMTP_HOST/SMTP_PORT: notification mail is queued but not sent');
      return;
    }
    this.timer = setInterval(() => this.kick(), this.env.mailPollMs);
    this.timer.unref();
    this.kick();
  }

  async onApplicationShutdown(): Promise<void> {
    this.isStopped = true;
    if (this.timer) clearInterval(this.timer);
    await this.running?.catch(() => 0);
    this.transport?.close();
  }

  /**
   * Queues mail inside `transaction`. Recipients are de-duplicated; accounts that opted out of the mail's kind
   * (notification settings) or are deactivated are left out; a mail left with no recipient is dropped.
   */
  async enqueue(mails: OutgoingMail[], transaction: Transaction): Promise<void> {
    const rows: OutgoingMail[] = [];
    for (const mail of mails) {
      const recipients = [...new Set(mail.recipients.map((r) => r.toLowerCase()))];
      const excluded = recipients.length > 0 ? await this.excludedRecipients(recipients, mail.kind, transaction) : [];
      const kept = recipients.filter((recipient) => !excluded.includes(recipient));
      if (kept.length > 0) rows.push({ ...mail, recipients: kept });
    }
    if (rows.length > 0) await this.queue.bulkCreate(rows, { transaction });
  }

  /** Of `emails`, the accounts that opted out of `kind` or are deactivated. */
  private async excludedRecipients(emails: string[], kind: string, transaction: Transaction): Promise<string[]> {
    const rows = await this.sequelize.query<{ email: string }>(
      `SELECT email FROM users WHERE email IN (:emails) AND (NOT is_active OR mail_opt_outs @> jsonb_build_array(CAST(:kind AS text)))`,
      { replacements: { emails, kind }, type: QueryTypes.SELECT, transaction },
    );
    return rows.map((row) => row.email);
  }

  /** Starts a delivery round soon, unless one is running (call after the enqueuing transaction commits). */
  kick(): void {
    if (this.isStopped || this.running || !this.transport) return;
    this.running = this.deliverDue()
      .catch((error: unknown) => {
        this.logger.warn(`mail delivery round failed: ${error instanceof Error ? error.message : String(error)}`);
        return 0;
      })
      .finally(() => {
        this.running = null;
      });
  }

  /** Sends every due mail once; returns how many were delivered. Failures are rescheduled with backoff. */
  async deliverDue(): Promise<number> {
    const transport = this.transport;
    if (!transport || this.isStopped) return 0;
    const claimed = await this.sequelize.query<ClaimedMail>(
      `UPDATE mail_queue SET next_attempt_at = now() + make_interval(secs => :lease), updated_at = now()
        WHERE id IN (
          SELECT id FROM mail_queue WHERE status = 'pending' AND next_attempt_at <= now()
          ORDER BY created_at LIMIT :limit FOR UPDATE SKIP LOCKED)
        RETURNING id, recipients, subject, body, attempts`,
      { replacements: { lease: CLAIM_LEASE_S, limit: BATCH_SIZE }, type: QueryTypes.SELECT },
    );
    let delivered = 0;
    for (const mail of claimed) {
      try {
        await transport.sendMail({
          from: this.env.mailFrom,
          to: mail.recipients,
          subject: mail.subject,
          text: mail.body,
        });
        await this.sequelize.query(
          `UPDATE mail_queue SET status = 'sent', sent_at = now(), attempts = attempts + 1, last_error = NULL,
             updated_at = now() WHERE id = :id`,
          { replacements: { id: mail.id } },
        );
        delivered += 1;
      } catch (error) {
        await this.reschedule(mail, error);
      }
    }
    return delivered;
  }

  async outbox(): Promise<Outbox> {
    const [mails, counts] = await Promise.all([
      this.captured.findAll({ order: [['receivedAt', 'DESC']], limit: 200 }),
      this.sequelize.query<{ status: string; count: string }>(
        `SELECT status, count(*) AS count FROM mail_queue WHERE status <> 'sent' GROUP BY status`,
        { type: QueryTypes.SELECT },
      ),
    ]);
    const countOf = (status: string) => Number(counts.find((row) => row.status === status)?.count ?? 0);
    return {
      mails: mails.map((mail) => ({
        id: mail.id,
        from: mail.envelopeFrom,
        to: mail.recipients,
        subject: mail.subject,
        text: mail.body,
        receivedAt: mail.receivedAt.toISOString(),
      })),
      queue: { pending: countOf('pending'), failed: countOf('failed') },
    };
  }

  private async reschedule(mail: ClaimedMail, error: unknown): Promise<void> {
    const attempts = mail.attempts + 1;
    const responseCode = (error as { responseCode?: unknown }).responseCode;
    const isPermanent = typeof responseCode === 'number' && responseCode >= 500 && responseCode < 600;
    const status = isPermanent || attempts >= MAX_ATTEMPTS ? 'failed' : 'pending';
    const delayS = Math.min(this.env.mailRetryBaseMs * 2 ** (attempts - 1), MAX_RETRY_DELAY_MS) / 1000;
    const message = error instanceof Error ? error.message : String(error);
    this.logger.warn(`mail ${mail.id} attempt ${attempts} failed (${status}): ${message}`);
    await this.sequelize.query(
      `UPDATE mail_queue SET attempts = :attempts, status = :status, last_error = :message,
         next_attempt_at = now() + make_interval(secs => :delayS), updated_at = now() WHERE id = :id`,
      { replacements: { attempts, status, message: message.slice(0, 2000), delayS, id: mail.id } },
    );
  }
}
