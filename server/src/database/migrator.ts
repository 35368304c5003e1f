import type { Sequelize } from 'sequelize-typescript';
import { SequelizeStorage, Umzug } from 'umzug';
import { SCHEMA_MIGRATIONS } from './migrations';

export const MIGRATIONS_TABLE = 'schema_migrations';

/** Builds the umzug migrator over the compiled migration modules; progress is kept in `schema_migrations`. */
export function createMigrator(sequelize: Sequelize): Umzug<ReturnType<Sequelize['getQueryInterface']>> {
  const context = sequelize.getQueryInterface();
  return new Umzug({
    migrations: SCHEMA_MIGRATIONS.map((migration) => ({
      name: migration.name,
      up: async () => migration.up(context),
      down: async () => migration.down(context),
    })),
    context,
    storage: new SequelizeStorage({ sequelize, tableName: MIGRATIONS_TABLE }),
    logger: undefined,
  });
}

/** Applies pending migrations; returns the names applied. Safe to call on every boot. */
export async function runMigrations(sequelize: Sequelize): Promise<string[]> {
  const applied = await createMigrator(sequelize).up();
  return applied.map((migration) => migration.name);
}
