/**
 * Connection settings that crash and concurrency safety rely on (SQLite documentation:
 * PRAGMA busy_timeout, foreign_keys, journal_mode=WAL).
 */
import { describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { openDatabase, sqlite } from './db';

describe('database connection', () => {
	it('waits up to 5 s for a lock instead of failing at once, and enforces foreign keys', () => {
		expect(sqlite.pragma('busy_timeout', { simple: true })).toBe(5000);
		expect(sqlite.pragma('foreign_keys', { simple: true })).toBe(1);
	});

	it('a database file is opened in WAL mode (atomic commits across a crash, readers beside a writer)', () => {
		const dir = mkdtempSync(join(tmpdir(), 'tw-db-'));
		try {
			const { sqlite: file } = openDatabase(join(dir, 'test.db'));
			expect(file.pragma('journal_mode', { simple: true })).toBe('wal');
			expect(file.pragma('busy_timeout', { simple: true })).toBe(5000);
			file.close();
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	});
});
