/**
 * The backup section of parameter sets and fit reports: export → import gives rows equal to the
 * original in every column (ids apart: entries are compared by title, sets by name), a fit keeps
 * its link to the set it started from, and a damaged section is refused with nothing written.
 * Expected outcomes are the product's rules (common practice, no source); the levels are invented
 * (3d² from Racah's B = 800, C = 3200 cm⁻¹ with Racah 1942's term formulas, as in parameters.test.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { sqlite } from './db';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { saveAnnotation } from './services/annotations';
import { createParameterSet, updateParameterSet } from './services/parameter-sets';
import { fitAndSave } from './services/fit-reports';
import { exportProject, importProject } from './services/backup';
import { statusOf } from './status-of';
import { INVENTED_3D2_OBSERVED, INVENTED_3D2_START } from '../../../tests/fixtures/invented-3d2';

let owner: Actor, editor: Actor, projectId: string;

type Row = Record<string, unknown>;
const rows = (query: string, ...params: unknown[]) => sqlite.prepare(query).all(...params) as Row[];
const without = (row: Row, ...keys: string[]) => Object.fromEntries(Object.entries(row).filter(([k]) => !keys.includes(k)));

/** Every column of the project's parameter sets and fit reports, ids replaced by the entry's title and the set's name. */
function snapshot(pid: string) {
	const sets = rows(
		`select s.*, e.title as entry from parameter_sets s join shelf_entries e on e.id = s.entry_id where e.project_id = ? order by s.name`,
		pid
	);
	const fits = rows(
		`select f.*, e.title as entry, s.name as set_name from fit_reports f join shelf_entries e on e.id = f.entry_id
		 left join parameter_sets s on s.id = f.parameter_set_id where e.project_id = ? order by f.created_at, f.rms`,
		pid
	);
	return {
		sets: sets.map((s) => without(s, 'id', 'entry_id')),
		fits: fits.map((f) => without(f, 'id', 'entry_id', 'parameter_set_id'))
	};
}

const START = INVENTED_3D2_START;

beforeAll(async () => {
	owner = await signUp({ name: 'Ruth Owner', email: 'ruth@example.org', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Karl Editor', email: 'karl@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Invented ions' }).id;
	addMember(owner, projectId, { email: 'karl@example.org', role: 'editor' });
	const entryId = createEntry(editor, projectId, { title: 'Invented 3d2', notation: '3d2' }).id;
	for (const [levelKey, energy] of INVENTED_3D2_OBSERVED)
		saveAnnotation(editor, projectId, entryId, {
			levelKey,
			observedEnergy: String(energy),
			uncertainty: '2',
			status: 'proposed',
			comment: ''
		});
	const set = createParameterSet(editor, projectId, entryId, { name: 'start', parameters: START, comment: 'invented, “quoted”' });
	updateParameterSet(owner, projectId, entryId, set.id, { comment: 'changed by the owner', version: 1 });
	createParameterSet(owner, projectId, entryId, { name: 'second', parameters: { F: [{ k: 2, a: '3d', b: '3d', value: 60000 }] } });
	fitAndSave(editor, projectId, entryId, { parameters: START, vary: ['Eav', 'F2(3d,3d)', 'F4(3d,3d)'], parameterSetId: set.id });
	fitAndSave(owner, projectId, entryId, {
		parameters: START,
		vary: ['Eav', 'F2(3d,3d)'],
		links: [{ id: 'F4(3d,3d)', to: 'F2(3d,3d)', ratio: 0.65 }],
		observed: [
			{ J: '2', energy: 0, uncertainty: 3, assign: '3F' },
			{ J: '0', energy: 12000, assign: '3P' },
			{ J: '4', energy: 16000, assign: 1 }
		]
	});
});

describe('parameter sets and fit reports in the project backup', () => {
	it('come back equal in every column (ids apart), with who, when, versions and the link to the set', () => {
		const file = JSON.stringify(exportProject(owner, projectId));
		const restored = importProject(owner, file).projectId;
		const before = snapshot(projectId);
		const after = snapshot(restored);
		expect(before.sets).toHaveLength(2);
		expect(before.fits).toHaveLength(2);
		expect(before.sets.find((s) => s.name === 'start')).toMatchObject({ version: 2, comment: 'changed by the owner' });
		expect(before.fits.map((f) => f.set_name).sort()).toEqual(['start', null].sort());
		expect(after.sets).toEqual(before.sets);
		expect(after.fits).toEqual(before.fits);
	});

	it('a damaged section is refused and nothing is written', () => {
		const file = exportProject(owner, projectId);
		const section = file.sections.energyParameters as { fits: { result: { rms: unknown } }[] };
		section.fits[0].result.rms = 'small';
		const count = () => rows('select count(*) as n from projects')[0].n;
		const n = count();
		expect(() => importProject(owner, JSON.stringify(file))).toThrow(/parameter sets and fit reports are damaged/);
		expect(statusOf(() => importProject(owner, JSON.stringify(file)))).toBe(400);
		expect(count()).toBe(n);
	});
});
