/**
 * Every /api/v1 route, in one list: the `/api/v1` index is generated from it, `reply` in
 * $lib/server/http type-checks each handler's body against ./types by its key, and
 * routes.test.ts fails when a `+server.ts` exports a method that is not listed here (or the
 * other way round), so the index cannot drift from the code.
 */
import type { RouteKey } from './types';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/** Who may call a route: `public` needs no sign-in; the project roles are the least role needed. */
export type RouteAccess = 'public' | 'signed-in' | 'viewer' | 'editor' | 'owner';

export interface ApiRoute {
	method: HttpMethod;
	path: string;
	summary: string;
	access: RouteAccess;
}

type Listed = { [K in RouteKey]: { summary: string; access: RouteAccess } };

const LISTED: Listed = {
	'GET /api/v1': { summary: 'this index', access: 'public' },
	'GET /api/v1/terms': { summary: 'Term sheet: ?config=3d5 4s[&gs=free]', access: 'public' },
	'GET /api/v1/jj': { summary: 'jj-coupled levels: ?config=2p5 3p[&counts=only]', access: 'public' },
	'GET /api/v1/jk': { summary: 'jK (pair) coupled levels, core + one outer electron: ?config=2p5 3p', access: 'public' },
	'GET /api/v1/bridge': { summary: 'LS ↔ jK ↔ jj correlation by J: ?config=2p5 3p[&zeta=2p:1,3p:0.022]', access: 'public' },
	'GET /api/v1/basis': { summary: 'coupled ⇄ uncoupled table: ?j1=2&j2=1/2', access: 'public' },
	'GET /api/v1/wigner': { summary: 'Wigner 3j/6j/9j or Clebsch–Gordan: ?symbol=6j&args=1,1,1,1,1,1', access: 'public' },
	'GET /api/v1/species': { summary: 'ground configuration of an atom or ion: ?name=Fe II', access: 'public' },
	'GET /api/v1/microstates': { summary: 'explicit microstates, a page at a time: ?config=2p2&offset=0&limit=50', access: 'public' },
	'POST /api/v1/energies': {
		summary: 'intermediate-coupling levels { config, parameters: { Eav, F: [{ k, a, b, value }], G, zeta: [{ shell, value }] }, gs? }',
		access: 'public'
	},
	'POST /api/v1/energies/sweep': {
		summary: 'LS → jj sweep of the levels: the same body plus points (2–201, default 61)',
		access: 'public'
	},
	'POST /api/v1/fit': {
		summary: 'least-squares fit { config, parameters, vary, links?, bounds?, observed: [{ J, energy, uncertainty?, assign? }] }',
		access: 'public'
	},
	'GET /api/v1/transitions': {
		summary: 'Transition finder: multiplets and LS strengths: ?lower=2p2&upper=2p 3s&types=E1,M1,E2',
		access: 'public'
	},
	'GET /api/v1/airvac': {
		summary: 'standard air ↔ vacuum wavelength (Morton 2000): ?vacuum=6564.61 or ?air=6562.80 (Å)',
		access: 'public'
	},
	'POST /api/v1/match': { summary: 'Line matcher: { levels, lines, tolerance?, types? } → ranked candidates per line', access: 'public' },
	'GET /api/v1/projects': { summary: 'your projects', access: 'signed-in' },
	'POST /api/v1/projects': { summary: 'create a project { name, description }', access: 'signed-in' },
	'GET /api/v1/projects/:projectId/backup': {
		summary: 'the whole project as one versioned JSON file (download); import it on the Projects page',
		access: 'owner'
	},
	'GET /api/v1/projects/:projectId/activity': {
		summary: 'the activity log, newest first: ?limit=50&cursor=&actor=<userId>&kind=entry.created',
		access: 'viewer'
	},
	'GET /api/v1/projects/:projectId/review': {
		summary: 'proposed and disputed level notes (yours: you proposed it, so another confirms it), longest waiting first: ?limit=50',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId': { summary: 'one project', access: 'viewer' },
	'PATCH /api/v1/projects/:projectId': { summary: 'change name or description', access: 'owner' },
	'DELETE /api/v1/projects/:projectId': { summary: 'delete the project', access: 'owner' },
	'GET /api/v1/projects/:projectId/members': { summary: 'members and their roles', access: 'viewer' },
	'POST /api/v1/projects/:projectId/members': {
		summary: 'add a member { email, role }; an address without an account is invited; the answer is the same either way',
		access: 'owner'
	},
	'GET /api/v1/projects/:projectId/invitations': { summary: 'open invitations (pending or expired), newest first', access: 'owner' },
	'POST /api/v1/projects/:projectId/invitations': {
		summary: 'invite an e-mail address { email, role }: mails a one-time link valid 7 days; again for the same address replaces the link',
		access: 'owner'
	},
	'DELETE /api/v1/projects/:projectId/invitations/:invitationId': {
		summary: 'revoke an invitation: its link stops working',
		access: 'owner'
	},
	'GET /api/v1/projects/:projectId/membership': { summary: 'your own role in the project', access: 'viewer' },
	'DELETE /api/v1/projects/:projectId/membership': { summary: 'leave the project (not the last owner)', access: 'viewer' },
	'GET /api/v1/projects/:projectId/shelf': {
		summary:
			'the Shelf, a page at a time: ?q=&species=Fe II&tag=&parity=even|odd&open=3d 4s&sort=updated|title&limit=50&cursor= (with matching and total counts)',
		access: 'viewer'
	},
	'POST /api/v1/projects/:projectId/shelf': { summary: 'add a configuration to the Shelf', access: 'editor' },
	'GET /api/v1/projects/:projectId/shelf/:entryId': { summary: 'one Shelf entry', access: 'viewer' },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId': { summary: 'change an entry; send the version you read', access: 'editor' },
	'DELETE /api/v1/projects/:projectId/shelf/:entryId': { summary: 'delete an entry', access: 'editor' },
	'GET /api/v1/projects/:projectId/shelf/:entryId/annotations': { summary: 'per-level notes', access: 'viewer' },
	'PUT /api/v1/projects/:projectId/shelf/:entryId/annotations': { summary: 'create or change one level note', access: 'editor' },
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/annotations': { summary: 'delete one level note: ?level=', access: 'editor' },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId': {
		summary: 'reattach a (detached) note to a level { levelKey, version }',
		access: 'editor'
	},
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId': {
		summary: 'delete one note, attached or detached',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId/history': {
		summary: 'every change of one note (also of a deleted one), oldest first: values after the change, status, who, when',
		access: 'viewer'
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/levels': { summary: 'annotated level table: ?format=csv|json|tex', access: 'viewer' },
	'GET /api/v1/projects/:projectId/shelf/:entryId/parameters': {
		summary: 'energy parameter sets saved with the entry, most recently changed first',
		access: 'viewer'
	},
	'POST /api/v1/projects/:projectId/shelf/:entryId/parameters': {
		summary: 'save a parameter set { name, parameters: { Eav, F, G, zeta }, comment? } for the entry’s configuration',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': { summary: 'one parameter set', access: 'viewer' },
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': {
		summary: 'change a parameter set { name?, parameters?, comment?, version } (stale versions get 409)',
		access: 'editor'
	},
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': {
		summary: 'delete a parameter set: ?version= as read (stale versions get 409)',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits': { summary: 'saved fit reports of the entry, newest first', access: 'viewer' },
	'POST /api/v1/projects/:projectId/shelf/:entryId/fits': {
		summary:
			'fit and save the report { parameters, vary, links?, bounds?, observed?, parameterSetId? }; without observed, the entry’s annotated energies',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId': { summary: 'one saved fit report', access: 'viewer' },
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId/export': {
		summary: 'a fit report as a file: ?format=csv|json|tex[&download]',
		access: 'viewer'
	},
	// library (issue 13, item 5): the source project's role is checked first, then the target's (editor)
	'POST /api/v1/projects/:projectId/shelf/:entryId/duplicate': {
		summary: 'a copy of the entry in the same project, with its level notes (confirmed notes arrive as proposed)',
		access: 'editor'
	},
	'POST /api/v1/projects/:projectId/shelf/:entryId/copy': {
		summary: 'copy the entry with its notes and their history to another project you edit: {"projectId"}',
		access: 'viewer'
	},
	'POST /api/v1/projects/:projectId/shelf/:entryId/move': {
		summary: 'move the entry, its notes and their history to another project you edit: {"projectId"}',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/level-lists': { summary: 'the saved level lists, newest first', access: 'viewer' },
	'POST /api/v1/projects/:projectId/level-lists': {
		summary:
			'upload a level CSV { name, csv, preview? } (energy, uncertainty, J, parity, configuration, term, g; at most 5 MB and 200 000 rows; any problem saves nothing: 422 with problems) or make one from Shelf notes { name, entryIds }',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/level-lists/:levelListId': { summary: 'one level list with its levels', access: 'viewer' },
	'DELETE /api/v1/projects/:projectId/level-lists/:levelListId': {
		summary: 'delete a level list and its identifications',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/line-lists': { summary: 'the saved line lists, newest first', access: 'viewer' },
	'POST /api/v1/projects/:projectId/line-lists': {
		summary:
			'upload a line CSV { name, csv, preview? } (wavelength, unit A|nm|cm-1, medium air|vacuum, uncertainty, intensity, comment; at most 5 MB and 200 000 rows; any problem saves nothing)',
		access: 'editor'
	},
	'GET /api/v1/projects/:projectId/line-lists/:lineListId': { summary: 'one line list with its lines', access: 'viewer' },
	'DELETE /api/v1/projects/:projectId/line-lists/:lineListId': { summary: 'delete a line list and its identifications', access: 'editor' },
	'GET /api/v1/projects/:projectId/identifications': {
		summary: 'accepted and rejected identifications: ?lineListId=&status=accepted|rejected',
		access: 'viewer'
	},
	'PUT /api/v1/projects/:projectId/identifications': {
		summary:
			'accept or reject a candidate { lineId, upperLevelId, lowerLevelId, type, status, note? }; several accepted on a line = a blend',
		access: 'editor'
	},
	'POST /api/v1/projects/:projectId/match': {
		summary: 'Line matcher on saved lists { levelListId, lineListId, types?, toleranceUnit?, tolerance?, coverage? }',
		access: 'viewer'
	},
	'GET /api/v1/projects/:projectId/exports/identified': {
		summary: 'identified lines of a line list: ?lineListId=&format=csv|json|tex',
		access: 'viewer'
	},
	'GET /api/v1/projects/:projectId/exports/unobserved': {
		summary: 'strong predicted lines not observed: ?levelListId=&lineListId=&types=E1&toleranceUnit=&tolerance=&format=csv|json|tex',
		access: 'viewer'
	}
};

/** The routes in the order listed, as plain data. */
export const API_ROUTES: readonly ApiRoute[] = Object.entries(LISTED).map(([key, info]) => {
	const [method, path] = key.split(' ') as [HttpMethod, string];
	return { method, path, ...info };
});

/** "GET /api/v1/projects/:projectId" for a route. */
export const routeKey = (r: Pick<ApiRoute, 'method' | 'path'>) => `${r.method} ${r.path}`;
