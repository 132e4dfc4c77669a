/**
 * The JSON bodies of the /api/v1 routes: one definition, used by the `+server.ts` handlers (through
 * `reply` in $lib/server/http) and by the pages (through `apiGet` in ./client). Nothing here runs.
 *
 * Conventions: half-integers are strings ("3/2"); dates are ISO strings; counts that can pass 2^53
 * are strings of digits; every error is `ApiErrorBody`.
 */
import type { TermSheet } from '$lib/physics/report';
import type { ExactJson } from '$lib/physics/exact';
import type { JjLabelPiece } from '$lib/physics/jj';
import type { IcResult } from '$lib/physics/levels-ic';
import type { SweepResult } from '$lib/physics/sweep';
import type { FitResult } from '$lib/physics/fit';
import type { FinderResult } from '$lib/physics/finder';
import type { MatchResult, Tolerance } from '$lib/physics/matcher';
import type { TransitionType } from '$lib/physics/transitions';
import type { LevelInput, LineInput } from '$lib/lines/lists';
import type { UploadedLevel, UploadedLine } from '$lib/lines/uploads';

/** Every failure: status 4xx/5xx with this body. */
export interface ApiErrorBody {
	error: { message: string; token?: string; field?: string; [detail: string]: unknown };
}

// ---------------------------------------------------------------- compute routes (public)

/** `gs` of /api/v1/terms: g_s = 2 (exact fractions) or the free-electron value. */
export type GsChoice = 'exact' | 'free';

export type TermsResponse = TermSheet;

export interface JjLevelJson {
	J: string;
	group: string;
	subshells: string;
	label: string;
	pieces: JjLabelPiece[];
	intermediates: string[];
}

export interface JjResponse {
	configuration: string;
	/** Number of jj levels of each J ("3/2" → 4). */
	countsByJ: Record<string, number>;
	countsAgreeWithLS: true;
	/** Left out with `counts=only`. */
	levels?: JjLevelJson[];
}

export interface JkLevelJson {
	core: { S: string; L: number; J: string; occurrence: number; parentage: string };
	K: string;
	J: string;
	/** "2p⁵(²P°₃/₂)3p ²[5/2]₃". */
	label: string;
}

export interface JkResponse {
	configuration: { notation: string; pretty: string; parity: 'even' | 'odd'; core: string; outer: string };
	levels: JkLevelJson[];
	/** Number of levels of each J ("2" → 3); equal to LS (checked). */
	countsByJ: Record<string, number>;
	countsAgreeWithLS: true;
	schematic: true;
}

export interface BridgeResponse {
	configuration: { notation: string; pretty: string; parity: 'even' | 'odd' };
	schematic: boolean;
	ls: { label: string; J: string }[];
	jj: { label: string; J: string; group: string; subshells: string; spinOrbitWeight: number }[];
	links: { J: string; ls: number; jj: number }[];
	/** jK levels in schematic order (core level, then K), or null where jK does not apply (`jkReason` says why). */
	jk: { label: string; J: string; coreJ: string; K: string }[] | null;
	jkReason: string | null;
	/** Indices into `ls`, `jk`, `jj` joined by one J (non-crossing rule); [] without jK. */
	jkLinks: { J: string; ls: number; jk: number; jj: number }[];
	/** ζ used for each open subshell (only ratios matter for the jj order). */
	zeta: { subshell: string; zeta: number }[];
	zetaSource: string;
}

/** An exact coefficient sign·√(p/q) with its float value and a plain-text form ("-sqrt(1/3)"). */
export type ExactCoefficient = ExactJson;

export interface BasisResponse {
	j1: string;
	j2: string;
	coupled: { J: string; M: string; components: { m1: string; m2: string; coefficient: ExactCoefficient }[] }[];
	uncoupled: { m1: string; m2: string; components: { J: string; M: string; coefficient: ExactCoefficient }[] }[];
}

export interface WignerResponse {
	symbol: '3j' | '6j' | '9j' | 'cg';
	args: string[];
	value: number;
	exact: { sign: -1 | 0 | 1; squared: string };
	text: string;
}

export interface SpeciesResponse {
	species: { Z: number; symbol: string; name: string; charge: number; label: string };
	notation: string;
	source: string;
	caution: string | null;
}

export interface MicrostatesResponse {
	/** Digits: the total can pass 2^53. */
	total: string;
	offset: string;
	subshells: string[];
	items: { index: string; ML: number; MS: string; orbitals: string[][] }[];
}

/** Transition finder: multiplets between (or within) configurations, with LS strengths. */
export type TransitionsResponse = FinderResult;

/** Air ↔ vacuum, Å; wavenumber cm⁻¹. */
export interface AirvacResponse {
	vacuum: number;
	air: number;
	wavenumber: number;
	refractiveIndex: number;
	formula: string;
}

/** Line matcher on posted levels and lines; indices point into the posted arrays. */
export interface MatchResponse extends MatchResult {
	tolerance: Tolerance;
	types: TransitionType[];
	caution: string;
}

// ---------------------------------------------------------------- project routes (members)

export type ProjectRoleName = 'viewer' | 'editor' | 'owner';

export interface ProjectJson {
	id: string;
	name: string;
	description: string;
	role: ProjectRoleName;
	createdBy?: string | null;
	createdAt?: string;
	updatedAt: string;
}

export interface ProjectListItem extends ProjectJson {
	members: number;
}

export interface MemberJson {
	userId: string;
	name: string;
	email: string;
	role: ProjectRoleName;
	since?: string;
}

/** An open invitation (pending, or expired and not yet resent), as owners see it. No token: only its hash is stored. */
export interface InvitationJson {
	id: string;
	email: string;
	role: ProjectRoleName;
	state: 'pending' | 'expired';
	invitedByName: string;
	/** Whether the mail server took the last mail with the link ('failed': resend it). */
	mailStatus: 'sent' | 'failed';
	createdAt: string;
	sentAt: string;
	expiresAt: string;
}

export interface ShelfEntryJson {
	id: string;
	projectId: string;
	title: string;
	species: string;
	notation: string;
	notes: string;
	tags: string[];
	version: number;
	createdAt: string;
	updatedAt: string;
	updatedBy: string | null;
	/** Checks that do not stop a save, e.g. species and configuration disagreeing on the electron count. */
	warnings: string[];
}

/** A duplicated, copied or moved entry (in the project it is now in) and how many level notes came with it. */
export interface ShelfTransferJson {
	entry: ShelfEntryJson;
	notes: number;
}

/** One page of the Shelf list with the counts and menus of its filters. */
export interface ShelfPageJson {
	entries: Omit<ShelfEntryJson, 'warnings'>[];
	nextCursor: string | null;
	/** Entries that pass the filters (all pages). */
	matching: number;
	/** Entries in the project. */
	total: number;
	/** The species and tags in use in the project, for the filter menus. */
	facets: { species: string[]; tags: string[] };
}

export interface AnnotationJson {
	id: string;
	levelKey: string;
	observedEnergy: number | null;
	/** The digits as typed ("1880", "19500.12345", "-12400"); show and export these, not the number. */
	observedEnergyText: string | null;
	uncertainty: number | null;
	uncertaintyText: string | null;
	status: 'proposed' | 'confirmed' | 'disputed';
	comment: string;
	/** Who proposed the present values (name and user id); anyone but them may confirm the note. */
	proposedBy: string | null;
	proposedById: string | null;
	/** True when the entry's configuration changed after the note was written; reattach or delete it. */
	detached: boolean;
	/** The configuration (as typed) a detached note was written for. */
	detachedFrom: string | null;
	version: number;
	updatedAt: string;
	updatedBy: string | null;
}

/** One change of a level note, with the note's values after it (GET …/annotations/:annotationId/history). */
export interface NoteHistoryJson {
	id: number;
	/** One of NOTE_CHANGES in src/lib/review.ts: created, changed, confirmed, disputed, reopened, reattached, detached, deleted, recorded. */
	change: string;
	levelKey: string;
	observedEnergyText: string | null;
	uncertaintyText: string | null;
	status: 'proposed' | 'confirmed' | 'disputed';
	comment: string;
	detached: boolean;
	detachedFrom: string | null;
	version: number;
	proposedBy: string | null;
	actorName: string;
	createdAt: string;
}

/** A proposed or disputed note, awaiting review (GET /api/v1/projects/:projectId/review). */
export interface ReviewItemJson {
	id: string;
	entryId: string;
	entryTitle: string;
	species: string;
	notation: string;
	levelKey: string;
	observedEnergy: number | null;
	observedEnergyText: string | null;
	uncertainty: number | null;
	uncertaintyText: string | null;
	comment: string;
	status: 'proposed' | 'disputed';
	proposedBy: string | null;
	/** The person asking proposed it, so cannot confirm it (review rule, src/lib/review.ts). */
	yours: boolean;
	updatedAt: string;
	version: number;
}

/** Determinant budgets of one Energy solver request. */
export interface EnergyLimits {
	maxBlock: number;
	maxTotal: number;
}

/** POST /api/v1/energies: levels sorted by energy, components under 0.01 % left out. */
export type EnergiesResponse = IcResult & { limits: EnergyLimits };
export type EnergySweepResponse = SweepResult & { limits: EnergyLimits };
export type FitResponse = FitResult & { limits: EnergyLimits };

/** A named set of energy parameters saved with a Shelf entry (GET …/shelf/:entryId/parameters). */
export interface ParameterSetJson {
	id: string;
	entryId: string;
	name: string;
	/** The entry's configuration (as typed) the set was saved for. */
	notation: string;
	parameters: EnergyParametersBody;
	comment: string;
	version: number;
	createdAt: string;
	createdBy: string | null;
	updatedAt: string;
	updatedBy: string | null;
}

/** A saved fit of a Shelf entry: what was asked, and the engine's answer as it returned it. */
export interface FitReportJson {
	id: string;
	entryId: string;
	parameterSetId: string | null;
	notation: string;
	request: {
		parameters: EnergyParametersBody;
		vary: string[];
		links?: { id: string; to: string; ratio?: number }[];
		bounds?: { id: string; min?: number; max?: number }[];
		observed: (ObservedLevelBody & { levelKey?: string })[];
		/** 'notes': the entry's annotated energies; 'typed': a list given with the request. */
		observedFrom: 'notes' | 'typed';
	};
	result: FitResult;
	rms: number;
	degreesOfFreedom: number;
	createdAt: string;
	createdBy: string | null;
}

/** What restoring a project backup reports (the Projects page's restore form shows it). */
export interface ImportReport {
	projectId: string;
	name: string;
	entries: number;
	levelNotes: number;
	activity: number;
	/** Members restored with their role (the importer is owner). */
	members: { email: string; role: string }[];
	/** Members of the file that have no account here, by e-mail, with the role they had. */
	notRestored: { email: string; name: string; role: string }[];
}

// ---------------------------------------------------------------- request bodies of the compute POSTs

/** Energy parameters in cm⁻¹ as the Energy solver routes take them (src/lib/server/energy-validation.ts). */
export interface EnergyParametersBody {
	Eav?: number;
	F?: { k: number; a: string; b: string; value: number }[];
	G?: { k: number; a: string; b: string; value: number }[];
	zeta?: { shell: string; value: number }[];
}

/** One observed level for the fit: J, energy (cm⁻¹), uncertainty, and a term label or a rank within J. */
export interface ObservedLevelBody {
	J: string;
	energy: number;
	uncertainty?: number;
	assign?: string | number;
}

/**
 * The JSON body of each compute POST. Their answers depend only on the body, so the pages read them
 * like GETs (`apiQuery` with `body`, cached by the body).
 */
export interface ApiRequests {
	'POST /api/v1/energies': { config: string; parameters: EnergyParametersBody; gs?: GsChoice };
	'POST /api/v1/energies/sweep': { config: string; parameters: EnergyParametersBody; points?: number };
	'POST /api/v1/fit': { config: string; parameters: EnergyParametersBody; vary: string[]; observed: ObservedLevelBody[] };
	'POST /api/v1/match': {
		levels: LevelInput[];
		lines: Omit<LineInput, 'intensity'>[];
		types: string[];
		coverage?: number;
		tolerance?: number;
		toleranceUnit?: 'cm-1' | 'mA';
	};
}

/** The JSON bodies of the project writes the pages send with `apiWrite` (./client). */
export interface ApiWrites {
	'POST /api/v1/projects/:projectId/shelf/:entryId/parameters': { name: string; parameters: EnergyParametersBody; comment?: string };
	'POST /api/v1/projects/:projectId/shelf/:entryId/fits': {
		parameters: EnergyParametersBody;
		vary: string[];
		/** Left out: the entry's annotated observed energies. */
		observed?: ObservedLevelBody[];
		parameterSetId?: string;
	};
}

/**
 * The response body of each route, keyed "METHOD /path" exactly as in `API_ROUTES` (./routes).
 * Routes that answer 204 or a file map to `null`.
 */
export interface ApiResponses {
	'GET /api/v1': { name: string; version: 1; routes: { method: string; path: string; summary: string; access: string }[] };
	'GET /api/v1/terms': TermsResponse;
	'GET /api/v1/jj': JjResponse;
	'GET /api/v1/jk': JkResponse;
	'GET /api/v1/bridge': BridgeResponse;
	'GET /api/v1/basis': BasisResponse;
	'GET /api/v1/wigner': WignerResponse;
	'GET /api/v1/species': SpeciesResponse;
	'GET /api/v1/microstates': MicrostatesResponse;
	'POST /api/v1/energies': EnergiesResponse;
	'POST /api/v1/energies/sweep': EnergySweepResponse;
	'POST /api/v1/fit': FitResponse;
	'GET /api/v1/transitions': TransitionsResponse;
	'GET /api/v1/airvac': AirvacResponse;
	'POST /api/v1/match': MatchResponse;
	'GET /api/v1/projects': { projects: ProjectListItem[] };
	'POST /api/v1/projects': { project: ProjectJson };
	'GET /api/v1/projects/:projectId/backup': null;
	'GET /api/v1/projects/:projectId/activity': { items: ActivityJson[]; nextCursor: string | null };
	'GET /api/v1/projects/:projectId/review': { items: ReviewItemJson[]; total: number };
	'GET /api/v1/projects/:projectId': { project: ProjectJson };
	'PATCH /api/v1/projects/:projectId': { project: ProjectJson };
	'DELETE /api/v1/projects/:projectId': null;
	'GET /api/v1/projects/:projectId/members': { members: MemberJson[] };
	/** The same answer whether or not an account uses the e-mail (no account discovery); an address without one is invited. */
	'POST /api/v1/projects/:projectId/members': { result: { email: string; role: ProjectRoleName; message: string } };
	'GET /api/v1/projects/:projectId/invitations': { invitations: InvitationJson[] };
	'POST /api/v1/projects/:projectId/invitations': { invitation: InvitationJson };
	'DELETE /api/v1/projects/:projectId/invitations/:invitationId': null;
	'GET /api/v1/projects/:projectId/membership': { membership: { role: ProjectRoleName } };
	'DELETE /api/v1/projects/:projectId/membership': null;
	'GET /api/v1/projects/:projectId/shelf': ShelfPageJson;
	'POST /api/v1/projects/:projectId/shelf': { entry: ShelfEntryJson };
	'GET /api/v1/projects/:projectId/shelf/:entryId': { entry: ShelfEntryJson };
	'PATCH /api/v1/projects/:projectId/shelf/:entryId': { entry: ShelfEntryJson; detachedNotes: number };
	'DELETE /api/v1/projects/:projectId/shelf/:entryId': null;
	'GET /api/v1/projects/:projectId/shelf/:entryId/annotations': { annotations: AnnotationJson[] };
	/** `reopened`: the new values turned a confirmed note back to proposed (review rule, src/lib/review.ts). */
	'PUT /api/v1/projects/:projectId/shelf/:entryId/annotations': { annotation: AnnotationJson; reopened: boolean };
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/annotations': null;
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId': { annotation: AnnotationJson };
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId': null;
	'GET /api/v1/projects/:projectId/shelf/:entryId/annotations/:annotationId/history': { history: NoteHistoryJson[] };
	'GET /api/v1/projects/:projectId/shelf/:entryId/levels': null;
	'GET /api/v1/projects/:projectId/shelf/:entryId/parameters': { parameterSets: ParameterSetJson[] };
	'POST /api/v1/projects/:projectId/shelf/:entryId/parameters': { parameterSet: ParameterSetJson };
	'GET /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': { parameterSet: ParameterSetJson };
	'PATCH /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': { parameterSet: ParameterSetJson };
	'DELETE /api/v1/projects/:projectId/shelf/:entryId/parameters/:setId': null;
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits': { fits: FitReportJson[] };
	'POST /api/v1/projects/:projectId/shelf/:entryId/fits': { fit: FitReportJson };
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId': { fit: FitReportJson };
	'GET /api/v1/projects/:projectId/shelf/:entryId/fits/:fitId/export': null;
	'POST /api/v1/projects/:projectId/shelf/:entryId/duplicate': ShelfTransferJson;
	'POST /api/v1/projects/:projectId/shelf/:entryId/copy': ShelfTransferJson;
	'POST /api/v1/projects/:projectId/shelf/:entryId/move': ShelfTransferJson;
	// Saved level and line lists, identifications (services/lists.ts, identifications.ts, list-exports.ts)
	'GET /api/v1/projects/:projectId/level-lists': { levelLists: LevelListJson[] };
	/** A preview (`preview: true`) has `list: null`; a list made from Shelf notes has `preview: null`. */
	'POST /api/v1/projects/:projectId/level-lists': { list: LevelListJson | null; preview: UploadPreviewJson<UploadedLevelJson> | null };
	'GET /api/v1/projects/:projectId/level-lists/:levelListId': { list: LevelListJson; rows: LevelRowJson[] };
	'DELETE /api/v1/projects/:projectId/level-lists/:levelListId': null;
	'GET /api/v1/projects/:projectId/line-lists': { lineLists: LineListJson[] };
	'POST /api/v1/projects/:projectId/line-lists': { list: LineListJson | null; preview: UploadPreviewJson<UploadedLineJson> };
	'GET /api/v1/projects/:projectId/line-lists/:lineListId': { list: LineListJson; rows: LineRowJson[] };
	'DELETE /api/v1/projects/:projectId/line-lists/:lineListId': null;
	'GET /api/v1/projects/:projectId/identifications': { identifications: IdentificationJson[] };
	'PUT /api/v1/projects/:projectId/identifications': { identification: IdentificationJson };
	'POST /api/v1/projects/:projectId/match': SavedMatchResponse;
	'GET /api/v1/projects/:projectId/exports/identified': null;
	'GET /api/v1/projects/:projectId/exports/unobserved': null;
}

export type RouteKey = keyof ApiResponses;

/** Date fields as the server holds them before JSON turns them into ISO strings. */
type DateKeys = 'createdAt' | 'updatedAt' | 'since' | 'lastUsedAt' | 'expiresAt' | 'sentAt';

/** What a handler may pass for a body of type T: the same, but with Date objects where the JSON has dates. */
export type Sendable<T> = T extends (infer U)[]
	? Sendable<U>[]
	: T extends object
		? { [K in keyof T]: K extends DateKeys ? T[K] | Date : Sendable<T[K]> }
		: T;

/** One line of a project's activity log (GET /api/v1/projects/:projectId/activity). */
export interface ActivityJson {
	id: number;
	actorId: string | null;
	actorName: string;
	/** One of the kinds in src/lib/activity.ts. */
	kind: string;
	summary: string;
	subject: string | null;
	createdAt: string;
}

// ---------------------------------------------------------------- saved level and line lists

export interface LevelListJson {
	id: string;
	name: string;
	source: 'upload' | 'shelf';
	/** The Shelf entries a 'shelf' list was made from. */
	sourceEntries: string[];
	rowCount: number;
	version: number;
	createdAt: string;
	createdBy: string | null;
}

export interface LineListJson {
	id: string;
	name: string;
	source: 'upload';
	rowCount: number;
	version: number;
	createdAt: string;
	createdBy: string | null;
}

/** A level as read from a file; its JSON is the parsed row as it is (one definition, in $lib/lines/uploads). */
export type UploadedLevelJson = UploadedLevel;

export interface LevelRowJson extends UploadedLevelJson {
	id: number;
	/** 1 = the file's first data row. */
	position: number;
}

/** A line as read from a file; its JSON is the parsed row as it is (one definition, in $lib/lines/uploads). */
export type UploadedLineJson = UploadedLine;

export interface LineRowJson extends UploadedLineJson {
	id: number;
	position: number;
}

/** What an upload read: the first rows, the problems (row 1 = first data row, 0 = the header) and their count. */
export interface UploadPreviewJson<T> {
	rowCount: number;
	first: T[];
	problems: { row: number; column: string; message: string }[];
	problemCount: number;
}

export interface IdentificationJson {
	id: string;
	lineId: number;
	lineListId: string;
	upperLevelId: number;
	lowerLevelId: number;
	levelListId: string;
	type: TransitionType;
	/** σ observed − σ Ritz, cm⁻¹, computed by the server. */
	residual: number | null;
	status: 'accepted' | 'rejected';
	note: string;
	version: number;
	updatedAt: string;
	updatedBy: string | null;
}

/** The matcher on saved lists: indices of `matches` and `unobserved` point into `levelIds` / `lineIds`. */
export type SavedMatchResponse = MatchResult & {
	levelIds: number[];
	lineIds: number[];
	identifications: IdentificationJson[];
	tolerance: Tolerance;
	types: TransitionType[];
	caution: string;
};
