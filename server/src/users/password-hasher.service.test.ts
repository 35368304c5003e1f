import { compare } from 'bcryptjs';
import type { AppEnv } from '../config/env';
import { PasswordHasherService } from './password-hasher.service';

describe('PasswordHasherService', () => {
  const hasher = new PasswordHasherService({ bcryptRounds: 11 } as AppEnv);
  afterAll(() => hasher.onModuleDestroy());

  it('hashes and verifies with bcrypt (bcryptjs reads the hash the worker wrote)', async () => {
    const passwordHash = await hasher.hash('Bench-check-42');
    expect(passwordHash).toMatch(/^\$2[aby]\$11\$/);
    expect(await compare('Bench-check-42', passwordHash)).toBe(true);
    expect(await hasher.verify('Bench-check-42', passwordHash)).toBe(true);
    expect(await hasher.verify('Bench-check-43', passwordHash)).toBe(false);
  });

  // bcrypt at cost 11 is 2^11 rounds of EksBlowfish (~0.1-0.3 s of CPU here). On the request thread, even
  // bcryptjs's async API (it yields between chunks) keeps the event loop busy nearly all that time; off-thread
  // the loop sits idle. Event-loop utilisation measures exactly that share, whatever else loads the machine.
  it('leaves the event loop idle while it hashes', async () => {
    const before = performance.eventLoopUtilization();
    await Promise.all([hasher.hash('Bench-check-42'), hasher.hash('Bench-check-43')]);
    const used = performance.eventLoopUtilization(before);
    expect(used.idle + used.active).toBeGreaterThan(50);
    expect(used.utilization).toBeLessThan(0.3);
  });
});
