/**
 * Migration 0007 (review and note history) on a database that already holds level notes: each
 * note's proposer becomes the last person who changed it, and its history starts with one
 * 'recorded' row holding its state, by that person, at that time. Product rule (the migration's
 * own comment; common practice for a back-fill, no source). Data invented.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const REVIEW_MIGRATION = '0007_review_and_note_history';
const dir = mkdtempSync(join(tmpdir(), 'tw-migrate-'));
const sqlite = new Database(':memory:');
sqlite.pragma('foreign_keys = ON');
type Row = Record<string, unknown>;

/** The migrations folder as it was before the review migration: the same files, a shorter journal. */
function migrationsBefore(tag: string) {
	const before = join(dir, 'drizzle');
	cpSync(resolve('drizzle'), before, { recursive: true });
	const journalPath = join(before, 'meta', '_journal.json');
	const journal = JSON.parse(readFileSync(journalPath, 'utf8')) as { entries: { tag: string }[] };
	const at = journal.entries.findIndex((e) => e.tag === tag);
	if (at < 0) throw new Error(`no migration ${tag} in drizzle/meta/_journal.json`);
	journal.entries = journal.entries.slice(0, at);
	writeFileSync(journalPath, JSON.stringify(journal));
	return before;
}

beforeAll(() => {
	const db = drizzle(sqlite);
	migrate(db, { migrationsFolder: migrationsBefore(REVIEW_MIGRATION) });
	expect(sqlite.prepare("select name from sqlite_master where name = 'level_annotation_history'").get()).toBeUndefined();
	// A project as an older server left it: two notes by two people, one by an account since deleted.
	sqlite.exec(`
		insert into users (id, email, name, password_hash) values
			('u-ann', 'ann@example.org', 'Ann Lee', 'x'), ('u-bob', 'bob@example.org', 'Bob Roy', 'x');
		insert into projects (id, name, created_by) values ('p1', 'Old project', 'u-ann');
		insert into shelf_entries (id, project_id, title, notation, created_by, updated_by) values
			('e1', 'p1', 'O III ground', '1s2 2s2 2p2', 'u-ann', 'u-ann');
		insert into level_annotations (id, entry_id, level_key, observed_energy, observed_energy_text, status, comment, version, updated_by, updated_at) values
			('n1', 'e1', '3P#1|1', 113.2, '113.2', 'confirmed', 'plate 2', 3, 'u-bob', 1790000000000),
			('n2', 'e1', '1D#1|2', 20273.3, '20273.3', 'proposed', '', 1, 'u-ann', 1790000100000),
			('n3', 'e1', '3P#1|2', 306.2, null, 'disputed', '', 2, null, 1790000200000);
	`);
	migrate(db, { migrationsFolder: resolve('drizzle') });
});

afterAll(() => {
	sqlite.close();
	rmSync(dir, { recursive: true, force: true });
});

describe('migration 0007 on notes written before it', () => {
	it('each note’s proposer is the last person who changed it', () => {
		const notes = sqlite.prepare('select id, proposed_by, status, version from level_annotations order by id').all() as Row[];
		expect(notes).toEqual([
			{ id: 'n1', proposed_by: 'u-bob', status: 'confirmed', version: 3 },
			{ id: 'n2', proposed_by: 'u-ann', status: 'proposed', version: 1 },
			{ id: 'n3', proposed_by: null, status: 'disputed', version: 2 }
		]);
	});

	it('each note’s history starts with one "recorded" row: its state, who, when', () => {
		const history = sqlite
			.prepare(
				'select annotation_id, project_id, entry_id, level_key, observed_energy_text, status, comment, version, proposed_by, change, actor_id, actor_name, created_at from level_annotation_history order by id'
			)
			.all() as Row[];
		expect(history).toEqual([
			{
				annotation_id: 'n1',
				project_id: 'p1',
				entry_id: 'e1',
				level_key: '3P#1|1',
				observed_energy_text: '113.2',
				status: 'confirmed',
				comment: 'plate 2',
				version: 3,
				proposed_by: 'u-bob',
				change: 'recorded',
				actor_id: 'u-bob',
				actor_name: 'Bob Roy',
				created_at: 1790000000000
			},
			expect.objectContaining({
				annotation_id: 'n2',
				change: 'recorded',
				actor_id: 'u-ann',
				actor_name: 'Ann Lee',
				created_at: 1790000100000
			}),
			// The account is gone: the name says so plainly.
			expect.objectContaining({ annotation_id: 'n3', change: 'recorded', actor_id: null, actor_name: 'someone', status: 'disputed' })
		]);
	});

	it('deleting an account that proposed a note keeps the note (proposed_by set to null)', () => {
		sqlite.prepare("delete from users where id = 'u-ann'").run();
		expect(sqlite.prepare("select proposed_by from level_annotations where id = 'n2'").get()).toEqual({ proposed_by: null });
	});
});
