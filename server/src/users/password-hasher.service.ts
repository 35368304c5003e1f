import { Inject, Injectable } from '@nestjs/common';
import { compare, hash } from 'bcryptjs';
import { APP_ENV, type AppEnv } from '../config/env';

/** bcrypt hashing of account passwords; the cost factor comes from the environment. */
@Injectable()
export class PasswordHasherService {
  private dummyHash: Promise<string> | null = null;

  constructor(@Inject(APP_ENV) private readonly env: AppEnv) {}

  hash(password: string): Promise<string> {
    return hash(password, this.env.bcryptRounds);
  }

  verify(password: string, passwordHash: string): Promise<boolean> {
    return compare(password, passwordHash);
  }

  /** Spends the same time as a real check, so unknown e-mails cannot be told apart by timing. */
  async verifyAgainstNothing(password: string): Promise<false> {
    this.dummyHash ??= hash('no-such-account-0', this.env.bcryptRounds);
    await compare(password, await this.dummyHash);
    return false;
  }
}
