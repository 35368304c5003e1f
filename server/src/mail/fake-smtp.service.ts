import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import { InjectModel } from '@nestjs/sequelize';
import { APP_ENV, type AppEnv } from '../config/env';
import { CapturedMailModel } from './captured-mail.model';
import type * as FakeSmtpModule from './fake-smtp-server';

/** smtp-server, loaded only with SMTP_FAKE=1. */
function loadFakeSmtp(): typeof FakeSmtpModule {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a lazy load; import() would need ESM here
  return require('./fake-smtp-server') as typeof FakeSmtpModule;
}

/**
 * With SMTP_FAKE=1 (npm start, browser journeys) the server itself listens for SMTP on loopback in place
 * of a hosted mail service and stores every message it receives in `captured_mails` for the Outbox. A further
 * instance on the same machine finds the port taken and leaves the listening to the first.
 */
@Injectable()
export class FakeSmtpService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('FakeSmtp');
  private server: FakeSmtpModule.FakeSmtpServer | null = null;

  constructor(
    @Inject(APP_ENV) private readonly env: AppEnv,
    @InjectModel(CapturedMailModel) private readonly captured: typeof CapturedMailModel,
  ) {}

  async onApplicationBootstrap(): Promise<void> {
    if (!this.env.smtpFake || !this.env.smtpHost || !this.env.smtpPort) return;
    try {
      this.server = await loadFakeSmtp().startFakeSmtpServer({
        host: this.env.smtpHost,
        port: this.env.smtpPort,
        onMessage: async (mail) => {
          await this.captured.create(mail);
        },
      });
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
      // A second instance on this machine (npm start again with another PORT): the first one's listener takes this
      // instance's mail too and stores it in the same database, so the Outbox still shows all of it.
      this.logger.log(`fake SMTP already listening on ${this.env.smtpHost}:${this.env.smtpPort}; mail goes there`);
      return;
    }
    this.logger.log(`fake SMTP listening on ${this.env.smtpHost}:${this.server.port} (mail goes to the Outbox)`);
  }

  async onApplicationShutdown(): Promise<void> {
    await this.server?.close();
  }
}
