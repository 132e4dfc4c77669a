/**
 * The one place where project roles are checked. Every load, form action and API route
 * that touches a project calls `projectAccess` (directly or through a service) first.
 *
 * Rules: owners manage members and the project; editors change content; viewers read;
 * anyone else gets 404, as if the project did not exist.
 */
import { and, eq } from 'drizzle-orm';
import { db } from './db';
import { memberships, projects, type ProjectRole, type SiteRole } from './db/schema';
import { ServiceError } from './errors';

export interface Actor {
	id: string;
	name: string;
	email: string;
	siteRole: SiteRole;
}

const RANK: Record<ProjectRole, number> = { viewer: 1, editor: 2, owner: 3 };

/** True when `role` grants at least what `needed` grants. */
export function roleAtLeast(role: ProjectRole, needed: ProjectRole): boolean {
	return RANK[role] >= RANK[needed];
}

const WHAT_ROLE_ALLOWS: Record<ProjectRole, string> = {
	viewer: 'read this project',
	editor: 'change the content of this project',
	owner: 'manage this project and its members'
};

export function projectAccess(actor: Actor | null, projectId: string, needed: ProjectRole) {
	if (!actor) throw new ServiceError(401, 'Sign in first');
	const row = db
		.select({ project: projects, role: memberships.role })
		.from(projects)
		.innerJoin(memberships, and(eq(memberships.projectId, projects.id), eq(memberships.userId, actor.id)))
		.where(eq(projects.id, projectId))
		.get();
	// Non-members cannot learn that the project exists.
	if (!row) throw new ServiceError(404, 'No such project');
	if (!roleAtLeast(row.role, needed))
		throw new ServiceError(
			403,
			`Your role here is ${row.role}; only ${needed === 'viewer' ? 'a' : 'an'} ${needed} may ${WHAT_ROLE_ALLOWS[needed]}`
		);
	return { project: row.project, role: row.role };
}

export function requireSiteAdmin(actor: Actor | null) {
	if (!actor) throw new ServiceError(401, 'Sign in first');
	if (actor.siteRole !== 'admin') throw new ServiceError(403, 'Only a site admin may do this');
}
