/**
 * The database connection. The file lives at $DATABASE_PATH (default data/termwright.db);
 * ':memory:' gives a private database, used by the unit tests. Migrations from drizzle/
 * are applied on open, so a fresh file is always at the current schema. Nothing is opened when
 * this module is imported: `db` and `sqlite` open the file on first use.
 */
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';
import { DEFAULT_DATABASE_PATH, databasePath, migrationsPath } from '../config';

export type Db = BetterSQLite3Database<typeof schema>;

export { DEFAULT_DATABASE_PATH };

export function openDatabase(path = databasePath()): { db: Db; sqlite: Database.Database } {
	if (path !== ':memory:') mkdirSync(dirname(resolve(path)), { recursive: true });
	const sqlite = new Database(path);
	sqlite.pragma('journal_mode = WAL');
	sqlite.pragma('foreign_keys = ON');
	sqlite.pragma('busy_timeout = 5000');
	const db = drizzle(sqlite, { schema });
	migrate(db, { migrationsFolder: resolve(migrationsPath()) });
	return { db, sqlite };
}

let opened: ReturnType<typeof openDatabase> | null = null;
const connection = () => (opened ??= openDatabase());

/** Forwards to the object made on first use, binding methods to it. */
function lazy<T extends object>(make: () => T): T {
	return new Proxy({} as T, {
		get(_target, key) {
			const real = make();
			const value = Reflect.get(real, key, real);
			return typeof value === 'function' ? value.bind(real) : value;
		}
	});
}

/** The app's Drizzle database; the file opens (and migrates) on first use. */
export const db: Db = lazy(() => connection().db);
/** The raw better-sqlite3 handle of the same connection. */
export const sqlite: Database.Database = lazy(() => connection().sqlite);
export { schema };
