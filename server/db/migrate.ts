import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { fileURLToPath } from 'node:url';
import type { Db } from './client';

const migrationsFolder = fileURLToPath(new URL('../../drizzle', import.meta.url));

export function applyMigrations(db: Db): void {
  migrate(db, { migrationsFolder });
}
