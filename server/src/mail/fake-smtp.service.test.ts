import { type AddressInfo, createServer } from 'node:net';
import type { AppEnv } from '../config/env';
import type { CapturedMailModel } from './captured-mail.model';
import { FakeSmtpService } from './fake-smtp.service';

describe('FakeSmtpService on a machine with two instances', () => {
  it('leaves the port to the instance that holds it and starts without it', async () => {
    const captured = {} as typeof CapturedMailModel;
    // A free port found by listening on port 0 and closing again.
    const probe = createServer();
    await new Promise<void>((done) => probe.listen(0, '127.0.0.1', done));
    const port = (probe.address() as AddressInfo).port;
    await new Promise((done) => probe.close(done));
    const first = new FakeSmtpService({ smtpFake: true, smtpHost: '127.0.0.1', smtpPort: port } as AppEnv, captured);
    await first.onApplicationBootstrap();
    const second = new FakeSmtpService({ smtpFake: true, smtpHost: '127.0.0.1', smtpPort: port } as AppEnv, captured);
    try {
      await expect(second.onApplicationBootstrap()).resolves.toBeUndefined();
      expect((second as unknown as { server: unknown }).server).toBeNull();
    } finally {
      await second.onApplicationShutdown();
      await first.onApplicationShutdown();
    }
  });
});
