import { createServer } from 'node:net';
import { type FakeSmtpServer, type ReceivedMail, startFakeSmtpServer } from '../../src/mail/fake-smtp-server';

/** A fake SMTP server inside the test: collects what the app sends and lets the test wait for it. */
export interface MailCatcher {
  port: number;
  mails: ReceivedMail[];
  /** Resolves with the mails matching `match` once there are `count` of them, or rejects after `timeoutMs`. */
  waitFor: (match: (mail: ReceivedMail) => boolean, count?: number, timeoutMs?: number) => Promise<ReceivedMail[]>;
  close: () => Promise<void>;
}

/** A loopback port that was free a moment ago (for an SMTP server that starts later). */
export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

export async function startMailCatcher(port = 0): Promise<MailCatcher> {
  const mails: ReceivedMail[] = [];
  const server: FakeSmtpServer = await startFakeSmtpServer({
    host: '127.0.0.1',
    port,
    onMessage: (mail) => {
      mails.push(mail);
    },
  });
  return {
    port: server.port,
    mails,
    async waitFor(match, count = 1, timeoutMs = 5_000) {
      const deadline = Date.now() + timeoutMs;
      for (;;) {
        const found = mails.filter(match);
        if (found.length >= count) return found;
        if (Date.now() > deadline) {
          const seen = mails.map((mail) => `${mail.subject} -> ${mail.recipients.join(', ')}`).join('; ') || 'none';
          throw new Error(`expected ${count} matching mail(s) within ${timeoutMs} ms; received: ${seen}`);
        }
        await new Promise((done) => setTimeout(done, 25));
      }
    },
    close: () => server.close(),
  };
}
