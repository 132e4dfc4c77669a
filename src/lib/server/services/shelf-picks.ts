/**
 * The configurations on the Shelves a person can read, for pickers on the public tools (the
 * Transition finder): newest first, with the entry's title, species, project and parity. Only
 * projects the person is a member of are read — the membership join is the role check (any role
 * may read a Shelf).
 */
import { desc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { memberships, projects, shelfEntries } from '../db/schema';
import type { Actor } from '../access';

export interface ShelfPick {
	entryId: string;
	projectId: string;
	projectName: string;
	title: string;
	species: string;
	notation: string;
	parity: string | null;
}

/** At most `limit` picks (default 200), newest change first. */
export function shelfPicks(actor: Actor, limit = 200): ShelfPick[] {
	return (
		db
			.select({
				entryId: shelfEntries.id,
				projectId: projects.id,
				projectName: projects.name,
				title: shelfEntries.title,
				species: shelfEntries.species,
				notation: shelfEntries.notation,
				parity: shelfEntries.parity
			})
			.from(shelfEntries)
			.innerJoin(projects, eq(projects.id, shelfEntries.projectId))
			.innerJoin(memberships, eq(memberships.projectId, shelfEntries.projectId))
			.where(eq(memberships.userId, actor.id))
			// Entries saved in the same millisecond keep the order they were written in (rowid).
			.orderBy(desc(shelfEntries.updatedAt), sql`shelf_entries.rowid desc`)
			.limit(Math.max(1, Math.min(limit, 1000)))
			.all()
	);
}
