// Seeds the invented demo scenario (scripts/demo-data.ts). Safe to run twice: it stops
// when the demo owner already exists. Reset: delete data/termwright.db* and run again.
import { eq } from 'drizzle-orm';
import { db } from '../src/lib/server/db/index';
import { users } from '../src/lib/server/db/schema';
import { signUp } from '../src/lib/server/services/users';
import { addMember, createProject } from '../src/lib/server/services/projects';
import { createEntry } from '../src/lib/server/services/shelf';
import { saveAnnotation } from '../src/lib/server/services/annotations';
import { DEMO_PASSWORD, demoNotes, demoProject, demoShelf, demoUsers } from './demo-data';
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
	console.log('Demo accounts (password for all: ' + DEMO_PASSWORD + '):');
	for (const u of demoUsers) console.log(`  ${u.email.padEnd(26)} project ${u.role}${u === demoUsers[0] ? ', site admin' : ''}`);
}

main().catch((e) => {
	console.error(e);
	process.exit(1);
});
