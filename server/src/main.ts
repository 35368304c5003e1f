import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { Sequelize } from 'sequelize-typescript';
import { createApp } from './app.module';
import { EnvError, loadEnv } from './config/env';
import { runMigrations } from './database/migrator';
import { seedDemo } from './database/seed-demo';
import { PasswordHasherService } from './users/password-hasher.service';

async function bootstrap(): Promise<void> {
  const logger = new Logger('Ladderwright');
  const env = loadEnv();
  const app = await createApp(env);
  app.enableShutdownHooks();
  const sequelize = app.get(Sequelize);
  const applied = await runMigrations(sequelize);
  if (applied.length > 0) logger.log(`applied migrations: ${applied.join(', ')}`);
  if (env.seedDemo) {
    const created = await seedDemo(app.get(PasswordHasherService));
    if (created > 0) logger.log(`demo data: ${created} records created`);
  }
  await app.listen(env.port, env.host);
  logger.log(`listening on http://${env.host}:${env.port}`);
}

bootstrap().catch((error: unknown) => {
  if (error instanceof EnvError) {
    console.error(error.message);
  } else {
    console.error('Ladderwright server failed to start:', error instanceof Error ? error.message : error);
  }
  process.exit(1);
});
