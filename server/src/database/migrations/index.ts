import type { SchemaMigration } from './migration.types';
import { usersAndProjects } from './0001-users-and-projects';

/** Every schema step in order. Add new steps at the end. */
export const SCHEMA_MIGRATIONS: readonly SchemaMigration[] = [usersAndProjects];
