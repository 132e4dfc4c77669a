/**
 * Engine budgets at the Shelf: a notation over a budget is refused when saved (400 naming the
 * limit), and an entry stored before the budgets existed is answered with a clear 422 on its
 * page and in its exports instead of running the computation (regression: such an entry once
 * crashed the server for every viewer). Limits: src/lib/physics/budget.ts (common practice, no source).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { refusal } from './status-of';
import { eq } from 'drizzle-orm';
import type { Actor } from './access';
import { db } from './db';
import { shelfEntries } from './db/schema';
import { signUp } from './services/users';
import { createProject } from './services/projects';
import { createEntry, updateEntry } from './services/shelf';
import { annotatedLevels } from './services/annotations';
import { exportAnnotatedLevels } from './services/exports';
import { MAX_ENTRY_LEVELS } from '../physics/budget';

let owner: Actor, projectId: string;

beforeAll(async () => {
	owner = await signUp({ name: 'Bu Dget', email: 'budget@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Budgets' }).id;
});

describe('Shelf entries and the engine budgets', () => {
	it('saving 12o23 is refused with a 400 that names the limit', () => {
		const e = refusal(() => createEntry(owner, projectId, { title: 'huge', species: '', notation: '12o23' }));
		expect(e.status).toBe(400);
		expect(e.message).toMatch(/over the limit of 15000/);
		expect(e.details).toMatchObject({ field: 'notation' });
	});

	it(`a configuration with more than ${MAX_ENTRY_LEVELS} single levels is refused (4f7 5d3 6p3 has 668 300)`, () => {
		// 668 300 levels of 4f7 5d3 6p3: counted with multiplicity (sum over terms of count × number of J).
		const e = refusal(() => createEntry(owner, projectId, { title: 'many levels', species: '', notation: '4f7 5d3 6p3' }));
		expect(e.status).toBe(400);
		expect(e.message).toMatch(/668300 single levels, over the limit of 50000/);
	});

	it('changing an entry to a configuration over the budget is refused too', () => {
		const entry = createEntry(owner, projectId, { title: 'ok', species: '', notation: '3d3' });
		const e = refusal(() => updateEntry(owner, projectId, entry.id, { version: entry.version, notation: '10m19' }));
		expect(e.status).toBe(400);
	});

	it('an old stored entry over the budget gives a clear 422 on its page and export, not a crash', () => {
		const entry = createEntry(owner, projectId, { title: 'old', species: '', notation: '3d3' });
		// Written as an entry saved before the budget existed would be.
		db.update(shelfEntries).set({ notation: '12o23' }).where(eq(shelfEntries.id, entry.id)).run();
		const page = refusal(() => annotatedLevels(owner, projectId, entry.id));
		expect(page.status).toBe(422);
		expect(page.message).toMatch(/12o23 of this entry is too large to show: .*over the limit of 15000/);
		expect(refusal(() => exportAnnotatedLevels(owner, projectId, entry.id, 'csv')).status).toBe(422);
	});
});
