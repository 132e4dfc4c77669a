/**
 * Termwright's tables. One place for the whole schema; drizzle-kit generates the
 * SQL migrations in drizzle/ from this file (`npm run db:generate`).
 */
import { sql } from 'drizzle-orm';
import { index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ACTIVITY_KIND_NAMES, type ActivityKind } from '../../activity';
import { NOTE_CHANGE_NAMES, type NoteChange } from '../../review';

const now = sql`(unixepoch() * 1000)`;

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
	createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)
});

/** Lucia's session table: id, user_id, expires_at (seconds since the epoch). */
export const sessions = sqliteTable(
	'sessions',
	{
		id: text('id').primaryKey(),
		userId: text('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		expiresAt: integer('expires_at').notNull()
	},
	(t) => [index('sessions_user_idx').on(t.userId)]
);

export const projects = sqliteTable('projects', {
	id: text('id').primaryKey(),
	name: text('name').notNull(),
	description: text('description').notNull().default(''),
	createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
	createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now),
	updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now)
});

export const memberships = sqliteTable(
	'memberships',
	{
		projectId: text('project_id')
			.notNull()
			.references(() => projects.id, { onDelete: 'cascade' }),
		userId: text('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		role: text('role', { enum: PROJECT_ROLES }).notNull(),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)
	},
	(t) => [primaryKey({ columns: [t.projectId, t.userId] }), index('memberships_user_idx').on(t.userId)]
);

/** A saved configuration on a project's Shelf. `version` guards against stale edits. */
export const shelfEntries = sqliteTable(
	'shelf_entries',
	{
		id: text('id').primaryKey(),
		projectId: text('project_id')
			.notNull()
			.references(() => projects.id, { onDelete: 'cascade' }),
		title: text('title').notNull(),
		species: text('species').notNull().default(''),
		/** The notation exactly as the user typed it. */
		notation: text('notation').notNull(),
		notes: text('notes').notNull().default(''),
		/** JSON array of tag strings. */
		tags: text('tags', { mode: 'json' }).$type<string[]>().notNull().default([]),
		version: integer('version').notNull().default(1),
		createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now),
		updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
		updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now),
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
		entryId: text('entry_id')
			.notNull()
			.references(() => shelfEntries.id, { onDelete: 'cascade' }),
		levelKey: text('level_key').notNull(),
		/** Observed energy in cm⁻¹ above the ground level. */
		observedEnergy: real('observed_energy'),
		/** The observed energy's digits as typed ("1880", "19500.12345", "-12400"); shown and exported as is. */
		observedEnergyText: text('observed_energy_text'),
		/** One-sigma uncertainty of the observed energy, cm⁻¹. */
		uncertainty: real('uncertainty'),
		uncertaintyText: text('uncertainty_text'),
		/**
		 * True when the entry's configuration changed after the note was written: the note keeps its
		 * old level key and waits to be reattached to a level of the new configuration, or deleted.
		 */
		detached: integer('detached', { mode: 'boolean' }).notNull().default(false),
		/** The configuration (as typed) the note was written for, when detached. */
		detachedFrom: text('detached_from'),
		status: text('status', { enum: ASSIGNMENT_STATUSES }).notNull().default('proposed'),
		comment: text('comment').notNull().default(''),
		version: integer('version').notNull().default(1),
		/**
		 * Who proposed the note's present values (energy, uncertainty, level): the review rule
		 * (src/lib/review.ts) lets anyone but this person confirm it.
		 */
		proposedBy: text('proposed_by').references(() => users.id, { onDelete: 'set null' }),
		updatedBy: text('updated_by').references(() => users.id, { onDelete: 'set null' }),
		updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull().default(now)
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
		projectId: text('project_id')
			.notNull()
			.references(() => projects.id, { onDelete: 'cascade' }),
		entryId: text('entry_id')
			.notNull()
			.references(() => shelfEntries.id, { onDelete: 'cascade' }),
		levelKey: text('level_key').notNull(),
		observedEnergy: real('observed_energy'),
		observedEnergyText: text('observed_energy_text'),
		uncertainty: real('uncertainty'),
		uncertaintyText: text('uncertainty_text'),
		status: text('status', { enum: ASSIGNMENT_STATUSES }).notNull(),
		comment: text('comment').notNull().default(''),
		detached: integer('detached', { mode: 'boolean' }).notNull().default(false),
		detachedFrom: text('detached_from'),
		version: integer('version').notNull(),
		proposedBy: text('proposed_by').references(() => users.id, { onDelete: 'set null' }),
		change: text('change', { enum: NOTE_CHANGE_NAMES as [NoteChange, ...NoteChange[]] }).notNull(),
		actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
		actorName: text('actor_name').notNull(),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)
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
	createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)
});

/** One-time password reset links; only the SHA-256 of the token is stored. */
export const passwordResets = sqliteTable('password_resets', {
	tokenHash: text('token_hash').primaryKey(),
	userId: text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull()
});

/** Personal API tokens for scripts (`Authorization: Bearer tw_…`); only the SHA-256 is stored. */
export const apiTokens = sqliteTable(
	'api_tokens',
	{
		id: text('id').primaryKey(),
		userId: text('user_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		name: text('name').notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now),
		lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' })
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
		projectId: text('project_id')
			.notNull()
			.references(() => projects.id, { onDelete: 'cascade' }),
		actorId: text('actor_id').references(() => users.id, { onDelete: 'set null' }),
		actorName: text('actor_name').notNull(),
		kind: text('kind', { enum: ACTIVITY_KIND_NAMES as [ActivityKind, ...ActivityKind[]] }).notNull(),
		summary: text('summary').notNull(),
		subject: text('subject'),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now)
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
		projectId: text('project_id')
			.notNull()
			.references(() => projects.id, { onDelete: 'cascade' }),
		email: text('email').notNull(),
		role: text('role', { enum: PROJECT_ROLES }).notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		invitedBy: text('invited_by').references(() => users.id, { onDelete: 'set null' }),
		/** Whether the last mail with the link reached the mail server. */
		mailStatus: text('mail_status', { enum: ['sent', 'failed'] })
			.notNull()
			.default('sent'),
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull().default(now),
		sentAt: integer('sent_at', { mode: 'timestamp_ms' }).notNull().default(now),
		expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
		acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
		acceptedBy: text('accepted_by').references(() => users.id, { onDelete: 'set null' }),
		revokedAt: integer('revoked_at', { mode: 'timestamp_ms' })
	},
	(t) => [index('invitations_project_idx').on(t.projectId, t.email)]
);
