/**
 * Invitations to join a project. An owner invites an e-mail address with a role; the mail holds a
 * one-time link /invite/<token>. Only the token's SHA-256 is stored (secret-tokens.ts, as for
 * password resets); a link works for 7 days and once. Resending gives a new token (the old link
 * stops working); revoking ends it. The invitation is for an ADDRESS: only an account that uses that
 * address can accept it — a new account made from the invitation page (the address fixed), or the
 * existing one signed in. Sending, accepting and revoking write the activity log in the same
 * transaction. Only owners see or change a project's invitations.
 */
import { and, eq, isNull } from 'drizzle-orm';
import { db } from '../db';
import { invitations, memberships, projects, users, type ProjectRole } from '../db/schema';
import { projectAccess, type Actor } from '../access';
import { ServiceError, conflict, mailNotSent, notFound } from '../errors';
import { newId } from '../ids';
import { hashSecret, newSecret } from '../secret-tokens';
import { sendMail } from '../mail';
import { memberInputSchema, parseInput } from '../validation';
import { logActivity, type Tx } from './activity';
import { addAccountByEmail, memberAddedMessage } from './projects';
import { insertAccount, prepareAccount } from './users';

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60_000;

export type InvitationRow = typeof invitations.$inferSelect;
export type InvitationState = 'pending' | 'accepted' | 'revoked' | 'expired';

/** Where an invitation stands at `now`: used and revoked links stay so, whatever their date. */
export function invitationState(row: Pick<InvitationRow, 'acceptedAt' | 'revokedAt' | 'expiresAt'>, now = new Date()): InvitationState {
	if (row.acceptedAt) return 'accepted';
	if (row.revokedAt) return 'revoked';
	return row.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending';
}

/** Why a link no longer works, in words for the person holding it. */
const REFUSED: Record<Exclude<InvitationState, 'pending'>, string> = {
	accepted: 'This invitation has already been used; each link works once. If you joined with it, the project is on your Projects page.',
	revoked: 'This invitation was withdrawn by an owner of the project; ask them for a new one.',
	expired: 'This invitation has expired (links work for 7 days); ask an owner of the project to send it again.'
};

const ROLE_WORDS: Record<ProjectRole, string> = {
	viewer: 'a viewer (you can read its Shelf, notes and log)',
	editor: 'an editor (you can change its Shelf and level notes)',
	owner: 'an owner (you can also manage its members and settings)'
};

// ------------------------------------------------------------------ owners: list, invite, resend, revoke

/** The open invitations of a project (pending or expired, not accepted or revoked), newest first. */
export function listInvitations(actor: Actor, projectId: string) {
	projectAccess(actor, projectId, 'owner');
	return openInvitationsOf(projectId);
}

/** The open invitations, for a caller that has checked the owner role. */
function openInvitationsOf(projectId: string) {
	const now = new Date();
	return db
		.select({
			id: invitations.id,
			email: invitations.email,
			role: invitations.role,
			invitedByName: users.name,
			mailStatus: invitations.mailStatus,
			createdAt: invitations.createdAt,
			sentAt: invitations.sentAt,
			expiresAt: invitations.expiresAt
		})
		.from(invitations)
		.leftJoin(users, eq(users.id, invitations.invitedBy))
		.where(and(eq(invitations.projectId, projectId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
		.orderBy(invitations.sentAt)
		.all()
		.reverse()
		.map((r) => ({
			...r,
			invitedByName: r.invitedByName ?? 'someone',
			state: r.expiresAt > now ? ('pending' as const) : ('expired' as const)
		}));
}

export type InvitationListItem = ReturnType<typeof openInvitationsOf>[number];

/** The open invitation to `email` in a project, if any. */
function openInvitationTo(tx: Tx, projectId: string, email: string) {
	return tx
		.select()
		.from(invitations)
		.where(
			and(eq(invitations.projectId, projectId), eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt))
		)
		.get();
}

function isMember(tx: Tx, projectId: string, email: string) {
	return tx
		.select({ role: memberships.role })
		.from(memberships)
		.innerJoin(users, eq(users.id, memberships.userId))
		.where(and(eq(memberships.projectId, projectId), eq(users.email, email)))
		.get();
}

/**
 * Invites an e-mail address to a project with a role and mails the link. An address with an open
 * invitation gets a fresh one (new role, new link; the old link stops working); a member gets 409.
 * When the mail server does not take the mail, the invitation stays (marked so, to be resent)
 * and a 502 says so.
 */
export async function createInvitation(actor: Actor, projectId: string, input: unknown, origin: string) {
	const { project } = projectAccess(actor, projectId, 'owner');
	const data = parseInput(memberInputSchema, input);
	const { secret, hash } = newSecret();
	const id = db.transaction((tx) => {
		const member = isMember(tx, projectId, data.email);
		if (member) throw conflict(`${data.email} is already a member (${member.role})`, { field: 'email' });
		const earlier = openInvitationTo(tx, projectId, data.email);
		const timing = {
			tokenHash: hash,
			sentAt: new Date(),
			expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS),
			mailStatus: 'sent' as const
		};
		const invitationId = earlier?.id ?? newId();
		if (earlier)
			tx.update(invitations)
				.set({ ...timing, role: data.role, invitedBy: actor.id })
				.where(eq(invitations.id, earlier.id))
				.run();
		else
			tx.insert(invitations)
				.values({ id: invitationId, projectId, email: data.email, role: data.role, invitedBy: actor.id, ...timing })
				.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'invitation.sent',
			summary: `invited ${data.email} as ${data.role}${earlier ? ' (a new link replaces the earlier one)' : ''}`,
			subject: `invitation:${invitationId}`
		});
		return invitationId;
	});
	await mailInvitation(actor, project.name, { id, email: data.email, role: data.role }, secret, origin);
	return invitationById(projectId, id);
}

/** A new link for an open invitation (pending or expired); the old link stops working at once. */
export async function resendInvitation(actor: Actor, projectId: string, invitationId: string, origin: string) {
	const { project } = projectAccess(actor, projectId, 'owner');
	const { secret, hash } = newSecret();
	const row = db.transaction((tx) => {
		const inv = openInvitation(tx, projectId, invitationId);
		tx.update(invitations)
			.set({ tokenHash: hash, sentAt: new Date(), expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS), invitedBy: actor.id })
			.where(eq(invitations.id, inv.id))
			.run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'invitation.sent',
			summary: `sent the invitation to ${inv.email} again (${inv.role}); the earlier link no longer works`,
			subject: `invitation:${inv.id}`
		});
		return inv;
	});
	await mailInvitation(actor, project.name, row, secret, origin);
	return invitationById(projectId, invitationId);
}

/** Ends an open invitation: its link stops working. */
export function revokeInvitation(actor: Actor, projectId: string, invitationId: string) {
	projectAccess(actor, projectId, 'owner');
	db.transaction((tx) => {
		const inv = openInvitation(tx, projectId, invitationId);
		tx.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, inv.id)).run();
		logActivity(tx, {
			projectId,
			actor,
			kind: 'invitation.revoked',
			summary: `revoked the invitation to ${inv.email} (${inv.role})`,
			subject: `invitation:${inv.id}`
		});
	});
}

function openInvitation(tx: Tx, projectId: string, invitationId: string) {
	const inv = tx
		.select()
		.from(invitations)
		.where(and(eq(invitations.id, invitationId), eq(invitations.projectId, projectId)))
		.get();
	if (!inv) throw notFound('No such invitation in this project');
	const state = invitationState(inv);
	if (state === 'accepted') throw conflict(`${inv.email} has already accepted this invitation`);
	if (state === 'revoked') throw conflict(`The invitation to ${inv.email} was already revoked`);
	return inv;
}

function invitationById(projectId: string, invitationId: string): InvitationListItem {
	const item = openInvitationsOf(projectId).find((i) => i.id === invitationId);
	if (!item) throw notFound('No such invitation in this project');
	return item;
}

/**
 * Mails the link and records whether the mail server took it. The invitation and its log entry are
 * already saved; a mail that is not taken leaves the invitation marked 'failed' for a resend.
 */
async function mailInvitation(
	actor: Actor,
	projectName: string,
	inv: { id: string; email: string; role: ProjectRole },
	secret: string,
	origin: string
) {
	const mail = await sendMail({
		to: inv.email,
		subject: `${actor.name} invites you to “${projectName}” on Termwright`,
		text:
			`Hello,\n\n${actor.name} (${actor.email}) invites you to join the project “${projectName}” on Termwright as ${ROLE_WORDS[inv.role]}.\n\n` +
			`Open this link within 7 days to accept; it works once:\n\n${origin}/invite/${secret}\n\n` +
			`If you have no Termwright account with this address yet, the page lets you create one. If you did not expect this invitation, ignore this message.\n`
	});
	db.update(invitations)
		.set({ mailStatus: mail.sent ? 'sent' : 'failed' })
		.where(eq(invitations.id, inv.id))
		.run();
	if (!mail.sent) throw mailNotSent(`The invitation to ${inv.email} is saved, but its mail`);
}

// ------------------------------------------------------------------ the members form and the API's "add a member"

/** The one answer to "add or invite", whether or not an account uses the e-mail. */
export const addedOrInvitedMessage = (email: string, role: ProjectRole) =>
	`${memberAddedMessage(email, role).split('. ')[0]}; if not, an invitation to join was mailed to ${email} (its link works for 7 days).`;

/**
 * The members form: the account that uses the e-mail becomes a member at once; an address without
 * an account gets an invitation instead of an error. The answer reads the same either way (as for
 * `addMember`), though the lists an owner sees tell which happened.
 */
export async function addOrInvite(actor: Actor, projectId: string, input: unknown, origin: string) {
	projectAccess(actor, projectId, 'owner');
	const data = parseInput(memberInputSchema, input);
	const added = addAccountByEmail(actor, projectId, data);
	if (!added) await createInvitation(actor, projectId, data, origin);
	return { email: data.email, role: data.role, message: addedOrInvitedMessage(data.email, data.role) };
}

// ------------------------------------------------------------------ the person holding the link

function rowForToken(token: string) {
	return db
		.select()
		.from(invitations)
		.where(eq(invitations.tokenHash, hashSecret(token)))
		.get();
}

/** What the invitation page shows: null for a link this server never gave out (or one replaced by a resend). */
export function invitationForToken(token: string) {
	const inv = rowForToken(token);
	if (!inv) return null;
	const project = db.select({ name: projects.name }).from(projects).where(eq(projects.id, inv.projectId)).get();
	const inviter = inv.invitedBy ? db.select({ name: users.name }).from(users).where(eq(users.id, inv.invitedBy)).get() : undefined;
	const state = invitationState(inv);
	return {
		state,
		refusal: state === 'pending' ? null : REFUSED[state],
		email: inv.email,
		role: inv.role,
		projectId: inv.projectId,
		projectName: project?.name ?? 'a project',
		invitedByName: inviter?.name ?? 'An owner',
		expiresAt: inv.expiresAt,
		hasAccount: db.select({ id: users.id }).from(users).where(eq(users.email, inv.email)).get() !== undefined
	};
}

/** The live invitation behind a token, or a 400/404 that says why the link does not work. */
function liveInvitation(tx: Tx, token: string): InvitationRow {
	const inv = tx
		.select()
		.from(invitations)
		.where(eq(invitations.tokenHash, hashSecret(token)))
		.get();
	if (!inv)
		throw notFound(
			'This invitation link is unknown: it may have been replaced by a newer one. Use the newest mail, or ask an owner to send it again.'
		);
	const state = invitationState(inv);
	if (state !== 'pending') throw new ServiceError(state === 'accepted' ? 409 : 400, REFUSED[state]);
	return inv;
}

/** Joins with `tx`: the membership, the spent link and the log entry. Already a member: the role stays. */
function joinWith(tx: Tx, inv: InvitationRow, who: Pick<Actor, 'id' | 'name'>) {
	const existing = tx
		.select({ role: memberships.role })
		.from(memberships)
		.where(and(eq(memberships.projectId, inv.projectId), eq(memberships.userId, who.id)))
		.get();
	if (!existing) tx.insert(memberships).values({ projectId: inv.projectId, userId: who.id, role: inv.role }).run();
	// Single use: the link is spent whether or not a membership was made.
	tx.update(invitations).set({ acceptedAt: new Date(), acceptedBy: who.id }).where(eq(invitations.id, inv.id)).run();
	logActivity(tx, {
		projectId: inv.projectId,
		actor: who,
		kind: 'invitation.accepted',
		summary: existing
			? `accepted an invitation as ${inv.role} but was already a member (${existing.role}; the role stays)`
			: `joined as ${inv.role} by invitation`,
		subject: `member:${who.id}`
	});
	return { projectId: inv.projectId, role: existing?.role ?? inv.role, alreadyMember: existing !== undefined };
}

/**
 * The signed-in person accepts. The invitation is for an address: an account with another
 * address gets 403 with what to do instead.
 */
export function acceptInvitation(actor: Actor | null, token: string) {
	if (!actor) throw new ServiceError(401, 'Sign in first, or create an account, to accept the invitation');
	return db.transaction((tx) => {
		const inv = liveInvitation(tx, token);
		if (inv.email !== actor.email.toLowerCase())
			throw new ServiceError(
				403,
				`This invitation is for ${inv.email}, but you are signed in as ${actor.email}. Sign out, then sign in with ${inv.email} or create an account for it.`
			);
		return joinWith(tx, inv, actor);
	});
}

/**
 * A new account made from the invitation page: the address is the invitation's (whatever the form
 * sends), and the account, the membership, the spent link and the log entry are one transaction.
 */
export async function signUpByInvitation(token: string, input: { name?: unknown; password?: unknown }) {
	const inv = db.transaction((tx) => liveInvitation(tx, token));
	const account = await prepareAccount({ name: input.name, password: input.password, email: inv.email });
	return db.transaction((tx) => {
		// Checked again: the link may have been used or revoked while the password was hashed.
		const still = liveInvitation(tx, token);
		const actor = insertAccount(tx, account);
		return { actor, ...joinWith(tx, still, actor) };
	});
}
