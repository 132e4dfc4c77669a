/**
 * The database connection. The file lives at $DATABASE_PATH (default data/termwright.db);
 * ':memory:' gives a private database, used by the unit tests. Migrations from drizzle/
 * are applied on open, so a fresh file is always at the current schema.
 */
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema>;

export const DEFAULT_DATABASE_PATH = 'data/termwright.db';

export function openDatabase(path = process.env.DATABASE_PATH ?? DEFAULT_DATABASE_PATH): { db: Db; sqlite: Database.Database } {
	if (path !== ':memory:') mkdirSync(dirname(resolve(path)), { recursive: true });
	const sqlite = new Database(path);
	sqlite.pragma('journal_mode = WAL');
	sqlite.pragma('foreign_keys = ON');
	sqlite.pragma('busy_timeout = 5000');
	const db = drizzle(sqlite, { schema });
	migrate(db, { migrationsFolder: resolve(process.env.MIGRATIONS_PATH ?? 'drizzle') });
	return { db, sqlite };
}

const opened = openDatabase();
export const db: Db = opened.db;
export const sqlite = opened.sqlite;
export { schema };
