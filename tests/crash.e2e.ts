import Database from 'better-sqlite3';
import { spawn, type ChildProcess } from 'node:child_process';
import { rmSync } from 'node:fs';
import { expect, test } from './helpers';

/**
 * Crash safety: the built server on a scratch database gets a burst of writes (projects, Shelf
 * entries, level notes) through the API and is killed with SIGKILL in the middle of it. After a
 * restart the database must pass `PRAGMA integrity_check` and `foreign_key_check`, every write
 * the server acknowledged must be there, and nothing may be half-written: every project has its
 * owner, every entry holds exactly the fields sent, every note belongs to an entry and holds
 * exactly what was sent. (SQLite's WAL promises atomic commits across a process crash; this
 * checks that the app keeps each multi-row write in one transaction.)
 */
const E2E_PORT = Number(process.env.E2E_PORT ?? 4173);
const PORT = Number(process.env.CRASH_PORT ?? E2E_PORT + 1);
const ORIGIN = `http://localhost:${PORT}`;
const DB = `data/crash-${PORT}.db`;

function startServer(): ChildProcess {
	return spawn(process.execPath, ['scripts/start.js'], {
		env: { ...process.env, PORT: String(PORT), ORIGIN, DATABASE_PATH: DB, COOKIE_SECURE: 'false' },
		stdio: ['ignore', 'ignore', 'inherit']
	});
}

async function waitUntilUp(): Promise<void> {
	for (let i = 0; i < 200; i++) {
		try {
			if ((await fetch(`${ORIGIN}/api/v1`)).ok) return;
		} catch {
			// not listening yet
		}
		await new Promise((r) => setTimeout(r, 50));
	}
	throw new Error(`server on ${ORIGIN} did not start`);
}

const exited = (p: ChildProcess) =>
	new Promise<void>((resolve) => (p.exitCode !== null || p.signalCode !== null ? resolve() : p.once('exit', () => resolve())));

/** Signs up through the form action and returns the session cookie. */
async function signUpCookie(): Promise<string> {
	const res = await fetch(`${ORIGIN}/signup`, {
		method: 'POST',
		redirect: 'manual',
		headers: { origin: ORIGIN, accept: 'text/html', 'content-type': 'application/x-www-form-urlencoded' },
		body: new URLSearchParams({ name: 'Crash Tester', email: 'crash@e2e.example', password: 'crash-password-1' })
	});
	const cookie = res.headers.get('set-cookie')?.split(';')[0];
	if (res.status !== 303 || !cookie) throw new Error(`sign-up failed: ${res.status}`);
	return cookie;
}

interface SentEntry {
	title: string;
	notes: string;
	tags: string[];
	id?: string;
	notesSent: { levelKey: string; comment: string; acked: boolean }[];
}

// The five levels of 2p2 (³P₀,₁,₂ ¹D₂ ¹S₀; Condon & Shortley 1935, terms of p²) in our level-key form.
const LEVELS = ['3P#1|0', '3P#1|1', '3P#1|2', '1D#1|2', '1S#1|0'];

test('SIGKILL in the middle of a write burst leaves a sound database with nothing half-written', async () => {
	test.setTimeout(30_000);
	rmSync(DB, { force: true });
	rmSync(`${DB}-wal`, { force: true });
	rmSync(`${DB}-shm`, { force: true });
	let server = startServer();
	try {
		await burstKillAndCheck(
			() => server,
			(s) => (server = s)
		);
	} finally {
		if (server.exitCode === null && server.signalCode === null) server.kill('SIGKILL');
	}
});

async function burstKillAndCheck(current: () => ChildProcess, replace: (s: ChildProcess) => void) {
	let server = current();
	await waitUntilUp();
	const cookie = await signUpCookie();
	const headers = { cookie, origin: ORIGIN, 'content-type': 'application/json' };
	const post = (path: string, body: unknown, method = 'POST') => fetch(`${ORIGIN}${path}`, { method, headers, body: JSON.stringify(body) });

	const projectRes = await post('/api/v1/projects', { name: 'Crash nebula' });
	const projectId = (await projectRes.json()).project.id as string;

	const entries: SentEntry[] = [];
	const projectsSent: { name: string; acked: boolean }[] = [];
	let stop = false;
	// Two writers: one adds Shelf entries with their notes, one creates projects (project + owner in one transaction).
	const entryWriter = async (w: number) => {
		for (let i = 0; !stop; i++) {
			const entry: SentEntry = {
				title: `Entry ${w}-${i}`,
				notes: `notes of ${w}-${i} `.repeat(200),
				tags: ['crash', `w${w}`],
				notesSent: []
			};
			entries.push(entry);
			try {
				const res = await post(`/api/v1/projects/${projectId}/shelf`, {
					title: entry.title,
					notation: '1s2 2s2 2p2',
					notes: entry.notes,
					tags: entry.tags
				});
				if (res.status !== 201) throw new Error(`entry ${res.status}`);
				entry.id = (await res.json()).entry.id;
				for (const levelKey of LEVELS) {
					const note = { levelKey, comment: `note ${levelKey} of ${entry.title} `.repeat(20), acked: false };
					entry.notesSent.push(note);
					const r = await post(
						`/api/v1/projects/${projectId}/shelf/${entry.id}/annotations`,
						{ levelKey, observedEnergy: 100 + i, status: 'proposed', comment: note.comment },
						'PUT'
					);
					if (r.status !== 200) throw new Error(`note ${r.status}`);
					note.acked = true;
				}
			} catch {
				return; // the server is gone
			}
		}
	};
	const projectWriter = async () => {
		for (let i = 0; !stop; i++) {
			const sent = { name: `Burst project ${i}`, acked: false };
			projectsSent.push(sent);
			try {
				const res = await post('/api/v1/projects', { name: sent.name });
				if (res.status !== 201) throw new Error(`project ${res.status}`);
				sent.acked = true;
			} catch {
				return;
			}
		}
	};
	const writers = [entryWriter(1), entryWriter(2), entryWriter(3), projectWriter()];
	await new Promise((r) => setTimeout(r, 1500));
	server.kill('SIGKILL');
	stop = true;
	await exited(server);
	await Promise.all(writers);
	const acked = entries.filter((e) => e.id).length;
	expect(acked, 'the burst wrote something before the kill').toBeGreaterThan(3);

	// Restart on the same file: it opens (WAL recovery, migrations) and answers.
	server = startServer();
	replace(server);
	await waitUntilUp();
	const list = await fetch(`${ORIGIN}/api/v1/projects/${projectId}/shelf`, { headers: { cookie } });
	expect(list.status).toBe(200);
	server.kill('SIGTERM');
	await exited(server);

	const db = new Database(DB, { readonly: true });
	try {
		expect(db.pragma('integrity_check', { simple: true })).toBe('ok');
		expect(db.pragma('foreign_key_check')).toEqual([]);

		// Every project has its owner: the project row and the membership were one transaction.
		const orphans = db
			.prepare(
				`select p.name from projects p where not exists (select 1 from memberships m where m.project_id = p.id and m.role = 'owner')`
			)
			.all();
		expect(orphans).toEqual([]);
		const projectNames = new Set((db.prepare('select name from projects').all() as { name: string }[]).map((r) => r.name));
		for (const p of projectsSent.filter((p) => p.acked)) expect(projectNames.has(p.name), `acknowledged project ${p.name}`).toBe(true);

		// Entries: acknowledged ones are there; whatever is there holds exactly what was sent.
		const rows = db.prepare('select id, title, notes, tags from shelf_entries where project_id = ?').all(projectId) as {
			id: string;
			title: string;
			notes: string;
			tags: string;
		}[];
		const byTitle = new Map(rows.map((r) => [r.title, r]));
		for (const sent of entries) {
			const row = byTitle.get(sent.title);
			if (sent.id) expect(row?.id, `acknowledged entry ${sent.title}`).toBe(sent.id);
			if (!row) continue;
			expect(row.notes).toBe(sent.notes);
			expect(JSON.parse(row.tags)).toEqual(sent.tags);
			const notes = db.prepare('select level_key, comment, observed_energy from level_annotations where entry_id = ?').all(row.id) as {
				level_key: string;
				comment: string;
				observed_energy: number;
			}[];
			const sentByKey = new Map(sent.notesSent.map((n) => [n.levelKey, n]));
			for (const n of notes) {
				const s = sentByKey.get(n.level_key);
				expect(s, `note ${n.level_key} of ${sent.title} was sent`).toBeDefined();
				expect(n.comment).toBe(s!.comment);
			}
			for (const s of sent.notesSent.filter((n) => n.acked))
				expect(
					notes.some((n) => n.level_key === s.levelKey),
					`acknowledged note ${s.levelKey}`
				).toBe(true);
		}
		// Notes belong to entries that exist (also covered by foreign_key_check).
		expect(db.prepare('select count(*) as n from level_annotations where entry_id not in (select id from shelf_entries)').get()).toEqual({
			n: 0
		});
		console.log(
			`crash test: ${acked} entries and ${entries.reduce((n, e) => n + e.notesSent.filter((s) => s.acked).length, 0)} notes acknowledged, ` +
				`${rows.length} entries on disk, ${projectsSent.filter((p) => p.acked).length} burst projects acknowledged; integrity ok`
		);
	} finally {
		db.close();
		for (const f of [DB, `${DB}-wal`, `${DB}-shm`]) rmSync(f, { force: true });
	}
}
