/**
 * Fuzzing the CSV upload path of level and line lists (fast-check): near-valid and noisy files go through the
 * upload services. Whatever comes in, the answer is a saved list or a ServiceError with a 4xx status (never any
 * other exception, so never a 500), and a refused file leaves no row and no activity entry behind; a saved one
 * adds exactly its rows and one activity entry. `npm test` runs a short version; `npm run fuzz` runs FUZZ_RUNS.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { count } from 'drizzle-orm';
import { db } from '../server/db';
import { activityLog, levelListRows, lineListRows } from '../server/db/schema';
import { signUp } from '../server/services/users';
import { createProject } from '../server/services/projects';
import { uploadLevelList, uploadLineList } from '../server/services/lists';
import { ServiceError } from '../server/errors';
import type { Actor } from '../server/access';

const RUNS = Number(process.env.FUZZ_RUNS ?? 60);

let editor: Actor, projectId: string;
beforeAll(async () => {
	editor = await signUp({ name: 'Fuzz Editor', email: 'fuzz@example.org', password: 'long-enough-pw' });
	projectId = createProject(editor, { name: 'Fuzz' }).id;
});

const cell = fc.oneof(
	{ weight: 4, arbitrary: fc.constantFrom('0', '118.9', '44310.35', '-1', '1e4', '1/2', '3/2', '1.5', 'e', 'o', 'even', 'odd') },
	{
		weight: 3,
		arbitrary: fc.constantFrom('A', 'Å', 'nm', 'cm-1', 'air', 'vacuum', '3P', '²D°', '3P°', '', ' ', 'NaN', 'Infinity', '0x10')
	},
	{ weight: 2, arbitrary: fc.string({ maxLength: 8 }) },
	{ weight: 1, arbitrary: fc.constantFrom('"', '""', '"a,b"', '\r', '\n', ',', '=SUM(A1)', '\u0000', 'x'.repeat(250)) }
);
const header = (columns: readonly string[]) =>
	fc.oneof(
		{ weight: 6, arbitrary: fc.shuffledSubarray([...columns], { minLength: 1 }) },
		{ weight: 1, arbitrary: fc.array(fc.oneof(fc.constantFrom(...columns), fc.string({ maxLength: 6 })), { maxLength: 8 }) }
	);
const csvFile = (columns: readonly string[]) =>
	fc
		.tuple(
			header(columns),
			fc.array(fc.array(cell, { maxLength: 9 }), { maxLength: 12 }),
			fc.constantFrom(',', ';', '\t'),
			fc.constantFrom('\n', '\r\n')
		)
		.map(([head, rows, sep, nl]) => [head.join(sep), ...rows.map((r) => r.join(sep))].join(nl));

const totals = () => ({
	levels: db.select({ n: count() }).from(levelListRows).get()!.n,
	lines: db.select({ n: count() }).from(lineListRows).get()!.n,
	log: db.select({ n: count() }).from(activityLog).get()!.n
});

function check(kind: 'levels' | 'lines', csv: string) {
	const before = totals();
	const upload = kind === 'levels' ? uploadLevelList : uploadLineList;
	let saved = 0;
	try {
		const r = upload(editor, projectId, { name: 'fuzz', csv }, { save: true });
		saved = r.list!.rowCount;
		expect(saved).toBeGreaterThan(0);
	} catch (e) {
		if (!(e instanceof ServiceError)) throw e;
		expect(e.status).toBeGreaterThanOrEqual(400);
		expect(e.status).toBeLessThan(500);
	}
	const after = totals();
	expect(after[kind] - before[kind]).toBe(saved);
	expect(after[kind === 'levels' ? 'lines' : 'levels']).toBe(before[kind === 'levels' ? 'lines' : 'levels']);
	expect(after.log - before.log).toBe(saved > 0 ? 1 : 0);
	// The preview never writes.
	try {
		upload(editor, projectId, { name: 'fuzz', csv }, { save: false });
	} catch (e) {
		if (!(e instanceof ServiceError)) throw e;
	}
	expect(totals()).toEqual(after);
}

describe('fuzz: CSV uploads of level and line lists', () => {
	it('a level file is saved whole or refused with a 4xx, never half-saved', () => {
		fc.assert(
			fc.property(csvFile(['energy', 'uncertainty', 'J', 'parity', 'configuration', 'term', 'g']), (csv) => check('levels', csv)),
			{ numRuns: RUNS }
		);
	});
	it('a line file is saved whole or refused with a 4xx, never half-saved', () => {
		fc.assert(
			fc.property(csvFile(['wavelength', 'unit', 'medium', 'uncertainty', 'intensity', 'comment']), (csv) => check('lines', csv)),
			{ numRuns: RUNS }
		);
	});
	it('a file of valid rows in any column order is saved whole, every row', () => {
		const level = fc.record({
			energy: fc.double({ min: 0, max: 2e5, noNaN: true }).map((x) => x.toFixed(3)),
			J: fc.constantFrom('0', '1', '2', '1/2', '3/2', '2.5'),
			parity: fc.constantFrom('even', 'odd', 'e', 'o')
		});
		fc.assert(
			fc.property(fc.array(level, { minLength: 1, maxLength: 30 }), fc.boolean(), (rows, swap) => {
				const head = swap ? ['parity', 'J', 'energy'] : ['energy', 'J', 'parity'];
				const csv = [head.join(','), ...rows.map((r) => head.map((h) => r[h as keyof typeof r]).join(','))].join('\n');
				const before = totals().levels;
				const saved = uploadLevelList(editor, projectId, { name: 'valid', csv }, { save: true }).list!;
				expect(saved.rowCount).toBe(rows.length);
				expect(totals().levels - before).toBe(rows.length);
			}),
			{ numRuns: RUNS }
		);
	});
	it('noise of any kind is refused or saved, never an exception', () => {
		fc.assert(
			fc.property(fc.string({ maxLength: 300 }), fc.boolean(), (csv, levels) => check(levels ? 'levels' : 'lines', csv)),
			{ numRuns: RUNS }
		);
	});
});
