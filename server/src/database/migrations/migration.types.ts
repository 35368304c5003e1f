import type { QueryInterface } from 'sequelize';

/** One schema step. `up` runs inside the migrator; steps are never edited once released, only added. */
export interface SchemaMigration {
  name: string;
  up: (context: QueryInterface) => Promise<void>;
  down: (context: QueryInterface) => Promise<void>;
}
