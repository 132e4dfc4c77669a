/**
 * Backup and restore of one project as a single versioned JSON file.
 *
 * `exportProject` (owners only) writes everything the project holds: its name and description,
 * the members' roles by e-mail, every Shelf entry with its level notes, the notes' history (the
 * `noteHistory` section, services/note-history.ts) and the activity log.
 * People are written by e-mail, never by id, so a file restores on another server.
 *
 * `importProject` reads such a file into a NEW project owned by the importer, in one transaction:
 * members are mapped by e-mail where an account exists (the others are reported as not restored),
 * and authors of entries, notes and log lines are mapped the same way (unknown ones become null,
 * the log keeps the name it had). A file of a newer format version, of another format, or one that
 * is damaged is refused with a message saying what is wrong, and nothing is written.
 *
 * Pending invitations are NOT in the file, on purpose: their tokens (even hashed) must not travel,
 * and a copy restored on another server must not accept links mailed by this one. Owners invite
 * again after a restore; members whose accounts exist come back by e-mail as above.
 *
 * EXTENSION POINT: records of other features (Energy solver parameter sets and fits, uploaded level
 * and line lists, Line matcher identifications, …) join the file as a `BackupSection` in
 * `BACKUP_SECTIONS` below: a key, a zod schema of its data, `dump` (read the project's records) and
 * `restore` (write them into the new project with the transaction given). Their data travels under
 * `sections[key]`; a file holding a section this server does not know is refused rather than
 * restored with records missing. Adding a section does not change the format version; changing
 * the shape of an existing part does (bump BACKUP_VERSION and keep reading the older versions).
 */
import type { ImportReport } from '../../api/types';
import { asc, eq, inArray, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import {
	activityLog,
	levelAnnotations,
	memberships,
	projects,
	shelfEntries,
	users,
	ASSIGNMENT_STATUSES,
	PROJECT_ROLES
} from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest } from '../errors';
import { newId } from '../ids';
import { logActivity, type Tx } from './activity';
import { libraryColumns } from './shelf-library';
import { ACTIVITY_KIND_NAMES, type ActivityKind } from '../../activity';
import { noteHistorySection, recordUntrackedNotes } from './note-history';
import { parameterBackupSection } from './parameter-backup';
import { listsSection } from './lists-backup';

/** What the file says it is. */
export const BACKUP_FORMAT = 'termwright-project';
/**
 * The newest format version this server writes; it reads every version from 1.
 * 2: level notes carry `ref` (their id, which the note history refers to) and `proposedBy`.
 */
export const BACKUP_VERSION = 2;
/** Largest file the import reads, in bytes. */
export const BACKUP_MAX_BYTES = 16 * 1024 * 1024;

/** Maps people between the database (ids) and the file (e-mails), and old ids to new ones. */
export interface BackupContext {
	projectId: string;
	emailOf(userId: string | null): string | null;
	userIdOf(email: string | null): string | null;
	/** Old entry id (as in the file) → new entry id; filled before the sections restore. */
	entryIds: Map<string, string>;
	/** Old note id (a level note's `ref`) → new note id; filled before the sections restore. */
	noteIds: Map<string, string>;
}

/** A part of the file written and read by another feature (see the comment at the top). */
export interface BackupSection<T> {
	key: string;
	/** In words, for messages: "parameter sets and fits". */
	label: string;
	schema: z.ZodType<T>;
	dump(ctx: BackupContext): T;
	restore(tx: Tx, data: T, ctx: BackupContext): void;
}

/** Sections other features register (the Energy solver, Line matcher and uploads join here). */
export const BACKUP_SECTIONS: BackupSection<unknown>[] = [
	noteHistorySection as BackupSection<unknown>,
	parameterBackupSection as BackupSection<unknown>,
	listsSection as BackupSection<unknown>
];

// ------------------------------------------------------------------------------------------ file shape

const isoDate = z.iso.datetime({ offset: true, error: 'must be a date and time in ISO 8601 form' }).transform((s) => new Date(s));
const email = z.string().max(254).nullable();
const text = (max: number) => z.string().max(max, `must be at most ${max} characters`);

const noteSchema = z.strictObject({
	/** The note's id on the server that wrote the file; the note history refers to it (version 2 on). */
	ref: text(64).optional(),
	levelKey: text(80),
	observedEnergy: z.number().finite().nullable(),
	/** The digits as typed; files written before they were kept have none. */
	observedEnergyText: text(40).nullable().default(null),
	uncertainty: z.number().finite().nonnegative().nullable(),
	uncertaintyText: text(40).nullable().default(null),
	/** A note detached by a configuration change, and the configuration it was written for. */
	detached: z.boolean().default(false),
	detachedFrom: text(200).nullable().default(null),
	status: z.enum(ASSIGNMENT_STATUSES),
	comment: text(10000),
	version: z.number().int().positive(),
	/** Who proposed the note's values (version 2 on); files of version 1 have none: the last to change it is taken. */
	proposedBy: email.optional(),
	updatedBy: email,
	updatedAt: isoDate
});

const entrySchema = z.strictObject({
	/** The entry's id on the server that wrote the file; log lines and sections refer to it. */
	ref: text(64),
	title: text(160),
	species: text(20),
	notation: text(200),
	notes: text(10000),
	tags: z.array(text(40)).max(20),
	version: z.number().int().positive(),
	createdBy: email,
	createdAt: isoDate,
	updatedBy: email,
	updatedAt: isoDate,
	levelNotes: z.array(noteSchema)
});

const activitySchema = z.strictObject({
	actor: email,
	actorName: text(200),
	kind: z.enum(ACTIVITY_KIND_NAMES as [ActivityKind, ...ActivityKind[]]),
	summary: text(1000),
	/** "entry:<ref>" or "member:<e-mail>" in the file. */
	subject: text(300).nullable(),
	createdAt: isoDate
});

const backupSchema = z.strictObject({
	format: z.literal(BACKUP_FORMAT),
	version: z.number().int().min(1).max(BACKUP_VERSION),
	exportedAt: isoDate,
	exportedBy: email,
	project: z.strictObject({ name: text(120).min(1), description: text(2000), createdBy: email, createdAt: isoDate, updatedAt: isoDate }),
	members: z.array(z.strictObject({ email: z.string().max(254), name: text(80), role: z.enum(PROJECT_ROLES), since: isoDate })),
	entries: z.array(entrySchema),
	activity: z.array(activitySchema),
	sections: z.record(z.string(), z.unknown())
});

export type ProjectBackup = z.input<typeof backupSchema>;

// ------------------------------------------------------------------------------------------ export

function makeContext(projectId: string): BackupContext {
	const emails = new Map<string, string | null>();
	const ids = new Map<string, string | null>();
	return {
		projectId,
		emailOf(userId) {
			if (!userId) return null;
			if (!emails.has(userId)) emails.set(userId, db.select({ e: users.email }).from(users).where(eq(users.id, userId)).get()?.e ?? null);
			return emails.get(userId)!;
		},
		userIdOf(address) {
			if (!address) return null;
			const key = address.trim().toLowerCase();
			if (!ids.has(key)) ids.set(key, db.select({ id: users.id }).from(users).where(eq(users.email, key)).get()?.id ?? null);
			return ids.get(key)!;
		},
		entryIds: new Map(),
		noteIds: new Map()
	};
}

const iso = (d: Date) => d.toISOString();

/** "member:<userId>" → "member:<e-mail>" and back; entry subjects map through the entry ids. */
function subjectToFile(subject: string | null, ctx: BackupContext): string | null {
	if (subject?.startsWith('member:')) return `member:${ctx.emailOf(subject.slice(7)) ?? 'unknown'}`;
	return subject;
}

function subjectFromFile(subject: string | null, ctx: BackupContext): string | null {
	if (subject?.startsWith('member:')) {
		const id = ctx.userIdOf(subject.slice(7));
		return id ? `member:${id}` : null;
	}
	if (subject?.startsWith('entry:')) {
		const id = ctx.entryIds.get(subject.slice(6));
		return id ? `entry:${id}` : subject;
	}
	return subject;
}

/**
 * The whole project as a backup object (JSON.stringify it to write the file). Owners only.
 * @example JSON.stringify(exportProject(owner, projectId), null, 1)
 */
export function exportProject(actor: Actor, projectId: string): ProjectBackup {
	const { project } = projectAccess(actor, projectId, 'owner');
	const ctx = makeContext(projectId);
	// One read transaction, so the file is one consistent moment of the project.
	return db.transaction((tx) => {
		const members = tx
			.select({ email: users.email, name: users.name, role: memberships.role, since: memberships.createdAt })
			.from(memberships)
			.innerJoin(users, eq(users.id, memberships.userId))
			.where(eq(memberships.projectId, projectId))
			.orderBy(asc(users.email))
			.all();
		const entries = tx
			.select()
			.from(shelfEntries)
			.where(eq(shelfEntries.projectId, projectId))
			.orderBy(asc(shelfEntries.createdAt), sql`${shelfEntries}.rowid`)
			.all();
		const notes = entries.length
			? tx
					.select()
					.from(levelAnnotations)
					.where(
						inArray(
							levelAnnotations.entryId,
							entries.map((e) => e.id)
						)
					)
					.orderBy(asc(levelAnnotations.levelKey), sql`${levelAnnotations}.rowid`)
					.all()
			: [];
		const log = tx.select().from(activityLog).where(eq(activityLog.projectId, projectId)).orderBy(asc(activityLog.id)).all();
		const sections: Record<string, unknown> = {};
		for (const s of BACKUP_SECTIONS) sections[s.key] = s.dump(ctx);
		return {
			format: BACKUP_FORMAT,
			version: BACKUP_VERSION,
			exportedAt: iso(new Date()),
			exportedBy: actor.email,
			project: {
				name: project.name,
				description: project.description,
				createdBy: ctx.emailOf(project.createdBy),
				createdAt: iso(project.createdAt),
				updatedAt: iso(project.updatedAt)
			},
			members: members.map((m) => ({ ...m, since: iso(m.since) })),
			entries: entries.map((e) => ({
				ref: e.id,
				title: e.title,
				species: e.species,
				notation: e.notation,
				notes: e.notes,
				tags: e.tags,
				version: e.version,
				createdBy: ctx.emailOf(e.createdBy),
				createdAt: iso(e.createdAt),
				updatedBy: ctx.emailOf(e.updatedBy),
				updatedAt: iso(e.updatedAt),
				levelNotes: notes
					.filter((n) => n.entryId === e.id)
					.map(({ id, entryId: _entry, proposedBy, updatedBy, updatedAt, ...n }) => ({
						ref: id,
						...n,
						proposedBy: ctx.emailOf(proposedBy),
						updatedBy: ctx.emailOf(updatedBy),
						updatedAt: iso(updatedAt)
					}))
			})),
			activity: log.map((l) => ({
				actor: ctx.emailOf(l.actorId),
				actorName: l.actorName,
				kind: l.kind,
				summary: l.summary,
				subject: subjectToFile(l.subject, ctx),
				createdAt: iso(l.createdAt)
			})),
			sections
		};
	});
}

/** A file name for the backup: termwright-<project>-<date>.json */
export function backupFileName(name: string, at = new Date()) {
	const slug =
		name
			.replace(/[^A-Za-z0-9]+/g, '-')
			.replace(/^-|-$/g, '')
			.slice(0, 60) || 'project';
	return `termwright-${slug}-${at.toISOString().slice(0, 10)}.json`;
}

// ------------------------------------------------------------------------------------------ import

/** The file's text as a checked backup, or a 400 saying what is wrong with it. */
export function parseBackup(fileText: string): z.output<typeof backupSchema> {
	if (fileText.length > BACKUP_MAX_BYTES)
		throw badRequest(`The file is over ${BACKUP_MAX_BYTES / 1024 / 1024} MB; a project backup must be smaller`);
	let raw: unknown;
	try {
		raw = JSON.parse(fileText);
	} catch (e) {
		throw badRequest(
			`The file is not valid JSON (${e instanceof Error ? e.message : 'unreadable'}); it may be damaged or cut short. Nothing was imported.`
		);
	}
	if (raw === null || typeof raw !== 'object' || Array.isArray(raw) || (raw as { format?: unknown }).format !== BACKUP_FORMAT)
		throw badRequest(`This is not a Termwright project backup (its "format" should be "${BACKUP_FORMAT}"). Nothing was imported.`);
	const version = (raw as { version?: unknown }).version;
	if (typeof version !== 'number' || !Number.isInteger(version) || version < 1)
		throw badRequest('The backup has no valid format "version" (a whole number from 1); it may be damaged. Nothing was imported.');
	if (version > BACKUP_VERSION)
		throw badRequest(
			`This backup was written in format version ${version} by a newer Termwright; this server reads versions up to ${BACKUP_VERSION}. Update Termwright here, then import it. Nothing was imported.`
		);
	const result = backupSchema.safeParse(raw);
	if (!result.success) {
		const issue = result.error.issues[0];
		const where = issue.path.length ? issue.path.join('.') : 'the file';
		throw badRequest(`The backup is damaged at ${where}: ${issue.message}. Nothing was imported.`, { path: where });
	}
	const unknownSection = Object.keys(result.data.sections).find((k) => !BACKUP_SECTIONS.some((s) => s.key === k));
	if (unknownSection)
		throw badRequest(
			`The backup holds records ("${unknownSection}") that this server cannot restore; update Termwright here, then import it. Nothing was imported.`
		);
	return result.data;
}

/**
 * Creates a new project from a backup file's text, owned by `actor`, in one transaction.
 * Throws a 400 (nothing written) for a damaged file, another format or a newer version.
 */
export function importProject(actor: Actor, fileText: string): ImportReport {
	const file = parseBackup(fileText);
	const projectId = newId();
	const ctx = makeContext(projectId);
	const members: ImportReport['members'] = [{ email: actor.email, role: 'owner' }];
	const notRestored: ImportReport['notRestored'] = [];
	let levelNotes = 0;

	db.transaction((tx) => {
		tx.insert(projects)
			.values({ id: projectId, ...file.project, createdBy: ctx.userIdOf(file.project.createdBy) })
			.run();
		// The importer owns the copy; when the file lists them too, their membership keeps its date.
		const ownSince = file.members.find((m) => ctx.userIdOf(m.email) === actor.id)?.since;
		tx.insert(memberships)
			.values({ projectId, userId: actor.id, role: 'owner', ...(ownSince ? { createdAt: ownSince } : {}) })
			.run();
		for (const m of file.members) {
			const userId = ctx.userIdOf(m.email);
			if (userId === actor.id) continue;
			if (!userId) {
				notRestored.push({ email: m.email, name: m.name, role: m.role });
				continue;
			}
			tx.insert(memberships).values({ projectId, userId, role: m.role, createdAt: m.since }).run();
			members.push({ email: m.email, role: m.role });
		}
		for (const e of file.entries) {
			const id = newId();
			ctx.entryIds.set(e.ref, id);
			const { ref: _ref, levelNotes: notes, createdBy, updatedBy, ...fields } = e;
			tx.insert(shelfEntries)
				.values({
					id,
					projectId,
					...fields,
					...libraryColumns(fields.notation),
					createdBy: ctx.userIdOf(createdBy),
					updatedBy: ctx.userIdOf(updatedBy)
				})
				.run();
			for (const { ref, proposedBy, ...n } of notes) {
				const noteId = newId();
				if (ref) ctx.noteIds.set(ref, noteId);
				const updatedBy = ctx.userIdOf(n.updatedBy);
				tx.insert(levelAnnotations)
					.values({
						...n,
						id: noteId,
						entryId: id,
						updatedBy,
						proposedBy: proposedBy === undefined ? updatedBy : ctx.userIdOf(proposedBy)
					})
					.run();
				levelNotes++;
			}
		}
		for (const l of file.activity) {
			tx.insert(activityLog)
				.values({
					projectId,
					actorId: ctx.userIdOf(l.actor),
					actorName: l.actorName,
					kind: l.kind,
					summary: l.summary,
					subject: subjectFromFile(l.subject, ctx),
					createdAt: l.createdAt
				})
				.run();
		}
		for (const s of BACKUP_SECTIONS) {
			if (!(s.key in file.sections)) continue;
			const parsed = s.schema.safeParse(file.sections[s.key]);
			if (!parsed.success)
				throw badRequest(`The backup's ${s.label} are damaged: ${parsed.error.issues[0]?.message}. Nothing was imported.`);
			s.restore(tx, parsed.data, ctx);
		}
		// A file of format 1 has no note history: each note's history starts with its state in the file.
		recordUntrackedNotes(tx, projectId);
		const lost = notRestored.length
			? `; ${notRestored.length} member${notRestored.length === 1 ? '' : 's'} without an account here not restored`
			: '';
		logActivity(tx, {
			projectId,
			actor,
			kind: 'project.restored',
			summary: `restored the project from a backup of ${file.exportedAt.toISOString().slice(0, 10)} (${file.entries.length} entries, ${levelNotes} level notes${lost})`
		});
	});
	return {
		projectId,
		name: file.project.name,
		entries: file.entries.length,
		levelNotes,
		activity: file.activity.length,
		members,
		notRestored
	};
}
