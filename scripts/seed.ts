// Seeds the invented demo scenario (scripts/demo-data.ts). Safe to run twice: it stops
// when the demo owner already exists. Reset: delete data/termwright.db* and run again.
import { and, eq } from 'drizzle-orm';
import { db } from '../src/lib/server/db/index';
import { projects, users } from '../src/lib/server/db/schema';
import { signUp } from '../src/lib/server/services/users';
import { addMember, createProject } from '../src/lib/server/services/projects';
import { createEntry } from '../src/lib/server/services/shelf';
import { saveAnnotation } from '../src/lib/server/services/annotations';
import type { Actor } from '../src/lib/server/access';
import { DEMO_PASSWORD, demoGroupNotes, demoGroupProject, demoGroupShelf, demoNotes, demoProject, demoShelf, demoUsers } from './demo-data';
import { uploadLevelList, uploadLineList } from '../src/lib/server/services/lists';
import { DEMO_LEVEL_UPLOAD, DEMO_LINE_UPLOAD } from '../src/lib/lines/demo';

async function main() {
	if (db.select().from(users).where(eq(users.email, demoUsers[0].email)).get()) {
		console.log('Demo data is already there; nothing to do.');
	} else {
		const [owner, ...others] = demoUsers;
		const ownerActor = await signUp({ name: owner.name, email: owner.email, password: DEMO_PASSWORD });
		const actors = [ownerActor];
		for (const u of others) actors.push(await signUp({ name: u.name, email: u.email, password: DEMO_PASSWORD }));
		const project = createProject(ownerActor, demoProject);
		for (const u of others) addMember(ownerActor, project.id, { email: u.email, role: u.role });
		const entries = demoShelf.map((entry) => createEntry(ownerActor, project.id, entry));
		// The review rule: a note starts as proposed; someone other than its proposer (owner ↔ editor) confirms it.
		for (const { entry, by, status, ...note } of demoNotes) {
			const saved = saveAnnotation(actors[by], project.id, entries[entry].id, {
				...note,
				status: status === 'confirmed' ? 'proposed' : status
			});
			if (status === 'confirmed')
				saveAnnotation(actors[by === 0 ? 1 : 0], project.id, entries[entry].id, { ...note, status, version: saved.version });
		}
		// The Line matcher's invented lists (src/lib/lines/demo.ts), uploaded by the editor as a user would.
		const editor = actors[demoUsers.findIndex((u) => u.role === 'editor')] ?? ownerActor;
		uploadLevelList(editor, project.id, { name: 'Invented ion — observed levels', csv: DEMO_LEVEL_UPLOAD }, { save: true });
		uploadLineList(editor, project.id, { name: 'Invented ion — line list', csv: DEMO_LINE_UPLOAD }, { save: true });
		console.log(`Seeded the demo project "${project.name}" with ${demoShelf.length} Shelf entries, a level list and a line list.`);
	}
	seedGroupProject();
	console.log('Demo accounts (password for all: ' + DEMO_PASSWORD + '):');
	for (const u of demoUsers) console.log(`  ${u.email.padEnd(26)} project ${u.role}${u === demoUsers[0] ? ', site admin' : ''}`);
	console.log(`  (second project "${demoGroupProject.name}": owned by ${demoUsers[demoGroupProject.owner].name}, the others edit)`);
}

/**
 * The second demo project (a student group's library), so entries can be copied and moved between
 * projects. Added to a demo database seeded before it existed, too; skipped when already there.
 */
function seedGroupProject() {
	const people = demoUsers.map((u) => db.select().from(users).where(eq(users.email, u.email)).get());
	if (people.some((p) => !p)) return;
	const actors = people as Actor[];
	const owner = actors[demoGroupProject.owner];
	if (
		db
			.select()
			.from(projects)
			.where(and(eq(projects.name, demoGroupProject.name), eq(projects.createdBy, owner.id)))
			.get()
	)
		return;
	const project = createProject(owner, { name: demoGroupProject.name, description: demoGroupProject.description });
	for (const m of demoGroupProject.members) addMember(owner, project.id, { email: demoUsers[m.user].email, role: m.role });
	const entries = demoGroupShelf.map((entry) => createEntry(owner, project.id, entry));
	for (const { entry, by, status, ...note } of demoGroupNotes) {
		const saved = saveAnnotation(actors[by], project.id, entries[entry].id, {
			...note,
			status: status === 'confirmed' ? 'proposed' : status
		});
		// Confirmed by someone other than the proposer (the review rule): Imre, who edits here.
		if (status === 'confirmed')
			saveAnnotation(actors[by === 0 ? 1 : 0], project.id, entries[entry].id, { ...note, status, version: saved.version });
	}
	console.log(`Seeded the demo project "${project.name}" with ${demoGroupShelf.length} Shelf entries.`);
}

main().catch((e) => {
	console.error(e);
	process.exit(1);
});
