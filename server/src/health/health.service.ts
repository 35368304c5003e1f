import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { Injectable } from '@nestjs/common';
import { Sequelize } from 'sequelize-typescript';
import type { HealthResponse } from '@ladderwright/shared/api';

const DATABASE_PROBE_TIMEOUT_MS = 3_000;

function readAppVersion(): string {
  try {
    const manifest = JSON.parse(readFileSync(join(__dirname, '..', '..', 'package.json'), 'utf8')) as {
      version?: unknown;
    };
    return typeof manifest.version === 'string' ? manifest.version : 'unknown';
  } catch {
    return 'unknown';
  }
}

@Injectable()
export class HealthService {
  private readonly startedAtMs = Date.now();
  private readonly version = readAppVersion();

  constructor(private readonly sequelize: Sequelize) {}

  async check(): Promise<HealthResponse> {
    const database = await this.probeDatabase();
    return {
      status: database.status === 'up' ? 'ok' : 'degraded',
      app: { version: this.version, uptimeS: Math.round((Date.now() - this.startedAtMs) / 1000) },
      database,
    };
  }

  private async probeDatabase(): Promise<HealthResponse['database']> {
    const startMs = Date.now();
    let timer: NodeJS.Timeout | undefined;
    const timeout = new Promise<never>((_resolve, reject) => {
      timer = setTimeout(() => reject(new Error('database probe timed out')), DATABASE_PROBE_TIMEOUT_MS);
    });
    try {
      await Promise.race([this.sequelize.query('SELECT 1'), timeout]);
      return { status: 'up', latencyMs: Date.now() - startMs };
    } catch {
      return { status: 'down', latencyMs: null };
    } finally {
      clearTimeout(timer);
    }
  }
}
