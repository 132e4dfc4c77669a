/**
 * Backup and restore of the Line matcher's saved work: level lists (uploaded and from Shelf notes), line lists
 * and identifications come back field by field in the restored project, pointing at the restored rows and
 * entries. Product rule (common practice, no source); the lists are the invented demo lists.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Actor } from './access';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry } from './services/shelf';
import { saveAnnotation } from './services/annotations';
import { getLevelList, getLineList, levelListFromShelf, listLists, uploadLevelList, uploadLineList } from './services/lists';
import { judgeCandidate, listIdentifications } from './services/identifications';
import { exportProject, importProject } from './services/backup';
import { statusOf } from './status-of';
import { DEMO_LEVEL_UPLOAD, DEMO_LINE_UPLOAD } from '../lines/demo';

let owner: Actor, editor: Actor, projectId: string, entryId: string;

beforeAll(async () => {
	owner = await signUp({ name: 'Olga Owner', email: 'olga@example.org', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Eddie Editor', email: 'eddie@example.org', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Matcher backup' }).id;
	addMember(owner, projectId, { email: 'eddie@example.org', role: 'editor' });
	entryId = createEntry(editor, projectId, { title: 'ground', notation: '1s2 2s2 2p2' }).id;
	saveAnnotation(editor, projectId, entryId, { levelKey: '3P#1|1', observedEnergy: '118.90', uncertainty: '0.01' });
	const levels = uploadLevelList(editor, projectId, { name: 'demo levels', csv: DEMO_LEVEL_UPLOAD }, { save: true }).list!;
	const lines = uploadLineList(editor, projectId, { name: 'demo lines', csv: DEMO_LINE_UPLOAD }, { save: true }).list!;
	levelListFromShelf(editor, projectId, { name: 'from notes', entryIds: [entryId] });
	const lv = getLevelList(editor, projectId, levels.id).rows;
	const ln = getLineList(editor, projectId, lines.id).rows;
	const at = (t: string) => lv.find((r) => r.energyText === t)!.id;
	// Line 6 (2257.340 Å air) and two odd J=1/J=2 uppers over 3P1: a blend, and one rejected pair (invented verdicts).
	const lineId = ln[5].id;
	judgeCandidate(editor, projectId, {
		lineId,
		lowerLevelId: at('118.9'),
		upperLevelId: at('44405.1'),
		type: 'E1',
		status: 'accepted',
		note: 'main'
	});
	judgeCandidate(editor, projectId, {
		lineId,
		lowerLevelId: at('118.9'),
		upperLevelId: at('44310.35'),
		type: 'E1',
		status: 'accepted',
		note: 'blend'
	});
	judgeCandidate(editor, projectId, {
		lineId,
		lowerLevelId: at('0'),
		upperLevelId: at('44310.35'),
		type: 'E1',
		status: 'rejected',
		note: 'far off'
	});
});

/** A list and its rows without the ids and dates that differ in the copy. */
const portable = <R extends { id: number }>(rows: R[]) => rows.map(({ id: _id, ...r }) => r);

describe('the saved lists in a backup', () => {
	it('export → import gives back every list, row and identification field by field', () => {
		const file = JSON.stringify(exportProject(owner, projectId));
		const copy = importProject(owner, file).projectId;
		// Lists saved in the same millisecond list in id order, and the copy has new ids: compare them by name.
		const byName = (r: ReturnType<typeof listLists>) => ({
			levelLists: [...r.levelLists].sort((a, b) => a.name.localeCompare(b.name)),
			lineLists: [...r.lineLists].sort((a, b) => a.name.localeCompare(b.name))
		});
		const before = byName(listLists(owner, projectId));
		const after = byName(listLists(owner, copy));
		const meta = (l: { name: string; source: string; rowCount: number; version: number; createdBy: string | null; createdAt: Date }) => ({
			name: l.name,
			source: l.source,
			rowCount: l.rowCount,
			version: l.version,
			createdBy: l.createdBy,
			createdAt: l.createdAt.toISOString()
		});
		expect(after.levelLists.map(meta)).toEqual(before.levelLists.map(meta));
		expect(after.lineLists.map(meta)).toEqual(before.lineLists.map(meta));
		for (const [i, l] of before.levelLists.entries())
			expect(portable(getLevelList(owner, copy, after.levelLists[i].id).rows)).toEqual(portable(getLevelList(owner, projectId, l.id).rows));
		for (const [i, l] of before.lineLists.entries())
			expect(portable(getLineList(owner, copy, after.lineLists[i].id).rows)).toEqual(portable(getLineList(owner, projectId, l.id).rows));
		// The Shelf list points at the restored entry, not the old one.
		const shelfList = after.levelLists.find((l) => l.source === 'shelf')!;
		expect(shelfList.sourceEntries).toHaveLength(1);
		expect(shelfList.sourceEntries[0]).not.toBe(entryId);

		// Identifications: the same verdicts on the same (line position, level energies), by the same person.
		const described = (project: string) => {
			const rowsOf = new Map<string, { lines: Map<number, number>; levels: Map<number, string> }>();
			return listIdentifications(owner, project, {}).map((v) => {
				if (!rowsOf.has(v.lineListId + v.levelListId))
					rowsOf.set(v.lineListId + v.levelListId, {
						lines: new Map(getLineList(owner, project, v.lineListId).rows.map((r) => [r.id, r.position])),
						levels: new Map(getLevelList(owner, project, v.levelListId).rows.map((r) => [r.id, r.energyText]))
					});
				const m = rowsOf.get(v.lineListId + v.levelListId)!;
				return {
					line: m.lines.get(v.lineId),
					upper: m.levels.get(v.upperLevelId),
					lower: m.levels.get(v.lowerLevelId),
					type: v.type,
					residual: v.residual,
					status: v.status,
					note: v.note,
					version: v.version,
					updatedBy: v.updatedBy,
					updatedAt: v.updatedAt.toISOString()
				};
			});
		};
		const original = described(projectId);
		expect(original).toHaveLength(3);
		expect(original.filter((v) => v.status === 'accepted')).toHaveLength(2);
		expect(described(copy)).toEqual(original);
	});

	it('a file whose identification points at a missing line is refused, and nothing is written', () => {
		const backup = exportProject(owner, projectId);
		const section = backup.sections.lineMatcher as { identifications: { line: number }[] };
		section.identifications[0].line = 987654;
		const projectsBefore = listLists(owner, projectId);
		expect(statusOf(() => importProject(owner, JSON.stringify(backup)))).toBe(400);
		expect(listLists(owner, projectId)).toEqual(projectsBefore);
	});
});
