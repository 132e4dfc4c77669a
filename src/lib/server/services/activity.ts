/**
 * The activity log of a project. Every service that changes project data calls `logActivity` with
 * the transaction of its write, so the change and its log entry are saved together or not at all.
 * Reading the log needs the viewer role; it is paged newest first by an opaque cursor.
 */
import { and, desc, eq, lt } from 'drizzle-orm';
import { z } from 'zod';
import { db, type Db } from '../db';
import { activityLog } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { badRequest } from '../errors';
import { parseInput } from '../validation';
import { ACTIVITY_KIND_NAMES, type ActivityKind } from '../../activity';

/** A Drizzle database or the transaction handle passed to `db.transaction((tx) => …)`. */
export type Tx = Pick<Db, 'insert' | 'select' | 'update' | 'delete'>;

export interface ActivityInput {
	projectId: string;
	/** Who did it; `name` is kept as it is now. */
	actor: Pick<Actor, 'id' | 'name'>;
	kind: ActivityKind;
	/** A short description in words, e.g. 'added "Fe II 3d6 4s" to the Shelf'. */
	summary: string;
	/** What changed, as "type:id" ("entry:abc", "member:xyz"). */
	subject?: string | null;
}

/** Longest summary kept; longer ones are cut with an ellipsis (titles can be 160 characters). */
const SUMMARY_MAX = 300;

/**
 * Writes one log entry with `tx`, the transaction of the change it records (the caller's
 * `db.transaction((tx) => …)`), so a change that fails or rolls back leaves no entry.
 * @example db.transaction((tx) => { tx.insert(shelfEntries)…; logActivity(tx, { projectId, actor, kind: 'entry.created', summary }); })
 */
export function logActivity(tx: Tx, input: ActivityInput): void {
	const summary = input.summary.length > SUMMARY_MAX ? input.summary.slice(0, SUMMARY_MAX - 1) + '…' : input.summary;
	tx.insert(activityLog)
		.values({
			projectId: input.projectId,
			actorId: input.actor.id,
			actorName: input.actor.name,
			kind: input.kind,
			summary,
			subject: input.subject ?? null
		})
		.run();
}

/**
 * The names of the fields a patch really changes, in words: "the title and tags", "nothing".
 * @example changedFields({ title: 'a', tags: [] }, { title: 'b', tags: [] }) // 'the title'
 */
export function changedFields(before: Record<string, unknown>, patch: Record<string, unknown>): string {
	const names = Object.keys(patch).filter((k) => patch[k] !== undefined && JSON.stringify(patch[k]) !== JSON.stringify(before[k]));
	if (names.length === 0) return 'nothing';
	const words = names.map((k) => FIELD_WORDS[k] ?? k);
	return 'the ' + (words.length === 1 ? words[0] : `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`);
}

const FIELD_WORDS: Record<string, string> = { notation: 'configuration', notes: 'notes', tags: 'tags', title: 'title', species: 'species' };

export const ACTIVITY_PAGE_MAX = 200;
const ACTIVITY_PAGE_DEFAULT = 50;

export const activityQuerySchema = z.object({
	limit: z.coerce
		.number({ error: 'limit must be a number' })
		.int('limit must be a whole number')
		.min(1, 'limit must be at least 1')
		.max(ACTIVITY_PAGE_MAX, `limit must be at most ${ACTIVITY_PAGE_MAX}`)
		.default(ACTIVITY_PAGE_DEFAULT),
	cursor: z.string().max(40, 'cursor is too long').optional(),
	actor: z.string().max(64, 'actor must be a user id').optional(),
	kind: z
		.enum(ACTIVITY_KIND_NAMES as [ActivityKind, ...ActivityKind[]], {
			error: `kind must be one of ${ACTIVITY_KIND_NAMES.join(', ')}`
		})
		.optional()
});

const encodeCursor = (id: number) => `a${id.toString(36)}`;

function decodeCursor(cursor: string): number {
	const m = /^a([0-9a-z]{1,12})$/.exec(cursor);
	if (!m) throw badRequest('cursor is not one this server gave out: send the nextCursor of the previous page', { field: 'cursor' });
	return parseInt(m[1], 36);
}

/** Drops empty strings (an empty filter box) so they mean "no filter". */
const withoutEmpty = (query: Record<string, unknown>) => Object.fromEntries(Object.entries(query).filter(([, v]) => v !== '' && v != null));

/**
 * One page of a project's log, newest first: `limit` (1 … 200, default 50) entries after `cursor`
 * (the `nextCursor` of the page before), optionally only one person's (`actor`, a user id) or one
 * `kind`'s. Viewers and up may read; non-members get 404.
 */
export function listActivity(actor: Actor, projectId: string, query: Record<string, unknown> = {}) {
	projectAccess(actor, projectId, 'viewer');
	const { limit, cursor, actor: who, kind } = parseInput(activityQuerySchema, withoutEmpty(query));
	const rows = db
		.select({
			id: activityLog.id,
			actorId: activityLog.actorId,
			actorName: activityLog.actorName,
			kind: activityLog.kind,
			summary: activityLog.summary,
			subject: activityLog.subject,
			createdAt: activityLog.createdAt
		})
		.from(activityLog)
		.where(
			and(
				eq(activityLog.projectId, projectId),
				cursor ? lt(activityLog.id, decodeCursor(cursor)) : undefined,
				who ? eq(activityLog.actorId, who) : undefined,
				kind ? eq(activityLog.kind, kind) : undefined
			)
		)
		.orderBy(desc(activityLog.id))
		.limit(limit + 1)
		.all();
	const page = rows.slice(0, limit);
	const last = page[page.length - 1];
	return { items: page, nextCursor: rows.length > limit && last ? encodeCursor(last.id) : null };
}

/** The people who appear in a project's log (for the filter), by name. */
export function activityActors(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'viewer');
	return db
		.selectDistinct({ id: activityLog.actorId, name: activityLog.actorName })
		.from(activityLog)
		.where(eq(activityLog.projectId, projectId))
		.orderBy(activityLog.actorName)
		.all()
		.filter((r): r is { id: string; name: string } => r.id !== null);
}

/**
 * A level note's change in words: 'confirmed ³P J=1 of “O III ground”: 112 cm⁻¹ ± 0.2'.
 * Energies are written as the note holds them (a number or the digits as typed).
 */
export function noteSummary(
	verb: string,
	level: string,
	entryTitle: string,
	note: { observedEnergy?: unknown; uncertainty?: unknown; status?: string }
): string {
	const text = (v: unknown) =>
		v === null || v === undefined ? null : typeof v === 'object' && 'text' in v ? String((v as { text: unknown }).text) : String(v);
	const energy = text(note.observedEnergy);
	const sigma = text(note.uncertainty);
	const value = energy ? `: ${energy}${sigma ? ` ± ${sigma}` : ''} cm⁻¹` : '';
	// "confirmed …" and "disputed …" say the status already.
	const status = verb === 'confirmed' || verb === 'disputed' ? '' : ` (${note.status ?? 'proposed'})`;
	return `${verb} the note on ${level} of “${entryTitle}”${value}${status}`;
}
