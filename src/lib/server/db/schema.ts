/**
 * Termwright's tables. One place for the whole schema; drizzle-kit generates the
 * SQL migrations in drizzle/ from this file (`npm run db:generate`).
 */
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex, type AnySQLiteColumn } from 'drizzle-orm/sqlite-core';
import { ACTIVITY_KIND_NAMES, type ActivityKind } from '../../activity';
import { NOTE_CHANGE_NAMES, type NoteChange } from '../../review';
import type { FitResult } from '../../physics/fit';

const now = sql`(unixepoch() * 1000)`;

// Column builders for the columns many tables share. Each call makes a fresh column (Drizzle
// columns belong to one table); the SQL they generate is the same as when written out.

/** A time in milliseconds since the epoch (Drizzle gives a Date). */
const timeMs = (name: string) => integer(name, { mode: 'timestamp_ms' });
/** A time stamped by SQLite when the row is written. */
const stampedAt = (name: string) => timeMs(name).notNull().default(now);
/** A person who did something to the row; the row stays (with null) when the account goes. */
const userWho = (name: string) => text(name).references(() => users.id, { onDelete: 'set null' });
/** The account the row belongs to; the row goes with the account. */
const ownerUserId = () =>
	text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' });
/** The project the row belongs to; the row goes with the project. */
const ownerProjectId = () =>
	text('project_id')
		.notNull()
		.references(() => projects.id, { onDelete: 'cascade' });
/** The Shelf entry the row belongs to; the row goes with the entry. */
const ownerEntryId = () =>
	text('entry_id')
		.notNull()
		.references(() => shelfEntries.id, { onDelete: 'cascade' });
/** Optimistic locking: a change sends the version it read (409 when stale). */
const versionColumn = () => integer('version').notNull().default(1);
/** Who made the row and when. */
const createdColumns = () => ({ createdBy: userWho('created_by'), createdAt: stampedAt('created_at') });
/** Who last changed the row and when. */
const updatedColumns = () => ({ updatedBy: userWho('updated_by'), updatedAt: stampedAt('updated_at') });
/** What a level note says: which level (its key) and the observed values, each with its digits as typed. */
const noteLevelColumns = () => ({
	levelKey: text('level_key').notNull(),
	/** Observed energy in cm⁻¹ above the ground level. */
	observedEnergy: real('observed_energy'),
	/** The observed energy's digits as typed ("1880", "19500.12345", "-12400"); shown and exported as is. */
	observedEnergyText: text('observed_energy_text'),
	/** One-sigma uncertainty of the observed energy, cm⁻¹. */
	uncertainty: real('uncertainty'),
	uncertaintyText: text('uncertainty_text')
});
const detachedColumns = () => ({
	/**
	 * True when the entry's configuration changed after the note was written: the note keeps its
	 * old level key and waits to be reattached to a level of the new configuration, or deleted.
	 */
	detached: integer('detached', { mode: 'boolean' }).notNull().default(false),
	/** The configuration (as typed) the note was written for, when detached. */
	detachedFrom: text('detached_from')
});
/** The head of a saved list: its id, project and name. */
const listHeadColumns = () => ({ id: text('id').primaryKey(), projectId: ownerProjectId(), name: text('name').notNull() });
/** The tail of a saved list: how many rows it holds, its version, who made it and when. */
const listTailColumns = () => ({
	rowCount: integer('row_count').notNull().default(0),
	version: versionColumn(),
	...createdColumns()
});
/** A row of a saved list: its own id, the list it belongs to (and goes with), its place in the list. */
const listRowHeadColumns = (list: () => AnySQLiteColumn) => ({
	id: integer('id').primaryKey({ autoIncrement: true }),
	listId: text('list_id').notNull().references(list, { onDelete: 'cascade' }),
	/** 1 = the file's first data row; the order of the list. */
	position: integer('position').notNull()
});

export const SITE_ROLES = ['admin', 'member'] as const;
export type SiteRole = (typeof SITE_ROLES)[number];

export const PROJECT_ROLES = ['viewer', 'editor', 'owner'] as const;
export type ProjectRole = (typeof PROJECT_ROLES)[number];

export const ASSIGNMENT_STATUSES = ['proposed', 'confirmed', 'disputed'] as const;
export type AssignmentStatus = (typeof ASSIGNMENT_STATUSES)[number];

export const users = sqliteTable('users', {
	id: text('id').primaryKey(),
	email: text('email').notNull().unique(),
	name: text('name').notNull(),
	passwordHash: text('password_hash').notNull(),
	siteRole: text('site_role', { enum: SITE_ROLES }).notNull().default('member'),
	createdAt: stampedAt('created_at')
});

/** Lucia's session table: id, user_id, expires_at (seconds since the epoch). */
export const sessions = sqliteTable(
	'sessions',
	{
		id: text('id').primaryKey(),
		userId: ownerUserId(),
		expiresAt: integer('expires_at').notNull()
	},
	(t) => [index('sessions_user_idx').on(t.userId)]
);

export const projects = sqliteTable('projects', {
	id: text('id').primaryKey(),
	name: text('name').notNull(),
	description: text('description').notNull().default(''),
	createdBy: userWho('created_by'),
	createdAt: stampedAt('created_at'),
	updatedAt: stampedAt('updated_at')
});

export const memberships = sqliteTable(
	'memberships',
	{
		projectId: ownerProjectId(),
		userId: ownerUserId(),
		role: text('role', { enum: PROJECT_ROLES }).notNull(),
		createdAt: stampedAt('created_at')
	},
	(t) => [primaryKey({ columns: [t.projectId, t.userId] }), index('memberships_user_idx').on(t.userId)]
);

/** A saved configuration on a project's Shelf. `version` guards against stale edits. */
export const shelfEntries = sqliteTable(
	'shelf_entries',
	{
		id: text('id').primaryKey(),
		projectId: ownerProjectId(),
		title: text('title').notNull(),
		species: text('species').notNull().default(''),
		/** The notation exactly as the user typed it. */
		notation: text('notation').notNull(),
		notes: text('notes').notNull().default(''),
		/** JSON array of tag strings. */
		tags: text('tags', { mode: 'json' }).$type<string[]>().notNull().default([]),
		version: versionColumn(),
		...createdColumns(),
		...updatedColumns(),
		/**
		 * Derived from the notation when it is saved, so the library can filter in SQL: the parity
		 * 'even' or 'odd' ('' when the notation no longer parses), null until computed.
		 */
		parity: text('parity'),
		/** JSON array of the open subshells' labels, e.g. ["3d","4s"]; null until computed (see shelf-library.ts). */
		openSubshells: text('open_subshells', { mode: 'json' }).$type<string[]>()
	},
	// The Shelf list filters on the project and pages by (updated_at, id), newest first, or by title (A to Z).
	(t) => [
		index('shelf_project_updated_idx').on(t.projectId, t.updatedAt, t.id),
		index('shelf_project_title_idx').on(t.projectId, sql`${t.title} collate nocase`, t.id)
	]
);

/**
 * A note on one level of a Shelf entry. `levelKey` names the level independently of
 * sort order: "<term label>#<occurrence>|<J>", e.g. "2D#2|5/2".
 */
export const levelAnnotations = sqliteTable(
	'level_annotations',
	{
		id: text('id').primaryKey(),
		entryId: ownerEntryId(),
		...noteLevelColumns(),
		...detachedColumns(),
		status: text('status', { enum: ASSIGNMENT_STATUSES }).notNull().default('proposed'),
		comment: text('comment').notNull().default(''),
		version: versionColumn(),
		/**
		 * Who proposed the note's present values (energy, uncertainty, level): the review rule
		 * (src/lib/review.ts) lets anyone but this person confirm it.
		 */
		proposedBy: userWho('proposed_by'),
		...updatedColumns()
	},
	// One attached note per level; detached notes may share a key with a note of the new configuration.
	(t) => [
		uniqueIndex('annotation_entry_level_idx')
			.on(t.entryId, t.levelKey)
			.where(sql`${t.detached} = 0`),
		index('annotation_entry_idx').on(t.entryId, t.detached)
	]
);

/**
 * The history of level notes: one row per change, holding the note's fields as they were AFTER
 * the change (a deletion keeps the last values), who made it and when, and what kind of change it
 * was (src/lib/review.ts). Written in the transaction of the change (services/note-history.ts).
 * `annotationId` has no foreign key on purpose: a deleted note's history stays readable. Rows go
 * with their entry or project. `actorName` keeps the name the person had then.
 */
export const levelAnnotationHistory = sqliteTable(
	'level_annotation_history',
	{
		id: integer('id').primaryKey({ autoIncrement: true }),
		annotationId: text('annotation_id').notNull(),
		projectId: ownerProjectId(),
		entryId: ownerEntryId(),
		...noteLevelColumns(),
		status: text('status', { enum: ASSIGNMENT_STATUSES }).notNull(),
		comment: text('comment').notNull().default(''),
		...detachedColumns(),
		version: integer('version').notNull(),
		proposedBy: userWho('proposed_by'),
		change: text('change', { enum: NOTE_CHANGE_NAMES as [NoteChange, ...NoteChange[]] }).notNull(),
		actorId: userWho('actor_id'),
		actorName: text('actor_name').notNull(),
		createdAt: stampedAt('created_at')
	},
	(t) => [index('annotation_history_note_idx').on(t.annotationId, t.id), index('annotation_history_project_idx').on(t.projectId, t.id)]
);

export const MAIL_STATUSES = ['caught', 'failed'] as const;
export type MailStatus = (typeof MAIL_STATUSES)[number];

/**
 * Mail as the local catcher received it over SMTP (`status` 'caught', written by mail-catcher.ts
 * in development, demos and tests), and mail the app could not hand to its SMTP server (`status`
 * 'failed', written by mail.ts wherever it runs, so a failed send is never lost silently). A failed
 * row keeps who, what and why but not the body: that would hold a one-time link in plain text.
 */
export const outbox = sqliteTable('outbox', {
	id: integer('id').primaryKey({ autoIncrement: true }),
	to: text('to').notNull(),
	sender: text('sender').notNull().default(''),
	subject: text('subject').notNull(),
	body: text('body').notNull(),
	status: text('status', { enum: MAIL_STATUSES }).notNull().default('caught'),
	/** Why a send failed (the transport's words, with no credentials). */
	error: text('error'),
	createdAt: stampedAt('created_at')
});

/** One-time password reset links; only the SHA-256 of the token is stored. */
export const passwordResets = sqliteTable('password_resets', {
	tokenHash: text('token_hash').primaryKey(),
	userId: ownerUserId(),
	expiresAt: timeMs('expires_at').notNull()
});

/** Personal API tokens for scripts (`Authorization: Bearer tw_…`); only the SHA-256 is stored. */
export const apiTokens = sqliteTable(
	'api_tokens',
	{
		id: text('id').primaryKey(),
		userId: ownerUserId(),
		name: text('name').notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		createdAt: stampedAt('created_at'),
		lastUsedAt: timeMs('last_used_at')
	},
	(t) => [index('api_tokens_user_idx').on(t.userId)]
);

/**
 * The activity log of a project: who changed what, when, in a short description. Written in the
 * same transaction as the change it records (services/activity.ts). `actorName` keeps the name the
 * person had then, so the log still reads when an account is gone. `subject` names what changed
 * ("entry:<id>", "member:<userId>", …) for links and filters. Kinds: src/lib/activity.ts.
 */
export const activityLog = sqliteTable(
	'activity_log',
	{
		id: integer('id').primaryKey({ autoIncrement: true }),
		projectId: ownerProjectId(),
		actorId: userWho('actor_id'),
		actorName: text('actor_name').notNull(),
		kind: text('kind', { enum: ACTIVITY_KIND_NAMES as [ActivityKind, ...ActivityKind[]] }).notNull(),
		summary: text('summary').notNull(),
		subject: text('subject'),
		createdAt: stampedAt('created_at')
	},
	// The log page reads a project newest first (by id), optionally one person's or one kind's.
	(t) => [
		index('activity_project_idx').on(t.projectId, t.id),
		index('activity_project_actor_idx').on(t.projectId, t.actorId, t.id),
		index('activity_project_kind_idx').on(t.projectId, t.kind, t.id)
	]
);

/**
 * Invitations to join a project, sent to an e-mail address with a role. Only the SHA-256 of the
 * one-time token is stored (like password resets). An invitation is pending while it is neither
 * accepted nor revoked and `expiresAt` lies ahead; resending gives it a new token (the old one
 * stops working). Accepted and revoked rows stay, so the members page can say what became of a link.
 */
export const invitations = sqliteTable(
	'invitations',
	{
		id: text('id').primaryKey(),
		projectId: ownerProjectId(),
		email: text('email').notNull(),
		role: text('role', { enum: PROJECT_ROLES }).notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		invitedBy: userWho('invited_by'),
		/** Whether the last mail with the link reached the mail server. */
		mailStatus: text('mail_status', { enum: ['sent', 'failed'] })
			.notNull()
			.default('sent'),
		createdAt: stampedAt('created_at'),
		sentAt: stampedAt('sent_at'),
		expiresAt: timeMs('expires_at').notNull(),
		acceptedAt: timeMs('accepted_at'),
		acceptedBy: userWho('accepted_by'),
		revokedAt: timeMs('revoked_at')
	},
	(t) => [index('invitations_project_idx').on(t.projectId, t.email)]
);

/** Energy parameters as the Energy solver and its API take them (cm⁻¹); mirrors EnergyParametersBody in $lib/api/types. */
export interface StoredEnergyParameters {
	Eav?: number;
	F?: { k: number; a: string; b: string; value: number }[];
	G?: { k: number; a: string; b: string; value: number }[];
	zeta?: { shell: string; value: number }[];
}

/**
 * A named set of Slater and spin–orbit parameters saved with a Shelf entry (services/parameter-sets.ts).
 * Versioned like entries: a change sends the version it read (409 when stale). `notation` is the
 * entry's configuration the set was saved for, so a set stays readable when the entry changes.
 */
export const parameterSets = sqliteTable(
	'parameter_sets',
	{
		id: text('id').primaryKey(),
		entryId: ownerEntryId(),
		name: text('name').notNull(),
		notation: text('notation').notNull(),
		parameters: text('parameters', { mode: 'json' }).$type<StoredEnergyParameters>().notNull(),
		comment: text('comment').notNull().default(''),
		version: versionColumn(),
		...createdColumns(),
		...updatedColumns()
	},
	(t) => [index('parameter_sets_entry_idx').on(t.entryId, t.updatedAt)]
);

/** What a fit was asked: starting values, which parameters were free, linked or bounded, and the observed levels. */
export interface StoredFitRequest {
	parameters: StoredEnergyParameters;
	vary: string[];
	links?: { id: string; to: string; ratio?: number }[];
	bounds?: { id: string; min?: number; max?: number }[];
	observed: { J: string; energy: number; uncertainty?: number; assign?: string | number; levelKey?: string }[];
	/** 'notes': the entry's annotated observed energies; 'typed': a list the user gave. */
	observedFrom: 'notes' | 'typed';
}

/**
 * A saved fit report of a Shelf entry: the request and the engine's answer as it returned them
 * (fitted values ± σ, residuals obs − calc, rms, degrees of freedom), with who ran it and when.
 * Reports are never edited; `rms` and `degreesOfFreedom` are copied out for lists.
 */
export const fitReports = sqliteTable(
	'fit_reports',
	{
		id: text('id').primaryKey(),
		entryId: ownerEntryId(),
		/** The parameter set the fit started from, if any. */
		parameterSetId: text('parameter_set_id').references(() => parameterSets.id, { onDelete: 'set null' }),
		notation: text('notation').notNull(),
		request: text('request', { mode: 'json' }).$type<StoredFitRequest>().notNull(),
		/** FitResult of src/lib/physics/fit.ts, as the engine returned it. */
		result: text('result', { mode: 'json' }).$type<FitResult>().notNull(),
		rms: real('rms').notNull(),
		degreesOfFreedom: integer('degrees_of_freedom').notNull(),
		...createdColumns()
	},
	(t) => [index('fit_reports_entry_idx').on(t.entryId, t.createdAt)]
);

/** Where a level list came from: an uploaded CSV file, or the annotated notes of Shelf entries. */
export const LEVEL_LIST_SOURCES = ['upload', 'shelf'] as const;
export type LevelListSource = (typeof LEVEL_LIST_SOURCES)[number];
export const LINE_UNITS = ['A', 'nm', 'cm-1'] as const;
export type LineUnit = (typeof LINE_UNITS)[number];
export const LINE_MEDIA = ['air', 'vacuum'] as const;
export type LineMedium = (typeof LINE_MEDIA)[number];
export const IDENTIFICATION_STATUSES = ['accepted', 'rejected'] as const;
export type IdentificationStatus = (typeof IDENTIFICATION_STATUSES)[number];
export const IDENTIFICATION_TYPES = ['E1', 'M1', 'E2'] as const;

/**
 * A project's list of observed levels for the Line matcher. Rows are written once, with the list,
 * and never edited (a corrected list is a new upload), so `version` only guards the name.
 * `sourceEntries` holds the Shelf entry ids a 'shelf' list was made from.
 */
export const levelLists = sqliteTable(
	'level_lists',
	{
		...listHeadColumns(),
		source: text('source', { enum: LEVEL_LIST_SOURCES }).notNull(),
		sourceEntries: text('source_entries', { mode: 'json' }).$type<string[]>().notNull().default([]),
		...listTailColumns()
	},
	(t) => [index('level_lists_project_idx').on(t.projectId, t.createdAt)]
);

/** One level of a level list: energy in cm⁻¹ (and its digits as typed), J as text ("3/2"), parity. */
export const levelListRows = sqliteTable(
	'level_list_rows',
	{
		...listRowHeadColumns(() => levelLists.id),
		energy: real('energy').notNull(),
		energyText: text('energy_text').notNull(),
		uncertainty: real('uncertainty'),
		J: text('j').notNull(),
		parity: text('parity', { enum: ['even', 'odd'] }).notNull(),
		configuration: text('configuration').notNull().default(''),
		term: text('term').notNull().default(''),
		g: real('g')
	},
	(t) => [index('level_list_rows_list_idx').on(t.listId, t.position)]
);

/** A project's list of observed lines (uploaded CSV). */
export const lineLists = sqliteTable(
	'line_lists',
	{
		...listHeadColumns(),
		source: text('source', { enum: ['upload'] })
			.notNull()
			.default('upload'),
		...listTailColumns()
	},
	(t) => [index('line_lists_project_idx').on(t.projectId, t.createdAt)]
);

/** One observed line: wavelength (digits as typed) in its unit and medium; uncertainty in the same unit. */
export const lineListRows = sqliteTable(
	'line_list_rows',
	{
		...listRowHeadColumns(() => lineLists.id),
		wavelength: real('wavelength').notNull(),
		wavelengthText: text('wavelength_text').notNull(),
		unit: text('unit', { enum: LINE_UNITS }).notNull(),
		medium: text('medium', { enum: LINE_MEDIA }).notNull(),
		uncertainty: real('uncertainty'),
		intensity: real('intensity'),
		comment: text('comment').notNull().default('')
	},
	(t) => [index('line_list_rows_list_idx').on(t.listId, t.position)]
);

/**
 * An editor's verdict on one candidate of the Line matcher: this line is (accepted) or is not
 * (rejected) the transition between these two levels. Several accepted rows on one line = a blend.
 * One row per (line, upper, lower); a new verdict on the same pair changes it. Rows go with the
 * line or either level (their lists).
 */
export const identifications = sqliteTable(
	'identifications',
	{
		id: text('id').primaryKey(),
		projectId: ownerProjectId(),
		lineId: integer('line_id')
			.notNull()
			.references(() => lineListRows.id, { onDelete: 'cascade' }),
		upperLevelId: integer('upper_level_id')
			.notNull()
			.references(() => levelListRows.id, { onDelete: 'cascade' }),
		lowerLevelId: integer('lower_level_id')
			.notNull()
			.references(() => levelListRows.id, { onDelete: 'cascade' }),
		type: text('type', { enum: IDENTIFICATION_TYPES }).notNull(),
		/** Observed minus Ritz wavenumber, cm⁻¹, when the verdict was given. */
		residual: real('residual'),
		status: text('status', { enum: IDENTIFICATION_STATUSES }).notNull(),
		note: text('note').notNull().default(''),
		version: versionColumn(),
		...updatedColumns()
	},
	(t) => [
		uniqueIndex('identification_pair_idx').on(t.lineId, t.upperLevelId, t.lowerLevelId),
		index('identification_project_idx').on(t.projectId, t.lineId)
	]
);
