/**
 * What awaits review in a project: attached level notes that are proposed (someone other than the
 * proposer confirms them, src/lib/review.ts) or disputed (someone settles them). Each says whether
 * the person asking proposed it, so the page can say who may confirm it. Only editors and owners
 * may confirm, so only they may ask (viewers get 403).
 */
import { and, asc, count, eq, inArray, sql } from 'drizzle-orm';
import { z } from 'zod';
import { db } from '../db';
import { levelAnnotations, shelfEntries, users } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { parseInput } from '../validation';
import { withTexts } from './annotations';

export const REVIEW_PAGE_MAX = 200;

const reviewQuerySchema = z.object({
	limit: z.coerce
		.number({ error: 'limit must be a whole number from 1 to 200' })
		.int('limit must be a whole number from 1 to 200')
		.min(1, 'limit must be a whole number from 1 to 200')
		.max(REVIEW_PAGE_MAX, 'limit must be a whole number from 1 to 200')
		.default(50)
});

/**
 * Proposed and disputed notes of the project, longest waiting first: at most `limit` (1 … 200,
 * default 50) of them, and how many there are in all. `yours`: `actor` proposed it, so cannot
 * confirm it (a note whose proposer's account is gone is nobody's: anyone may confirm it).
 */
export function awaitingReview(actor: Actor, projectId: string, query: Record<string, unknown> = {}) {
	projectAccess(actor, projectId, 'editor');
	const { limit } = parseInput(reviewQuerySchema, Object.fromEntries(Object.entries(query).filter(([, v]) => v !== '')));
	const waiting = and(
		eq(shelfEntries.projectId, projectId),
		inArray(levelAnnotations.status, ['proposed', 'disputed']),
		eq(levelAnnotations.detached, false)
	);
	const items = db
		.select({
			id: levelAnnotations.id,
			entryId: shelfEntries.id,
			entryTitle: shelfEntries.title,
			species: shelfEntries.species,
			notation: shelfEntries.notation,
			levelKey: levelAnnotations.levelKey,
			observedEnergy: levelAnnotations.observedEnergy,
			observedEnergyText: levelAnnotations.observedEnergyText,
			uncertainty: levelAnnotations.uncertainty,
			uncertaintyText: levelAnnotations.uncertaintyText,
			comment: levelAnnotations.comment,
			// Only these two are selected (`waiting`).
			status: sql<'proposed' | 'disputed'>`${levelAnnotations.status}`,
			proposedBy: users.name,
			yours: sql<boolean>`coalesce(${levelAnnotations.proposedBy} = ${actor.id}, 0)`.mapWith(Boolean),
			updatedAt: levelAnnotations.updatedAt,
			version: levelAnnotations.version
		})
		.from(levelAnnotations)
		.innerJoin(shelfEntries, eq(shelfEntries.id, levelAnnotations.entryId))
		.leftJoin(users, eq(users.id, levelAnnotations.proposedBy))
		.where(waiting)
		.orderBy(asc(levelAnnotations.updatedAt), sql`${levelAnnotations}.rowid`)
		.limit(limit)
		.all()
		.map(withTexts);
	const total = db
		.select({ n: count() })
		.from(levelAnnotations)
		.innerJoin(shelfEntries, eq(shelfEntries.id, levelAnnotations.entryId))
		.where(waiting)
		.get()!.n;
	return { items, total };
}
