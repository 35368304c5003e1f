import { SMTPServer } from 'smtp-server';

/** A message as the fake SMTP server received it: envelope, decoded subject and plain-text body, raw source. */
export interface ReceivedMail {
  envelopeFrom: string;
  recipients: string[];
  subject: string;
  body: string;
  raw: string;
}

export interface FakeSmtpServer {
  port: number;
  close: () => Promise<void>;
}

/** RFC 2047 encoded words (`=?UTF-8?Q?...?=` / `=?UTF-8?B?...?=`), as nodemailer writes non-ASCII headers. */
function decodeEncodedWords(value: string): string {
  return value
    .replace(/\?=\s+=\?/g, '?==?')
    .replace(/=\?([^?]+)\?([QqBb])\?([^?]*)\?=/g, (_match, _charset: string, encoding: string, text: string) => {
      if (encoding.toUpperCase() === 'B') return Buffer.from(text, 'base64').toString('utf8');
      const bytes = text.replace(/_/g, ' ').replace(/=([0-9A-Fa-f]{2})/g, (_m, hex: string) => `%${hex}`);
      try {
        return decodeURIComponent(bytes);
      } catch {
        return text;
      }
    });
}

function decodeQuotedPrintable(value: string): string {
  const joined = value.replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let i = 0; i < joined.length; i++) {
    const hex = joined.slice(i + 1, i + 3);
    if (joined[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      i += 2;
    } else {
      bytes.push(...Buffer.from(joined[i] ?? '', 'utf8'));
    }
  }
  return Buffer.from(bytes).toString('utf8');
}

/**
 * Reads the subject and the text of a single-part message (what our notifications are). Multipart
 * messages keep their raw body: the Outbox shows it as it came.
 */
export function parseReceivedMail(raw: string, envelopeFrom: string, recipients: string[]): ReceivedMail {
  const split = raw.search(/\r?\n\r?\n/);
  const headerText = split === -1 ? raw : raw.slice(0, split);
  const bodyText = split === -1 ? '' : raw.slice(split).replace(/^\r?\n\r?\n/, '');
  const headers = new Map<string, string>();
  for (const line of headerText.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':');
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim());
  }
  const encoding = (headers.get('content-transfer-encoding') ?? '').toLowerCase();
  const body =
    encoding === 'quoted-printable'
      ? decodeQuotedPrintable(bodyText)
      : encoding === 'base64'
        ? Buffer.from(bodyText.replace(/\s+/g, ''), 'base64').toString('utf8')
        : bodyText;
  return {
    envelopeFrom,
    recipients,
    subject: decodeEncodedWords(headers.get('subject') ?? ''),
    body: body.replace(/\r\n/g, '\n').trimEnd(),
    raw,
  };
}

const MAX_MESSAGE_BYTES = 1_000_000;

/**
 * A local SMTP listener (smtp-server) that accepts every message without authentication or TLS and hands
 * it to `onMessage`. For local runs and tests only: it never relays anything anywhere.
 */
export async function startFakeSmtpServer(options: {
  host: string;
  port: number;
  onMessage: (mail: ReceivedMail) => Promise<void> | void;
}): Promise<FakeSmtpServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    banner: 'Ladderwright local fake SMTP (captures mail, relays nothing)',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
        const to = session.envelope.rcptTo.map((recipient) => recipient.address);
        Promise.resolve(options.onMessage(parseReceivedMail(raw, from, to)))
          .then(() => callback())
          .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  server.on('error', () => undefined);
  const address = server.server.address();
  const port = typeof address === 'object' && address ? address.port : options.port;
  return { port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}
