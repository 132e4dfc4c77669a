// Online copy of the whole database into backups/termwright-<timestamp>.db with SQLite's backup API
// (better-sqlite3's db.backup): the app may keep running and writing; the copy is one consistent moment.
// Usage: npm run backup [-- <directory>]   (DATABASE_PATH chooses the database, as for the app)
import Database from 'better-sqlite3';
import { mkdirSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { DEFAULT_DATABASE_PATH } from '../src/lib/server/db/index';

const source = process.env.DATABASE_PATH ?? DEFAULT_DATABASE_PATH;
const dir = resolve(process.argv[2] ?? 'backups');
const stamp = new Date().toISOString().replace(/[:.]/g, '-');
const target = join(dir, `termwright-${stamp}.db`);

if (source === ':memory:') throw new Error('DATABASE_PATH is :memory:; there is no database file to back up');
mkdirSync(dir, { recursive: true });
const db = new Database(source, { readonly: true, fileMustExist: true });
try {
	await db.backup(target, {
		progress({ totalPages, remainingPages }) {
			if (totalPages > 1000) process.stdout.write(`\r${totalPages - remainingPages}/${totalPages} pages`);
			return 200; // pages per step; the app can write between steps
		}
	});
} finally {
	db.close();
}

// One self-contained file (no -wal beside it), checked before we say it is good.
const copy = new Database(target);
copy.pragma('journal_mode = DELETE');
const check = copy.pragma('integrity_check', { simple: true });
const projects = (copy.prepare('select count(*) as n from projects').get() as { n: number }).n;
copy.close();
if (check !== 'ok') throw new Error(`The copy ${target} failed SQLite's integrity check: ${String(check)}`);
console.log(
	`Backed up ${source} to ${target} (${(statSync(target).size / 1024).toFixed(0)} kB, ${projects} project${projects === 1 ? '' : 's'}, integrity ok).`
);
