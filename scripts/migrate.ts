// Applies the migrations in drizzle/ to the database file ($DATABASE_PATH or data/termwright.db).
import { openDatabase, DEFAULT_DATABASE_PATH } from '../src/lib/server/db/index';

const path = process.env.DATABASE_PATH ?? DEFAULT_DATABASE_PATH;
const { sqlite } = openDatabase(path);
const applied = sqlite.prepare('select count(*) as n from __drizzle_migrations').get() as { n: number };
console.log(`Database ${path} is at the current schema (${applied.n} migration${applied.n === 1 ? '' : 's'} applied).`);
sqlite.close();
