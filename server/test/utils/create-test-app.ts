import type { NestExpressApplication } from '@nestjs/platform-express';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from '../../src/app.module';
import { type AppEnv, loadEnv } from '../../src/config/env';
import { MIGRATIONS_TABLE, runMigrations } from '../../src/database/migrator';

export interface TestApp {
  app: NestExpressApplication;
  env: AppEnv;
  sequelize: Sequelize;
  close: () => Promise<void>;
}

export interface TestAppOptions {
  env?: Partial<AppEnv>;
  /** false for an app whose database is meant to be unreachable. */
  prepareDatabase?: boolean;
}

/**
 * The test environment: DATABASE_URL and JWT_SECRET from the caller; fast password hashing; no demo seed;
 * sign-in limits per address and overall out of reach (every suite signs in from 127.0.0.1; the limits
 * have their own suite).
 */
export function testEnv(overrides: Partial<AppEnv> = {}): AppEnv {
  return Object.freeze({
    ...loadEnv(),
    bcryptRounds: 4,
    seedDemo: false,
    clientDistDir: '/nonexistent',
    signInPerAddressPerMin: 100_000,
    signInPerMin: 1_000_000,
    ...overrides,
  });
}

function assertTestDatabase(databaseUrl: string): void {
  const name = new URL(databaseUrl).pathname.replace(/^\//, '');
  if (!name.endsWith('_test')) {
    throw new Error(`e2e suites truncate tables: DATABASE_URL must name a *_test database (got '${name}')`);
  }
}

/** Removes every row from every application table (the migrations ledger stays). */
export async function truncateAllTables(sequelize: Sequelize): Promise<void> {
  const [rows] = await sequelize.query(
    `SELECT tablename FROM pg_tables WHERE schemaname = 'public' AND tablename <> '${MIGRATIONS_TABLE}'`,
  );
  const tables = (rows as { tablename: string }[]).map((row) => `"${row.tablename}"`);
  if (tables.length > 0) await sequelize.query(`TRUNCATE ${tables.join(', ')} RESTART IDENTITY CASCADE`);
}

/**
 * Boots the app exactly as main.ts does (same createApp/configureApp), migrates the test database and
 * empties it, so each suite starts from a clean schema.
 */
export async function createTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const env = testEnv(options.env);
  const prepareDatabase = options.prepareDatabase ?? true;
  if (prepareDatabase) assertTestDatabase(env.databaseUrl);
  const app = await createApp(env, { logger: false });
  const sequelize = app.get(Sequelize);
  if (prepareDatabase) {
    await runMigrations(sequelize);
    await truncateAllTables(sequelize);
  }
  await app.init();
  return { app, env, sequelize, close: () => app.close() };
}
