import { Inject, Injectable, type OnModuleDestroy } from '@nestjs/common';
import { Piscina } from 'piscina';
import { BusyException } from '../common/filters/domain-error.filter';
import { workerEntry } from '../common/workers/worker-entry';
import { APP_ENV, type AppEnv } from '../config/env';
import type { HashTask, VerifyTask } from './password-hash.worker';

/** Hashes waiting beyond this many are refused with 503 busy rather than queued for ever. */
const MAX_QUEUED_HASHES = 64;

/**
 * bcrypt hashing of account passwords on one worker thread (piscina), off the request thread; the cost
 * factor comes from the environment. bcrypt stays (the stored hashes are bcrypt) and reads at most 72 bytes
 * of a password, which the password policy enforces for new passwords.
 */
@Injectable()
export class PasswordHasherService implements OnModuleDestroy {
  private dummyHash: Promise<string> | null = null;
  private pool: Piscina | null = null;

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  hash(password: string): Promise<string> {
    return this.run<HashTask, string>('hashPassword', { password, rounds: this.env.bcryptRounds });
  }

  verify(password: string, passwordHash: string): Promise<boolean> {
    return this.run<VerifyTask, boolean>('verifyPassword', { password, passwordHash });
  }

  /** Spends the same time as a real check, so unknown e-mails cannot be told apart by timing. */
  async verifyAgainstNothing(password: string): Promise<false> {
    this.dummyHash ??= this.hash('no-such-account-0');
    await this.verify(password, await this.dummyHash);
    return false;
  }

  async onModuleDestroy(): Promise<void> {
    const pool = this.pool;
    this.pool = null;
    await pool?.destroy();
  }

  private async run<Task, Result>(name: string, task: Task): Promise<Result> {
    this.pool ??= new Piscina({
      ...workerEntry(__dirname, 'password-hash.worker'),
      // A named export piscina finds at start-up (it has no default export to fall back on).
      name: 'hashPassword',
      minThreads: 0,
      maxThreads: 1,
      idleTimeout: 60_000,
      maxQueue: MAX_QUEUED_HASHES,
    });
    if (this.pool.queueSize >= MAX_QUEUED_HASHES) throw new BusyException('Too many sign-ins at once; try again');
    return (await this.pool.run(task, { name })) as Result;
  }
}
