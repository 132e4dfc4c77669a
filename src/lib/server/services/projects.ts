/**
 * Projects and their members. Each function checks the actor's role before it reads or writes.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { memberships, projects, users, type ProjectRole } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { ServiceError, conflict, notFound } from '../errors';
import { newId } from '../ids';
import { memberInputSchema, parseInput, projectInputSchema, projectPatchSchema, roleSchema } from '../validation';
import { logActivity } from './activity';

export function listProjects(actor: Actor) {
	return db
		.select({
			id: projects.id,
			name: projects.name,
			description: projects.description,
			role: memberships.role,
			updatedAt: projects.updatedAt,
			members: sql<number>`(select count(*) from memberships m where m.project_id = ${projects.id})`
		})
		.from(projects)
		.innerJoin(memberships, and(eq(memberships.projectId, projects.id), eq(memberships.userId, actor.id)))
		.orderBy(asc(projects.name))
		.all();
}

export function getProject(actor: Actor, projectId: string) {
	const { project, role } = projectAccess(actor, projectId, 'viewer');
	return { ...project, role };
}

export function createProject(actor: Actor, input: unknown) {
	const data = parseInput(projectInputSchema, input);
	const id = newId();
	db.transaction((tx) => {
		tx.insert(projects).values({ id, name: data.name, description: data.description, createdBy: actor.id }).run();
		tx.insert(memberships).values({ projectId: id, userId: actor.id, role: 'owner' }).run();
		logActivity(tx, { projectId: id, actor, kind: 'project.created', summary: `created the project “${data.name}”` });
	});
	return getProject(actor, id);
}

export function updateProject(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'owner');
	const data = parseInput(projectPatchSchema, input);
	db.transaction((tx) => {
		tx.update(projects)
			.set({ ...data, updatedAt: new Date() })
			.where(eq(projects.id, projectId))
			.run();
		const changed = [data.name !== undefined && 'name', data.description !== undefined && 'description'].filter(Boolean).join(' and ');
		logActivity(tx, { projectId, actor, kind: 'project.updated', summary: `changed the project’s ${changed || 'settings'}` });
	});
	return getProject(actor, projectId);
}

export function deleteProject(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'owner');
	db.delete(projects).where(eq(projects.id, projectId)).run();
}

export function listMembers(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'viewer');
	return db
		.select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, since: memberships.createdAt })
		.from(memberships)
		.innerJoin(users, eq(users.id, memberships.userId))
		.where(eq(memberships.projectId, projectId))
		.orderBy(asc(users.name))
		.all();
}

/** The one answer to "add a member", whether or not an account uses the e-mail. */
export const memberAddedMessage = (email: string, role: ProjectRole) =>
	`If a Termwright account uses ${email}, it is now a member (${role}). Nobody else is told whether such an account exists.`;

/**
 * Adds the account that uses an e-mail, with a role. The answer is the same whether or not such
 * an account exists, so the form cannot be used to find out who has an account (only the member
 * list, which owners see anyway, tells). Someone who is already a member gets 409. The pages and
 * the API use `addOrInvite` (services/invitations.ts), which invites an address without an account.
 */
export function addMember(actor: Actor, projectId: string, input: unknown) {
	projectAccess(actor, projectId, 'owner');
	const data = parseInput(memberInputSchema, input);
	addAccountByEmail(actor, projectId, data);
	return { email: data.email, role: data.role, message: memberAddedMessage(data.email, data.role) };
}

/**
 * Makes the account that uses `email` a member with `role`, with its log entry, in one transaction.
 * False when no account uses the e-mail; 409 when it is already a member. The caller has checked
 * that `actor` owns the project.
 */
export function addAccountByEmail(actor: Actor, projectId: string, data: { email: string; role: ProjectRole }): boolean {
	return db.transaction((tx) => {
		const user = tx.select({ id: users.id, name: users.name }).from(users).where(eq(users.email, data.email)).get();
		if (!user) return false;
		const existing = tx
			.select()
			.from(memberships)
			.where(and(eq(memberships.projectId, projectId), eq(memberships.userId, user.id)))
			.get();
		if (existing) throw conflict(`${data.email} is already a member (${existing.role})`, { field: 'email' });
		tx.insert(memberships).values({ projectId, userId: user.id, role: data.role }).run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'member.added',
			summary: `added ${user.name} as ${data.role}`,
			subject: `member:${user.id}`
		});
		return true;
	});
}

/** A member leaves a project of their own accord; the last owner must hand over first. */
export function leaveProject(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'viewer');
	db.transaction((tx) => {
		const m = membershipOf(projectId, actor.id);
		if (m.role === 'owner' && ownerCount(projectId) === 1)
			throw new ServiceError(409, 'You are the last owner; make someone else owner before you leave, or delete the project');
		tx.delete(memberships)
			.where(and(eq(memberships.projectId, projectId), eq(memberships.userId, actor.id)))
			.run();
		logActivity(tx, { projectId, actor, kind: 'member.left', summary: `left the project (was ${m.role})`, subject: `member:${actor.id}` });
	});
}

/** A member's name for the log. */
function memberName(userId: string): string {
	return db.select({ name: users.name }).from(users).where(eq(users.id, userId)).get()?.name ?? 'someone';
}

function ownerCount(projectId: string): number {
	return db
		.select({ n: sql<number>`count(*)` })
		.from(memberships)
		.where(and(eq(memberships.projectId, projectId), eq(memberships.role, 'owner')))
		.get()!.n;
}

function membershipOf(projectId: string, userId: string) {
	const m = db
		.select()
		.from(memberships)
		.where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId)))
		.get();
	if (!m) throw notFound('That person is not a member of this project');
	return m;
}

export function changeMemberRole(actor: Actor, projectId: string, userId: string, role: unknown) {
	projectAccess(actor, projectId, 'owner');
	const newRole: ProjectRole = parseInput(roleSchema, role);
	db.transaction((tx) => {
		const m = membershipOf(projectId, userId);
		if (m.role === 'owner' && newRole !== 'owner' && ownerCount(projectId) === 1)
			throw new ServiceError(409, 'A project needs at least one owner; make someone else owner first');
		tx.update(memberships)
			.set({ role: newRole })
			.where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId)))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'member.role_changed',
			summary: `changed ${memberName(userId)}’s role from ${m.role} to ${newRole}`,
			subject: `member:${userId}`
		});
	});
}

export function removeMember(actor: Actor, projectId: string, userId: string) {
	projectAccess(actor, projectId, 'owner');
	db.transaction((tx) => {
		const m = membershipOf(projectId, userId);
		if (m.role === 'owner' && ownerCount(projectId) === 1)
			throw new ServiceError(409, 'A project needs at least one owner; make someone else owner first');
		tx.delete(memberships)
			.where(and(eq(memberships.projectId, projectId), eq(memberships.userId, userId)))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'member.removed',
			summary: `removed ${memberName(userId)} (${m.role})`,
			subject: `member:${userId}`
		});
	});
}
