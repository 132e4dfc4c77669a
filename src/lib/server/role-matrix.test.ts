/**
 * The role matrix: every page, form action and /api/v1 route found in src/routes, called as
 * every kind of actor, with the outcome the product's rules (DEVELOPERS.md, access.ts) expect:
 * anonymous callers are sent to sign-in (pages) or get 401 (API); non-members — the site admin
 * included — get 404 for a project; a role below the one needed gets 403; API tokens act with
 * their owner's role on the API and count for nothing on pages and form actions.
 *
 * Routes are DISCOVERED (import.meta.glob over src/routes), so a new route cannot be missed: it
 * fails here until its expected access is written down — pages and form actions in `PAGE_ACCESS`
 * below, API routes in the `access` column of src/lib/api/routes.ts (the API's one route table).
 * Each call runs the real load/action/handler against a fresh project on the test's in-memory
 * database. The expected outcomes are the product's own rules (common practice, no source).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { isActionFailure, isHttpError, isRedirect, type RequestEvent } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { API_ROUTES, type RouteAccess } from '$lib/api/routes';
import type { Actor } from './access';
import { db } from './db';
import {
	apiTokens,
	fitReports,
	invitations,
	levelAnnotationHistory,
	levelAnnotations,
	memberships,
	parameterSets,
	projects,
	shelfEntries,
	users
} from './db/schema';
import { levelListRows, levelLists, lineListRows, lineLists } from './db/schema';
import { newId } from './ids';
import { newSecret } from './secret-tokens';
import { catchMailInTests } from './catch-mail';
import type { MailCatcher } from './mail-catcher';
import { signUp } from './services/users';
import { createToken } from './services/tokens';

// ------------------------------------------------------------------ the one table (pages and actions)

/** Who may use a page or form action. 'public': anyone, signed in or not (the page may still differ). */
type PageAccess = 'public' | 'signed-in' | 'viewer' | 'editor' | 'owner' | 'admin';

/**
 * Expected access of every page (key "PAGE /path") and form action (key "ACTION /path ?/name",
 * "default" for a form without a name). Paths are route ids without (groups), [param] as :param.
 * A page's access is the strictest of its own load and its layouts' loads.
 */
const PAGE_ACCESS: Record<string, PageAccess> = {
	'PAGE /': 'public',
	'PAGE /builder': 'public',
	'PAGE /basis': 'public',
	'PAGE /transitions': 'public',
	'PAGE /matcher': 'public',
	'PAGE /signin': 'public',
	'ACTION /signin ?/default': 'public',
	'PAGE /signup': 'public',
	'ACTION /signup ?/default': 'public',
	'PAGE /forgot': 'public',
	'ACTION /forgot ?/default': 'public',
	'PAGE /reset/:token': 'public',
	'ACTION /reset/:token ?/default': 'public',
	'PAGE /invite/:token': 'public',
	'ACTION /invite/:token ?/accept': 'signed-in',
	'ACTION /invite/:token ?/signup': 'public',
	'PAGE /signout': 'public',
	'ACTION /signout ?/default': 'public',
	'PAGE /account': 'signed-in',
	'ACTION /account ?/create': 'signed-in',
	'ACTION /account ?/revoke': 'signed-in',
	'ACTION /account ?/password': 'signed-in',
	'ACTION /account ?/everywhere': 'signed-in',
	'PAGE /admin/users': 'admin',
	'ACTION /admin/users ?/role': 'admin',
	'PAGE /admin/outbox': 'admin',
	'PAGE /projects': 'signed-in',
	'ACTION /projects ?/create': 'signed-in',
	'ACTION /projects ?/restore': 'signed-in',
	'PAGE /projects/:projectId': 'viewer',
	'ACTION /projects/:projectId ?/rename': 'owner',
	'ACTION /projects/:projectId ?/delete': 'owner',
	'PAGE /projects/:projectId/members': 'viewer',
	'PAGE /projects/:projectId/activity': 'viewer',
	'ACTION /projects/:projectId/members ?/add': 'owner',
	'ACTION /projects/:projectId/members ?/resend': 'owner',
	'ACTION /projects/:projectId/members ?/revoke': 'owner',
	'ACTION /projects/:projectId/members ?/role': 'owner',
	'ACTION /projects/:projectId/members ?/remove': 'owner',
	'ACTION /projects/:projectId/members ?/leave': 'viewer',
	'PAGE /projects/:projectId/shelf': 'viewer',
	'PAGE /projects/:projectId/shelf/new': 'editor',
	'ACTION /projects/:projectId/shelf/new ?/default': 'editor',
	'PAGE /projects/:projectId/shelf/:entryId': 'viewer',
	'ACTION /projects/:projectId/shelf/:entryId ?/update': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/annotate': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/pastePreview': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/paste': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/deleteNote': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/reattach': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/delete': 'editor',
	// library (issue 13, item 5)
	'ACTION /projects/:projectId/shelf/:entryId ?/tags': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/duplicate': 'editor',
	// Copying out only reads the source: its viewers may copy to a project they edit (shelf-transfer.ts).
	'ACTION /projects/:projectId/shelf/:entryId ?/copy': 'viewer',
	'ACTION /projects/:projectId/shelf/:entryId ?/move': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/editSet': 'editor',
	'ACTION /projects/:projectId/shelf/:entryId ?/deleteSet': 'editor',
	'PAGE /projects/:projectId/lists': 'viewer',
	'ACTION /projects/:projectId/lists ?/preview': 'editor',
	'ACTION /projects/:projectId/lists ?/save': 'editor',
	'ACTION /projects/:projectId/lists ?/fromShelf': 'editor',
	'ACTION /projects/:projectId/lists ?/delete': 'editor',
	'PAGE /projects/:projectId/matcher': 'viewer',
	'ACTION /projects/:projectId/matcher ?/judge': 'editor'
};

// ------------------------------------------------------------------ actors

const PASSWORD = 'matrix-password-1';
const ACTORS = [
	'anonymous',
	'non-member',
	'viewer',
	'editor',
	'owner',
	'site admin',
	'token:viewer',
	'token:editor',
	'token:owner'
] as const;
type ActorName = (typeof ACTORS)[number];
type Outcome = 'allowed' | 'sign-in' | '403' | '404';

const RANK = { viewer: 1, editor: 2, owner: 3 } as const;

/** The rule: what `actor` gets from a route that needs `access`, on a page (`api` false) or the API. */
function expectedOutcome(access: PageAccess | RouteAccess, actor: ActorName, api: boolean): Outcome {
	if (access === 'public') return 'allowed';
	const token = actor.startsWith('token:');
	// Tokens are for the API only; on pages and form actions they are nobody.
	if (actor === 'anonymous' || (token && !api)) return 'sign-in';
	if (access === 'signed-in') return 'allowed';
	if (access === 'admin') return actor === 'site admin' ? 'allowed' : '403';
	const role = (token ? actor.slice('token:'.length) : actor) as keyof typeof RANK | 'non-member' | 'site admin';
	if (role === 'non-member' || role === 'site admin') return '404';
	return RANK[role] >= RANK[access] ? 'allowed' : '403';
}

let people: Record<'admin' | 'owner' | 'coOwner' | 'editor' | 'viewer' | 'stranger' | 'signinUser', Actor>;
const tokens: Record<string, string> = {};
let originalHashes: Map<string, string>;

async function makeTokens() {
	for (const role of ['viewer', 'editor', 'owner'] as const) {
		db.delete(apiTokens).where(eq(apiTokens.userId, people[role].id)).run();
		tokens[role] = createToken(people[role], `matrix ${role}`).secret;
	}
}

// Mail (reset links, invitations) goes over SMTP to a local catcher, as in the app.
let catcher: MailCatcher;
beforeAll(async () => {
	catcher = await catchMailInTests();
});
afterAll(() => catcher.close());

beforeAll(async () => {
	// The first account on a site is its admin (users.ts); it is a member of no project here.
	const admin = await signUp({ name: 'Site Admin', email: 'admin@matrix.example', password: PASSWORD });
	const make = (who: string) => signUp({ name: who, email: `${who}@matrix.example`, password: PASSWORD });
	people = {
		admin,
		owner: await make('owner'),
		coOwner: await make('coowner'),
		editor: await make('editor'),
		viewer: await make('viewer'),
		stranger: await make('stranger'),
		signinUser: await make('signin')
	};
	await makeTokens();
	originalHashes = new Map(
		db
			.select({ id: users.id, h: users.passwordHash })
			.from(users)
			.all()
			.map((r) => [r.id, r.h])
	);
});

/** A fresh project per call: owner + co-owner, editor, viewer; one Shelf entry (2p2) with one note. */
function freshProject() {
	const projectId = newId();
	const entryId = newId();
	const annotationId = newId();
	db.transaction((tx) => {
		tx.insert(projects).values({ id: projectId, name: 'Matrix nebula', createdBy: people.owner.id }).run();
		for (const [who, role] of [
			['owner', 'owner'],
			['coOwner', 'owner'],
			['editor', 'editor'],
			['viewer', 'viewer']
		] as const)
			tx.insert(memberships).values({ projectId, userId: people[who].id, role }).run();
		tx.insert(shelfEntries).values({ id: entryId, projectId, title: 'Carbon-like ground', notation: '1s2 2s2 2p2' }).run();
		tx.insert(levelAnnotations).values({ id: annotationId, entryId, levelKey: '3P#1|2', observedEnergy: 43.4, status: 'proposed' }).run();
		tx.insert(levelAnnotationHistory)
			.values({
				annotationId,
				projectId,
				entryId,
				levelKey: '3P#1|2',
				observedEnergy: 43.4,
				status: 'proposed',
				version: 1,
				change: 'created',
				actorName: 'owner'
			})
			.run();
	});
	return { projectId, entryId, annotationId, ...savedLists(projectId) };
}

/** A level list (³P₀ even, ³D°₁ odd) and a line list of one line between them, for the saved-list routes. */
function savedLists(projectId: string) {
	const levelListId = newId();
	const lineListId = newId();
	return db.transaction((tx) => {
		tx.insert(levelLists).values({ id: levelListId, projectId, name: 'matrix levels', source: 'upload', rowCount: 2 }).run();
		const [lower, upper] = tx
			.insert(levelListRows)
			.values([
				{ listId: levelListId, position: 1, energy: 0, energyText: '0', J: '0', parity: 'even', term: '3P' },
				{ listId: levelListId, position: 2, energy: 20000, energyText: '20000', J: '1', parity: 'odd', term: '3D°' }
			])
			.returning({ id: levelListRows.id })
			.all();
		tx.insert(lineLists).values({ id: lineListId, projectId, name: 'matrix lines', rowCount: 1 }).run();
		const line = tx
			.insert(lineListRows)
			.values({ listId: lineListId, position: 1, wavelength: 20000, wavelengthText: '20000', unit: 'cm-1', medium: 'vacuum' })
			.returning({ id: lineListRows.id })
			.get();
		return { levelListId, lineListId, lineId: line.id, lowerLevelId: lower.id, upperLevelId: upper.id };
	});
}

/** A second project where every member of the fresh projects is an editor: the target of copies and moves. */
function targetProject(): string {
	const id = newId();
	db.transaction((tx) => {
		tx.insert(projects).values({ id, name: 'Matrix target', createdBy: people.owner.id }).run();
		for (const who of ['owner', 'coOwner', 'editor', 'viewer'] as const)
			tx.insert(memberships).values({ projectId: id, userId: people[who].id, role: 'editor' }).run();
	});
	return id;
}

/** Undoes what an allowed call may have changed on the actors themselves (passwords, tokens, site roles). */
async function restoreActors() {
	for (const [id, h] of originalHashes) db.update(users).set({ passwordHash: h }).where(eq(users.id, id)).run();
	db.update(users).set({ siteRole: 'member' }).where(eq(users.id, people.stranger.id)).run();
	const live = db.select({ userId: apiTokens.userId }).from(apiTokens).all().length;
	if (live < 3) await makeTokens();
}

// ------------------------------------------------------------------ sample inputs (so that allowed calls succeed)

type Ctx = { projectId: string; entryId: string; annotationId: string; actor: Actor | null; n: number } & ReturnType<typeof savedLists>;
type Sample = {
	query?: string;
	/** A query that needs the call's project (ids of its lists). */
	queryOf?: (ctx: Ctx) => string;
	body?: Record<string, unknown>;
	form?: (ctx: Ctx) => Record<string, string>;
	json?: (ctx: Ctx) => unknown;
	/** Route parameters besides projectId, entryId and annotationId (e.g. a live invitation token). */
	params?: (ctx: Ctx) => Record<string, string>;
};

/** A live invitation in the call's project, written directly; its id and the token of its link. */
function invitationIn(ctx: Ctx, email: string) {
	const { secret, hash } = newSecret();
	const id = newId();
	db.insert(invitations)
		.values({
			id,
			projectId: ctx.projectId,
			email,
			role: 'viewer',
			tokenHash: hash,
			invitedBy: people.owner.id,
			expiresAt: new Date(Date.now() + 3600_000)
		})
		.run();
	return { id, token: secret };
}

/** A parameter set (version 1) on the call's entry, written directly. */
function parameterSetIn(ctx: Ctx) {
	const id = newId();
	db.insert(parameterSets)
		.values({
			id,
			entryId: ctx.entryId,
			name: 'matrix set',
			notation: '1s2 2s2 2p2',
			parameters: { Eav: 0, F: [{ k: 2, a: '2p', b: '2p', value: 50000 }] }
		})
		.run();
	return id;
}

/** A saved fit report on the call's entry, written directly. */
function fitReportIn(ctx: Ctx) {
	const id = newId();
	const result = {
		config: '2p2',
		parameters: [{ id: 'Eav', value: 43.4, sigma: null, status: 'varied' as const }],
		residuals: [{ J: '2', rank: 1, label: '3P', observed: 43.4, calculated: 43.4, residual: 0 }],
		rms: 0,
		standardDeviation: null,
		degreesOfFreedom: 0,
		chiSquare: 0,
		iterations: 1,
		converged: true,
		method: 'matrix',
		caution: ''
	};
	db.insert(fitReports)
		.values({
			id,
			entryId: ctx.entryId,
			notation: '1s2 2s2 2p2',
			request: { parameters: {}, vary: ['Eav'], observed: [{ J: '2', energy: 43.4 }], observedFrom: 'notes' },
			result,
			rms: 0,
			degreesOfFreedom: 0
		})
		.run();
	return id;
}

const SAMPLES: Record<string, Sample> = {
	'GET /api/v1/terms': { query: '?config=2p2' },
	'GET /api/v1/jj': { query: '?config=2p2' },
	'GET /api/v1/bridge': { query: '?config=2p2' },
	'GET /api/v1/basis': { query: '?j1=1&j2=1/2' },
	'GET /api/v1/wigner': { query: '?symbol=3j&args=1,1,0,0,0,0' },
	'GET /api/v1/species': { query: '?name=Fe%20II' },
	'GET /api/v1/microstates': { query: '?config=2p2&offset=0&limit=5' },
	'POST /api/v1/projects': { json: () => ({ name: 'Made by the matrix' }) },
	'PATCH /api/v1/projects/:projectId': { json: () => ({ name: 'Renamed by the matrix' }) },
	'POST /api/v1/projects/:projectId/members': { json: () => ({ email: 'stranger@matrix.example', role: 'viewer' }) },
	'POST /api/v1/projects/:projectId/shelf': { json: () => ({ title: 'Neon excited', notation: '2p5 3p' }) },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId': { json: () => ({ title: 'Renamed', version: 1 }) },
	'PUT /api/v1/projects/:projectId/shelf/:entryId/annotations': { json: () => ({ levelKey: '3P#1|1', observedEnergy: 16.4 }) },
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/annotations': { query: '?level=3P%231%7C2' },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId': { json: () => ({ levelKey: '3P#1|1', version: 1 }) },
	'GET /api/v1/projects/:projectId/shelf/:entryId/levels': { query: '?format=csv' },
	'POST /api/v1/projects/:projectId/shelf/:entryId/parameters': {
		json: () => ({ name: 'matrix set', parameters: { F: [{ k: 2, a: '2p', b: '2p', value: 50000 }], zeta: [{ shell: '2p', value: 30 }] } })
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': { params: (c) => ({ setId: parameterSetIn(c) }) },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': {
		params: (c) => ({ setId: parameterSetIn(c) }),
		json: () => ({ name: 'renamed by the matrix', version: 1 })
	},
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': {
		params: (c) => ({ setId: parameterSetIn(c) }),
		query: '?version=1'
	},
	// The fixture's one note (³P₂ at 43.4 cm⁻¹) is the observed level; one free parameter.
	'POST /api/v1/projects/:projectId/shelf/:entryId/fits': {
		json: () => ({ parameters: { F: [{ k: 2, a: '2p', b: '2p', value: 50000 }] }, vary: ['Eav'] })
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId': { params: (c) => ({ fitId: fitReportIn(c) }) },
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId/export': { params: (c) => ({ fitId: fitReportIn(c) }), query: '?format=tex' },
	'POST /api/v1/projects/:projectId/level-lists': { json: () => ({ name: 'uploaded', csv: 'energy,J,parity\n0,0,even\n100,1,odd' }) },
	'POST /api/v1/projects/:projectId/line-lists': { json: () => ({ name: 'uploaded', csv: 'wavelength,unit,medium\n5000,A,air' }) },
	'PUT /api/v1/projects/:projectId/identifications': {
		json: (c) => ({ lineId: c.lineId, lowerLevelId: c.lowerLevelId, upperLevelId: c.upperLevelId, type: 'E1', status: 'accepted' })
	},
	'POST /api/v1/projects/:projectId/match': { json: (c) => ({ levelListId: c.levelListId, lineListId: c.lineListId }) },
	'GET /api/v1/projects/:projectId/exports/identified': { queryOf: (c) => `?format=csv&lineListId=${c.lineListId}` },
	'GET /api/v1/projects/:projectId/exports/unobserved': {
		queryOf: (c) => `?format=json&levelListId=${c.levelListId}&lineListId=${c.lineListId}`
	},
	'ACTION /signin ?/default': { form: () => ({ email: 'signin@matrix.example', password: PASSWORD }) },
	'ACTION /signup ?/default': { form: (c) => ({ name: 'New Person', email: `new${c.n}@matrix.example`, password: PASSWORD }) },
	'ACTION /forgot ?/default': { form: () => ({ email: 'viewer@matrix.example' }) },
	'ACTION /account ?/create': { form: () => ({ name: 'matrix script' }) },
	'ACTION /account ?/revoke': {
		form: (c) => {
			const mine = c.actor ? db.select().from(apiTokens).where(eq(apiTokens.userId, c.actor.id)).get() : undefined;
			return { id: mine?.id ?? (c.actor ? createToken(c.actor, 'to revoke').id : 'none') };
		}
	},
	'ACTION /account ?/password': { form: () => ({ current: PASSWORD, password: 'matrix-password-2' }) },
	'ACTION /admin/users ?/role': { form: () => ({ userId: people.stranger.id, siteRole: 'member' }) },
	'ACTION /projects ?/create': { form: () => ({ name: 'Made by the matrix' }) },
	'ACTION /projects/:projectId ?/rename': { form: () => ({ name: 'Renamed', description: '' }) },
	'ACTION /projects/:projectId ?/delete': { form: () => ({ confirm: 'Matrix nebula' }) },
	'ACTION /projects/:projectId/members ?/add': { form: () => ({ email: 'stranger@matrix.example', role: 'viewer' }) },
	'ACTION /projects/:projectId/members ?/resend': { form: (c) => ({ invitationId: invitationIn(c, `resend${c.n}@matrix.example`).id }) },
	'ACTION /projects/:projectId/members ?/revoke': { form: (c) => ({ invitationId: invitationIn(c, `revoke${c.n}@matrix.example`).id }) },
	// The signed-in actor's own invitation (members of the call's project accept and keep their role).
	'ACTION /invite/:token ?/accept': { params: (c) => ({ token: invitationIn(c, c.actor?.email ?? `nobody${c.n}@matrix.example`).token }) },
	'ACTION /invite/:token ?/signup': {
		params: (c) => ({ token: invitationIn(c, `invitee${c.n}@matrix.example`).token }),
		form: () => ({ name: 'Invited Person', password: PASSWORD })
	},
	'POST /api/v1/projects/:projectId/invitations': { json: (c) => ({ email: `api-invitee${c.n}@matrix.example`, role: 'viewer' }) },
	'DELETE /api/v1/projects/:projectId/invitations/:invitationId': {
		params: (c) => ({ invitationId: invitationIn(c, `api-revoke${c.n}@matrix.example`).id })
	},
	'ACTION /projects/:projectId/members ?/role': { form: () => ({ userId: people.viewer.id, role: 'editor' }) },
	'ACTION /projects/:projectId/members ?/remove': { form: () => ({ userId: people.viewer.id }) },
	'ACTION /projects/:projectId/shelf/new ?/default': { form: () => ({ title: 'Neon excited', notation: '2p5 3p' }) },
	'ACTION /projects/:projectId/shelf/:entryId ?/update': {
		form: () => ({ title: 'Renamed', notation: '1s2 2s2 2p2', species: '', notes: '', tags: '', version: '1' })
	},
	'ACTION /projects/:projectId/shelf/:entryId ?/annotate': {
		form: () => ({ levelKey: '3P#1|1', observedEnergy: '16.4', status: 'proposed' })
	},
	// The fixture's entry has a note on ³P₂ (version 1), so the paste says it saw that version.
	'ACTION /projects/:projectId/shelf/:entryId ?/pastePreview': { form: () => ({ text: '16.4 3P1\n43.5 3P2' }) },
	'ACTION /projects/:projectId/shelf/:entryId ?/paste': {
		form: () => ({ text: '16.4 3P1\n43.5 3P2', seen: JSON.stringify({ '3P#1|1': 0, '3P#1|2': 1 }) })
	},
	'ACTION /projects/:projectId/shelf/:entryId ?/deleteNote': { form: (c) => ({ annotationId: c.annotationId }) },
	'ACTION /projects/:projectId/shelf/:entryId ?/tags': { form: () => ({ tags: 'matrix, tagged', version: '1' }) },
	'ACTION /projects/:projectId/shelf/:entryId ?/editSet': {
		form: (c) => ({ setId: parameterSetIn(c), name: 'renamed by the matrix', comment: '', version: '1' })
	},
	'ACTION /projects/:projectId/shelf/:entryId ?/deleteSet': {
		form: (c) => ({ setId: parameterSetIn(c), name: 'matrix set', version: '1' })
	},
	'ACTION /projects/:projectId/shelf/:entryId ?/copy': { form: () => ({ projectId: targetProject() }) },
	'ACTION /projects/:projectId/shelf/:entryId ?/move': { form: () => ({ projectId: targetProject() }) },
	'POST /api/v1/projects/:projectId/shelf/:entryId/copy': { json: () => ({ projectId: targetProject() }) },
	'POST /api/v1/projects/:projectId/shelf/:entryId/move': { json: () => ({ projectId: targetProject() }) },
	// The upload form carries the previewed text back in its hidden "csv" field, so no multipart file is needed here.
	'ACTION /projects/:projectId/lists ?/preview': { form: () => ({ kind: 'levels', name: 'm', csv: 'energy,J,parity\n0,0,even' }) },
	'ACTION /projects/:projectId/lists ?/save': { form: () => ({ kind: 'lines', name: 'm', csv: 'wavelength,unit,medium\n5000,A,air' }) },
	'ACTION /projects/:projectId/lists ?/fromShelf': { form: (c) => ({ name: 'from notes', entryIds: c.entryId }) },
	'ACTION /projects/:projectId/lists ?/delete': { form: (c) => ({ kind: 'levels', listId: c.levelListId }) },
	'ACTION /projects/:projectId/matcher ?/judge': {
		form: (c) => ({
			lineId: String(c.lineId),
			lowerLevelId: String(c.lowerLevelId),
			upperLevelId: String(c.upperLevelId),
			type: 'E1',
			status: 'accepted'
		})
	},
	'PAGE /projects/:projectId/matcher': { queryOf: (c) => `?levelListId=${c.levelListId}&lineListId=${c.lineListId}&types=E1` },
	'ACTION /projects/:projectId/shelf/:entryId ?/reattach': {
		form: (c) => ({ annotationId: c.annotationId, levelKey: '3P#1|1', version: '1' })
	}
};

/** Calls that cannot succeed for anyone with a made-up input, so "allowed" means "not refused". */
// A restore needs a multipart file upload, which this table's url-encoded forms cannot carry.
const NOT_STRICT = new Set(['ACTION /reset/:token ?/default', 'ACTION /projects ?/restore']);

// ------------------------------------------------------------------ discovery

type Module = Record<string, unknown>;
const serverFiles = import.meta.glob<Module>('/src/routes/**/+server.ts');
const pageServerFiles = import.meta.glob<Module>('/src/routes/**/+page.server.ts');
const layoutServerFiles = import.meta.glob<Module>('/src/routes/**/+layout.server.ts');
const pageFiles = import.meta.glob('/src/routes/**/+page.svelte');

/** "/src/routes/(app)/projects/[projectId]/+page.server.ts" → "/projects/:projectId". */
function routePath(file: string): string {
	const dirs = file
		.replace(/^\/src\/routes/, '')
		.split('/')
		.slice(0, -1);
	const parts = dirs.filter((d) => d && !/^\(.+\)$/.test(d)).map((d) => d.replace(/^\[(.+)\]$/, ':$1'));
	return '/' + parts.join('/');
}

const dirOf = (file: string) => file.slice(0, file.lastIndexOf('/'));

/** The layout server files that run before a page in `dir`, outermost first. */
function layoutsAbove(dir: string): string[] {
	return Object.keys(layoutServerFiles)
		.filter((f) => dir === dirOf(f) || dir.startsWith(dirOf(f) + '/'))
		.sort((a, b) => a.length - b.length);
}

interface Cell {
	key: string;
	api: boolean;
	access: PageAccess | RouteAccess | undefined;
	run: (event: RequestEvent) => Promise<unknown>;
	method: string;
	path: string;
}

const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE'] as const;

async function discover(): Promise<Cell[]> {
	const cells: Cell[] = [];
	const apiAccess = new Map(API_ROUTES.map((r) => [`${r.method} ${r.path}`, r.access]));
	for (const [file, load] of Object.entries(serverFiles)) {
		const mod = await load();
		const path = routePath(file);
		for (const method of METHODS) {
			const handler = mod[method] as ((e: RequestEvent) => Promise<Response>) | undefined;
			if (!handler) continue;
			const key = `${method} ${path}`;
			cells.push({ key, api: true, access: apiAccess.get(key), run: (e) => handler(e), method, path });
		}
	}
	const pageDirs = new Set([...Object.keys(pageFiles), ...Object.keys(pageServerFiles)].map(dirOf));
	for (const dir of pageDirs) {
		const serverFile = `${dir}/+page.server.ts`;
		const mod = serverFile in pageServerFiles ? await pageServerFiles[serverFile]() : {};
		const path = routePath(serverFile);
		const layouts = await Promise.all(layoutsAbove(dir).map((f) => layoutServerFiles[f]()));
		const pageLoad = mod.load as ((e: RequestEvent) => unknown) | undefined;
		cells.push({
			key: `PAGE ${path}`,
			api: false,
			access: PAGE_ACCESS[`PAGE ${path}`],
			method: 'GET',
			path,
			run: async (e) => {
				// SvelteKit refuses the page when any layout load or the page load refuses.
				for (const layout of layouts) await (layout.load as ((e: RequestEvent) => unknown) | undefined)?.(e);
				return pageLoad?.(e);
			}
		});
		const actions = (mod.actions ?? {}) as Record<string, (e: RequestEvent) => unknown>;
		for (const [name, action] of Object.entries(actions)) {
			const key = `ACTION ${path} ?/${name}`;
			cells.push({ key, api: false, access: PAGE_ACCESS[key], method: 'POST', path, run: async (e) => action(e) });
		}
	}
	return cells.sort((a, b) => a.key.localeCompare(b.key));
}

// ------------------------------------------------------------------ calling a route as an actor

function actorOf(name: ActorName): { user: Actor | null; token: string | null } {
	switch (name) {
		case 'anonymous':
			return { user: null, token: null };
		case 'non-member':
			return { user: people.stranger, token: null };
		case 'site admin':
			return { user: people.admin, token: null };
		case 'viewer':
		case 'editor':
		case 'owner':
			return { user: people[name], token: null };
		default:
			return { user: null, token: tokens[name.slice('token:'.length)] };
	}
}

const cookieJar = () => {
	const jar = new Map<string, string>();
	return {
		get: (n: string) => jar.get(n),
		getAll: () => [...jar].map(([name, value]) => ({ name, value })),
		set: (n: string, v: string) => void jar.set(n, v),
		delete: (n: string) => void jar.delete(n),
		serialize: () => ''
	};
};

function eventFor(cell: Cell, actorName: ActorName, ctx: Ctx): RequestEvent {
	const sample = SAMPLES[cell.key] ?? {};
	const params: Record<string, string> = {
		projectId: ctx.projectId,
		entryId: ctx.entryId,
		annotationId: ctx.annotationId,
		levelListId: ctx.levelListId,
		lineListId: ctx.lineListId,
		token: 'not-a-live-reset-token',
		...sample.params?.(ctx)
	};
	const pathname = cell.path.replace(/:(\w+)/g, (_, p: string) => encodeURIComponent(params[p]));
	const url = new URL(`http://localhost${pathname}${sample.queryOf?.(ctx) ?? sample.query ?? ''}`);
	const { user, token } = actorOf(actorName);
	const headers = new Headers({ origin: 'http://localhost' });
	if (token) headers.set('authorization', `Bearer ${token}`);
	let body: string | undefined;
	if (cell.method !== 'GET' && cell.method !== 'DELETE') {
		if (cell.api) {
			headers.set('content-type', 'application/json');
			body = JSON.stringify(sample.json?.(ctx) ?? {});
		} else {
			headers.set('content-type', 'application/x-www-form-urlencoded');
			body = new URLSearchParams(sample.form?.(ctx) ?? {}).toString();
		}
	}
	return {
		url,
		params,
		request: new Request(url, { method: cell.method, headers, body }),
		locals: {
			user,
			session: user ? { id: `matrix-${ctx.n}`, userId: user.id, fresh: false, expiresAt: new Date(Date.now() + 3600_000) } : null
		},
		cookies: cookieJar(),
		getClientAddress: () => `10.77.${Math.floor(ctx.n / 250) % 250}.${ctx.n % 250}`,
		route: { id: cell.path },
		setHeaders: () => {},
		isDataRequest: false,
		isSubRequest: false,
		platform: undefined,
		depends: () => {},
		parent: async () => ({}),
		untrack: <T>(fn: () => T) => fn(),
		fetch
	} as unknown as RequestEvent;
}

type Answer = { status: number; location?: string };

async function call(cell: Cell, event: RequestEvent): Promise<Answer> {
	try {
		const out = await cell.run(event);
		if (out instanceof Response) return { status: out.status, location: out.headers.get('location') ?? undefined };
		if (isActionFailure(out)) return { status: out.status };
		return { status: 200 };
	} catch (e) {
		if (isRedirect(e)) return { status: e.status, location: e.location };
		if (isHttpError(e)) return { status: e.status };
		throw e;
	}
}

function classify(a: Answer): Outcome | 'other' {
	// requireUser sends the anonymous to "/signin?next=…" (signing out lands on a bare "/signin").
	if (a.status === 401 || (a.location && a.location.startsWith('/signin?next='))) return 'sign-in';
	if (a.status === 403) return '403';
	if (a.status === 404) return '404';
	if (a.status < 400) return 'allowed';
	return 'other';
}

// ------------------------------------------------------------------ the test

describe('role matrix', () => {
	let cells: Cell[] = [];
	beforeAll(async () => {
		cells = await discover();
	});

	it('discovers the routes (pages, form actions, API) from src/routes', () => {
		expect(cells.filter((c) => c.key.startsWith('PAGE ')).length).toBeGreaterThanOrEqual(15);
		expect(cells.filter((c) => c.key.startsWith('ACTION ')).length).toBeGreaterThanOrEqual(20);
		expect(cells.filter((c) => c.api).length).toBeGreaterThanOrEqual(25);
	});

	it('every discovered route has an expected access written down', () => {
		const missing = cells
			.filter((c) => c.access === undefined)
			.map((c) =>
				c.api
					? `${c.key}: add it with its "access" to src/lib/api/routes.ts`
					: `${c.key}: add its expected access to PAGE_ACCESS in src/lib/server/role-matrix.test.ts`
			);
		expect(missing, `Routes without an expected outcome:\n${missing.join('\n')}`).toEqual([]);
		const listed = new Set(cells.map((c) => c.key));
		const stale = Object.keys(PAGE_ACCESS).filter((k) => !listed.has(k));
		expect(stale, `PAGE_ACCESS lists routes that no longer exist: ${stale.join(', ')}`).toEqual([]);
	});

	it('every actor gets the allowed or refused outcome on every route', async () => {
		const wrong: string[] = [];
		let n = 0;
		const table: Record<string, Record<string, string>> = {};
		for (const cell of cells) {
			if (cell.access === undefined) continue;
			for (const actor of ACTORS) {
				const ctx = { ...freshProject(), actor: actorOf(actor).user, n: n++ };
				const answer = await call(cell, eventFor(cell, actor, ctx));
				await restoreActors();
				const want = expectedOutcome(cell.access, actor, cell.api);
				const got = classify(answer);
				const strict = want === 'allowed' && cell.access !== 'public' && !NOT_STRICT.has(cell.key);
				// Public routes: nobody is refused; the answer may still be 400 for an input the route does not like.
				const ok = want === 'allowed' ? got === 'allowed' || (!strict && got === 'other') : got === want;
				(table[cell.key] ??= {})[actor] = `${answer.status}`;
				if (!ok)
					wrong.push(`${cell.key} as ${actor}: expected ${want}, got ${answer.status}${answer.location ? ` → ${answer.location}` : ''}`);
			}
		}
		const size = `${cells.length} routes × ${ACTORS.length} actors = ${n} calls`;
		console.log(`role matrix: ${size}`);
		const counts = { public: 0, guarded: 0 };
		for (const c of cells) counts[c.access === 'public' ? 'public' : 'guarded']++;
		console.log(`role matrix: ${counts.public} public routes (compute API, sign-in pages), ${counts.guarded} guarded`);
		expect(wrong, `${wrong.length} of ${n} calls had the wrong outcome:\n${wrong.join('\n')}`).toEqual([]);
		expect(n).toBeGreaterThan(400);
		// Hundreds of calls through the real handlers: a generous limit so a busy machine does not fail it
		// (this is not a speed check; speed lives in `npm run bench`).
	}, 120_000);

	it('the compute routes of the API are public: the matrix says so', () => {
		for (const key of ['GET /api/v1/terms', 'GET /api/v1/jj', 'GET /api/v1/wigner']) {
			expect(cells.find((c) => c.key === key)?.access).toBe('public');
		}
	});
});
