/**
 * Duplicating, copying and moving a Shelf entry with its level notes (services/shelf-transfer.ts),
 * and the in-place tag edit's version check (the entry page's ?/tags action). The rules checked are
 * the product's own (common practice, no source): roles are checked before anything is read or
 * written; a copy's notes carry their history and a confirmed note arrives as proposed (no note is
 * created as confirmed); a move keeps the same records; each change writes an activity row in every
 * project concerned, in one transaction with the change, so a failure leaves nothing behind.
 * Level keys are the 2p² levels ³P₀,₁,₂ (Condon & Shortley 1935 ch. VII: 2p² gives ³P ¹D ¹S).
 */
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { refusal } from './status-of';
import { and, asc, eq, sql } from 'drizzle-orm';
import { isActionFailure } from '@sveltejs/kit';
import type { Actor } from './access';
import { db, sqlite } from './db';
import { activityLog, levelAnnotationHistory, levelAnnotations } from './db/schema';
import { signUp } from './services/users';
import { addMember, createProject } from './services/projects';
import { createEntry, deleteEntry, getEntry, updateEntry } from './services/shelf';
import { deleteAnnotationById, saveAnnotation } from './services/annotations';
import { copyEntry, duplicateEntry, editableProjects, moveEntry } from './services/shelf-transfer';
import { actions } from '../../routes/(app)/projects/[projectId]/shelf/[entryId]/+page.server';

let ada: Actor, eli: Actor, vic: Actor, sam: Actor;
/** home: ada owner, eli editor, vic viewer. group: ada owner, eli editor, vic viewer. vicLab: vic owner. */
let home: string, group: string, vicLab: string, strangers: string;

beforeAll(async () => {
	const make = (name: string) => signUp({ name, email: `${name.toLowerCase()}@transfer.example`, password: 'long-enough-pw' });
	ada = await make('Ada');
	eli = await make('Eli');
	vic = await make('Vic');
	sam = await make('Sam');
	home = createProject(ada, { name: 'Home library' }).id;
	group = createProject(ada, { name: 'Group library' }).id;
	for (const p of [home, group]) {
		addMember(ada, p, { email: 'eli@transfer.example', role: 'editor' });
		addMember(ada, p, { email: 'vic@transfer.example', role: 'viewer' });
	}
	vicLab = createProject(vic, { name: 'Vic lab' }).id;
	strangers = createProject(sam, { name: 'Sam only' }).id;
});

/** An entry in `home` with three notes: ³P₂ proposed by Ada and confirmed by Eli, ³P₁ disputed, ³P₀ deleted. */
function entryWithNotes(title = 'Carbon-like ground') {
	const entry = createEntry(ada, home, { title, species: 'C I', notation: '1s2 2s2 2p2', tags: ['nebula'] });
	const p2 = saveAnnotation(ada, home, entry.id, { levelKey: '3P#1|2', observedEnergy: '43.4', uncertainty: '0.1', status: 'proposed' });
	saveAnnotation(eli, home, entry.id, {
		levelKey: '3P#1|2',
		observedEnergy: '43.4',
		uncertainty: '0.1',
		status: 'confirmed',
		version: p2.version
	});
	saveAnnotation(ada, home, entry.id, { levelKey: '3P#1|1', observedEnergy: '16.4', status: 'disputed', comment: 'blend?' });
	const p0 = saveAnnotation(ada, home, entry.id, { levelKey: '3P#1|0', observedEnergy: '0', status: 'proposed' });
	deleteAnnotationById(ada, home, entry.id, p0.id);
	return entry;
}

const notesOf = (entryId: string) =>
	db.select().from(levelAnnotations).where(eq(levelAnnotations.entryId, entryId)).orderBy(asc(levelAnnotations.levelKey)).all();
const historyOf = (annotationId: string) =>
	db
		.select()
		.from(levelAnnotationHistory)
		.where(eq(levelAnnotationHistory.annotationId, annotationId))
		.orderBy(asc(levelAnnotationHistory.id))
		.all();
const activityIn = (projectId: string) =>
	db.select().from(activityLog).where(eq(activityLog.projectId, projectId)).orderBy(asc(activityLog.id)).all();
const lastActivity = (projectId: string) => activityIn(projectId).at(-1)!;

/** Every row count that a transfer could change, per table and project. */
function snapshot() {
	const count = (table: string) => (sqlite.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;
	const perProject = sqlite
		.prepare(`select project_id as p, count(*) as n from shelf_entries group by project_id order by project_id`)
		.all();
	return {
		entries: count('shelf_entries'),
		notes: count('level_annotations'),
		history: count('level_annotation_history'),
		activity: count('activity_log'),
		perProject,
		versions: sqlite.prepare(`select id, project_id, version from shelf_entries order by id`).all()
	};
}

afterEach(() => {
	sqlite.exec('drop trigger if exists fail_activity');
});

describe('duplicate an entry in its project', () => {
	it('copies the entry and its present notes with their history; a confirmed note arrives as proposed', () => {
		const source = entryWithNotes();
		const before = notesOf(source.id);
		const { entry, notes } = duplicateEntry(eli, home, source.id);
		expect(entry.projectId).toBe(home);
		expect(entry.title).toBe('Carbon-like ground (copy)');
		expect([entry.notation, entry.species, entry.tags]).toEqual(['1s2 2s2 2p2', 'C I', ['nebula']]);
		expect(notes).toBe(2); // the deleted ³P₀ note is not a present note

		const copied = notesOf(entry.id);
		expect(copied.map((n) => [n.levelKey, n.status, n.observedEnergyText, n.comment])).toEqual([
			['3P#1|1', 'disputed', '16.4', 'blend?'],
			['3P#1|2', 'proposed', '43.4', '']
		]);
		// The values are still Ada's proposal, so Eli (not Ada) may confirm the copy.
		expect(copied.every((n) => n.proposedBy === ada.id)).toBe(true);
		const p2 = copied.find((n) => n.levelKey === '3P#1|2')!;
		const original = before.find((n) => n.levelKey === '3P#1|2')!;
		expect(p2.id).not.toBe(original.id);
		expect(historyOf(p2.id).map((h) => [h.change, h.status, h.projectId, h.entryId])).toEqual([
			['created', 'proposed', home, entry.id],
			['confirmed', 'confirmed', home, entry.id],
			['copied', 'proposed', home, entry.id]
		]);
		expect(historyOf(p2.id).at(-1)!.version).toBe(p2.version);
		// The original is untouched.
		expect(notesOf(source.id)).toEqual(before);
		const log = lastActivity(home);
		expect([log.kind, log.actorId, log.subject]).toEqual(['entry.copied', eli.id, `entry:${entry.id}`]);
		expect(log.summary).toBe('duplicated “Carbon-like ground” (1s2 2s2 2p2) with 2 level notes');
	});

	it('is refused to a viewer (403) and a non-member (404), and nothing changes', () => {
		const source = entryWithNotes();
		const before = snapshot();
		expect(refusal(() => duplicateEntry(vic, home, source.id)).status).toBe(403);
		expect(refusal(() => duplicateEntry(sam, home, source.id)).status).toBe(404);
		expect(snapshot()).toEqual(before);
	});
});

describe('copy an entry to another project', () => {
	it('writes the entry, its notes and their history in the target, with an activity row in both projects', () => {
		const source = entryWithNotes('Copied out');
		const { entry, notes } = copyEntry(eli, home, source.id, { projectId: group });
		expect([entry.projectId, entry.title, notes]).toEqual([group, 'Copied out', 2]);
		expect(getEntry(eli, group, entry.id).notation).toBe('1s2 2s2 2p2');
		const copied = notesOf(entry.id);
		expect(copied.map((n) => n.status)).toEqual(['disputed', 'proposed']);
		for (const n of copied) expect(historyOf(n.id).every((h) => h.projectId === group && h.entryId === entry.id)).toBe(true);
		expect(historyOf(copied[1].id).map((h) => h.change)).toEqual(['created', 'confirmed', 'copied']);
		expect(lastActivity(home)).toMatchObject({
			kind: 'entry.copied',
			subject: `entry:${source.id}`,
			summary: 'copied “Copied out” (1s2 2s2 2p2) with 2 level notes to the project “Group library”'
		});
		expect(lastActivity(group)).toMatchObject({
			kind: 'entry.copied',
			subject: `entry:${entry.id}`,
			summary: 'copied “Copied out” (1s2 2s2 2p2) with 2 level notes here from the project “Home library”'
		});
		// The source keeps its entry and notes.
		expect(notesOf(source.id).map((n) => n.status)).toEqual(['disputed', 'confirmed']);
	});

	it('lets a viewer of the source copy to a project they edit', () => {
		const source = entryWithNotes('For Vic');
		const { entry } = copyEntry(vic, home, source.id, { projectId: vicLab });
		expect(entry.projectId).toBe(vicLab);
		expect(lastActivity(home).actorId).toBe(vic.id);
	});

	it('refuses a target the person cannot edit, a project they are not in, and the same project, changing nothing', () => {
		const source = entryWithNotes();
		const before = snapshot();
		const asViewer = refusal(() => copyEntry(vic, home, source.id, { projectId: group }));
		expect(asViewer.status).toBe(403);
		expect(asViewer.message).toMatch(/viewer/);
		expect(refusal(() => copyEntry(eli, home, source.id, { projectId: strangers })).status).toBe(404);
		expect(refusal(() => copyEntry(sam, home, source.id, { projectId: strangers })).status).toBe(404);
		const same = refusal(() => copyEntry(eli, home, source.id, { projectId: home }));
		expect(same.status).toBe(400);
		expect(same.message).toMatch(/Duplicate/);
		expect(refusal(() => copyEntry(eli, home, source.id, {})).status).toBe(400);
		expect(snapshot()).toEqual(before);
	});

	it('rolls back entirely when a write fails midway (the target log refuses its row)', () => {
		const source = entryWithNotes('Rolled back');
		const before = snapshot();
		sqlite.exec(`create temp trigger fail_activity before insert on activity_log when new.project_id = '${group}'
			begin select raise(abort, 'refused by the test'); end`);
		expect(() => copyEntry(eli, home, source.id, { projectId: group })).toThrow(/refused by the test/);
		expect(snapshot()).toEqual(before);
	});
});

describe('move an entry to another project', () => {
	it('keeps the same entry, notes, statuses and all history (deleted notes included), now in the target', () => {
		const source = entryWithNotes('Moving');
		const notesBefore = notesOf(source.id);
		const historyRows = db.select().from(levelAnnotationHistory).where(eq(levelAnnotationHistory.entryId, source.id)).all().length;
		const { entry, notes } = moveEntry(eli, home, source.id, { projectId: group });
		expect([entry.id, entry.projectId, entry.version, notes]).toEqual([source.id, group, source.version + 1, 2]);
		expect(refusal(() => getEntry(eli, home, source.id)).status).toBe(404);
		const after = notesOf(source.id);
		expect(after.map((n) => [n.id, n.status, n.version])).toEqual(notesBefore.map((n) => [n.id, n.status, n.version]));
		const history = db.select().from(levelAnnotationHistory).where(eq(levelAnnotationHistory.entryId, source.id)).all();
		expect(history.length).toBe(historyRows + 2); // one 'moved' row per present note
		expect(history.every((h) => h.projectId === group)).toBe(true);
		expect(history.filter((h) => h.change === 'deleted').map((h) => h.levelKey)).toEqual(['3P#1|0']);
		expect(lastActivity(home)).toMatchObject({ kind: 'entry.moved', summary: expect.stringContaining('to the project “Group library”') });
		expect(lastActivity(group)).toMatchObject({
			kind: 'entry.moved',
			summary: expect.stringContaining('here from the project “Home library”')
		});
	});

	it('needs an editor of both projects: a viewer of the source is refused (403), nothing changes', () => {
		const source = entryWithNotes();
		const before = snapshot();
		expect(refusal(() => moveEntry(vic, home, source.id, { projectId: vicLab })).status).toBe(403);
		expect(refusal(() => moveEntry(eli, home, source.id, { projectId: vicLab })).status).toBe(404);
		expect(snapshot()).toEqual(before);
	});

	it('rolls back entirely when a write fails midway', () => {
		const source = entryWithNotes('Not moved');
		const before = snapshot();
		sqlite.exec(`create temp trigger fail_activity before insert on activity_log when new.project_id = '${group}'
			begin select raise(abort, 'refused by the test'); end`);
		expect(() => moveEntry(eli, home, source.id, { projectId: group })).toThrow(/refused by the test/);
		expect(snapshot()).toEqual(before);
		expect(getEntry(eli, home, source.id).title).toBe('Not moved');
		expect(
			db
				.select({ n: sql<number>`count(*)` })
				.from(levelAnnotationHistory)
				.where(and(eq(levelAnnotationHistory.entryId, source.id), eq(levelAnnotationHistory.projectId, group)))
				.get()!.n
		).toBe(0);
	});

	it('offers as targets only other projects the person edits', () => {
		expect(editableProjects(eli, home).map((p) => p.name)).toEqual(['Group library']);
		expect(editableProjects(vic, home).map((p) => p.name)).toEqual(['Vic lab']);
		expect(editableProjects(vic, vicLab)).toEqual([]);
	});
});

describe('tags edited in place (the ?/tags action: the Shelf PATCH of the tags alone)', () => {
	type TagsEvent = Parameters<typeof actions.tags>[0];
	function tagsEvent(actor: Actor, entryId: string, fields: Record<string, string>): TagsEvent {
		const url = new URL(`http://localhost/projects/${home}/shelf/${entryId}?/tags`);
		return {
			url,
			params: { projectId: home, entryId },
			request: new Request(url, {
				method: 'POST',
				headers: { 'content-type': 'application/x-www-form-urlencoded' },
				body: new URLSearchParams(fields).toString()
			}),
			locals: { user: actor, session: null }
		} as unknown as TagsEvent;
	}

	it('saves the tags only, with an activity row', async () => {
		const e = createEntry(ada, home, { title: 'Tagged', notation: '2p2', notes: 'keep me', tags: ['old'] });
		const out = await actions.tags(tagsEvent(eli, e.id, { tags: 'nebula, forbidden lines', version: String(e.version) }));
		expect(out).toEqual({ form: 'tags', tags: ['nebula', 'forbidden lines'], version: e.version + 1 });
		const now = getEntry(eli, home, e.id);
		expect([now.tags, now.notes, now.title]).toEqual([['nebula', 'forbidden lines'], 'keep me', 'Tagged']);
		expect(lastActivity(home)).toMatchObject({ kind: 'entry.updated', summary: 'changed the tags of “Tagged”', actorId: eli.id });
	});

	it('refuses a stale version with a clear message, keeps what was typed and shows the tags as they are now', async () => {
		const e = createEntry(ada, home, { title: 'Contested', notation: '2p2', tags: ['a'] });
		updateEntry(ada, home, e.id, { tags: ['b'], version: e.version });
		const before = snapshot();
		const out = await actions.tags(tagsEvent(eli, e.id, { tags: 'mine, typed', version: String(e.version) }));
		expect(isActionFailure(out)).toBe(true);
		const failure = out as { status: number; data: Record<string, unknown> };
		expect(failure.status).toBe(409);
		expect(failure.data.message).toMatch(/changed by Ada since you opened it .*reload/);
		expect(failure.data).toMatchObject({ typed: 'mine, typed', currentTags: ['b'], currentVersion: e.version + 1 });
		expect(snapshot()).toEqual(before);
		expect(getEntry(eli, home, e.id).tags).toEqual(['b']);
	});

	it('is refused to a viewer (403), nothing changes', async () => {
		const e = createEntry(ada, home, { title: 'Read only', notation: '2p2', tags: ['a'] });
		const before = snapshot();
		const out = await actions.tags(tagsEvent(vic, e.id, { tags: 'viewer was here', version: String(e.version) }));
		expect((out as { status: number }).status).toBe(403);
		expect(snapshot()).toEqual(before);
		deleteEntry(ada, home, e.id);
	});
});
