/**
 * Invitations (the product's rules, common practice, no source): the link's token is stored only
 * as its SHA-256 (FIPS 180-4; the "abc" test vector below is its Appendix B.1 example), it works
 * for 7 days and once, resending replaces it, revoking ends it, only owners invite, and only the
 * invited address can accept. Sending and joining write the activity log. The mail goes over SMTP
 * to a local catcher, as in the app, and the links are read from what it received.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createHash } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Actor } from './access';
import { db, sqlite } from './db';
import { invitations } from './db/schema';
import { capturedMail, useMailCatcher } from './mail';
import { catchMailInTests } from './catch-mail';
import type { MailCatcher } from './mail-catcher';
import { hashSecret } from './secret-tokens';
import { statusOf } from './status-of';
import { signUp, checkPassword } from './services/users';
import { addMember, createProject, listMembers } from './services/projects';
import { listActivity } from './services/activity';
import {
	INVITATION_LIFETIME_MS,
	acceptInvitation,
	addOrInvite,
	addedOrInvitedMessage,
	createInvitation,
	invitationForToken,
	invitationState,
	listInvitations,
	resendInvitation,
	revokeInvitation,
	signUpByInvitation
} from './services/invitations';
import { outboxForAdmin } from './services/outbox';

const ORIGIN = 'http://localhost:4173';
const DAY = 24 * 60 * 60_000;
let catcher: MailCatcher;
let admin: Actor, owner: Actor, editor: Actor, viewer: Actor, stranger: Actor, projectId: string;

/** The token in the newest caught mail to `email`. */
function linkTo(email: string): string {
	const mail = capturedMail(1000).find((m) => m.to === email && m.status === 'caught');
	const token = mail && new RegExp(`${ORIGIN}/invite/([A-Za-z0-9_-]+)`).exec(mail.body)?.[1];
	if (!token) throw new Error(`no invitation mail to ${email}`);
	return token;
}

const rowOf = (token: string) =>
	db
		.select()
		.from(invitations)
		.where(eq(invitations.tokenHash, hashSecret(token)))
		.get()!;
/** Rejection status of an async service call, or 'ok'. */
const asyncStatus = (p: Promise<unknown>) => p.then(() => 'ok' as const).catch((e: { status?: number }) => e.status);

beforeAll(async () => {
	catcher = await catchMailInTests();
	admin = await signUp({ name: 'Site Admin', email: 'admin@invite.example', password: 'long-enough-pw' });
	owner = await signUp({ name: 'Olga Owner', email: 'olga@invite.example', password: 'long-enough-pw' });
	editor = await signUp({ name: 'Emil Editor', email: 'emil@invite.example', password: 'long-enough-pw' });
	viewer = await signUp({ name: 'Vera Viewer', email: 'vera@invite.example', password: 'long-enough-pw' });
	stranger = await signUp({ name: 'Sam Stranger', email: 'sam@invite.example', password: 'long-enough-pw' });
	projectId = createProject(owner, { name: 'Nebular O III' }).id;
	addMember(owner, projectId, { email: editor.email, role: 'editor' });
	addMember(owner, projectId, { email: viewer.email, role: 'viewer' });
});
afterAll(() => catcher.close());

describe('the token', () => {
	it('is hashed with SHA-256 (FIPS 180-4 test vector "abc")', () => {
		expect(hashSecret('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
	});

	it('is mailed in a link and stored only as its hash, never in plain text', async () => {
		await createInvitation(owner, projectId, { email: 'kim@invite.example', role: 'viewer' }, ORIGIN);
		const token = linkTo('kim@invite.example');
		expect(token.length).toBeGreaterThanOrEqual(43); // 32 random bytes in base64url
		const row = rowOf(token);
		expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
		const everything = JSON.stringify(sqlite.prepare('select * from invitations').all());
		expect(everything).not.toContain(token);
	});

	it('expires 7 days after it was sent', () => {
		const row = rowOf(linkTo('kim@invite.example'));
		expect(INVITATION_LIFETIME_MS).toBe(7 * DAY);
		expect(row.expiresAt.getTime() - row.sentAt.getTime()).toBeGreaterThanOrEqual(7 * DAY - 5_000);
		expect(row.expiresAt.getTime() - row.sentAt.getTime()).toBeLessThanOrEqual(7 * DAY + 5_000);
	});
});

describe('invitationState', () => {
	const sent = new Date('2026-03-01T12:00:00Z');
	const expiresAt = new Date(sent.getTime() + 7 * DAY);
	it('is pending until the expiry and expired from then on', () => {
		const row = { acceptedAt: null, revokedAt: null, expiresAt };
		expect(invitationState(row, new Date(sent.getTime() + 7 * DAY - 1))).toBe('pending');
		expect(invitationState(row, expiresAt)).toBe('expired');
		expect(invitationState(row, new Date(sent.getTime() + 8 * DAY))).toBe('expired');
	});
	it('used and revoked links stay so, before or after the expiry', () => {
		expect(invitationState({ acceptedAt: sent, revokedAt: null, expiresAt }, sent)).toBe('accepted');
		expect(invitationState({ acceptedAt: null, revokedAt: sent, expiresAt }, sent)).toBe('revoked');
		expect(invitationState({ acceptedAt: null, revokedAt: sent, expiresAt }, new Date(expiresAt.getTime() + DAY))).toBe('revoked');
	});
});

describe('accepting', () => {
	it('a new account from the link gets the invited address (whatever the form says), the role, and a session-ready actor', async () => {
		await createInvitation(owner, projectId, { email: 'nora@invite.example', role: 'viewer' }, ORIGIN);
		const token = linkTo('nora@invite.example');
		expect(invitationForToken(token)).toMatchObject({
			state: 'pending',
			email: 'nora@invite.example',
			role: 'viewer',
			projectName: 'Nebular O III',
			hasAccount: false
		});
		const joined = await signUpByInvitation(token, { name: 'Nora New', password: 'nora-password-1', email: 'other@evil.example' } as never);
		expect(joined).toMatchObject({
			projectId,
			role: 'viewer',
			alreadyMember: false,
			actor: { email: 'nora@invite.example', name: 'Nora New' }
		});
		expect(listMembers(owner, projectId).find((m) => m.email === 'nora@invite.example')?.role).toBe('viewer');
		await expect(checkPassword({ email: 'nora@invite.example', password: 'nora-password-1' }, '192.0.2.1')).resolves.toBeTruthy();
	});

	it('works once: a used link is refused', async () => {
		const token = linkTo('nora@invite.example');
		expect(invitationForToken(token)?.state).toBe('accepted');
		await expect(signUpByInvitation(token, { name: 'Again', password: 'nora-password-2' })).rejects.toThrow(/already been used/);
		const nora = { ...(await checkPassword({ email: 'nora@invite.example', password: 'nora-password-1' }, '192.0.2.1')) };
		expect(() => acceptInvitation(nora, token)).toThrow(/already been used/);
		expect(statusOf(() => acceptInvitation(nora, token))).toBe(409);
	});

	it('an expired link is refused, with what to do', async () => {
		await createInvitation(owner, projectId, { email: 'old@invite.example', role: 'editor' }, ORIGIN);
		const token = linkTo('old@invite.example');
		db.update(invitations)
			.set({ expiresAt: new Date(Date.now() - 1000) })
			.where(eq(invitations.tokenHash, hashSecret(token)))
			.run();
		expect(invitationForToken(token)).toMatchObject({
			state: 'expired',
			refusal: expect.stringMatching(/expired .*7 days.*send it again/)
		});
		await expect(signUpByInvitation(token, { name: 'Too Late', password: 'late-password-1' })).rejects.toThrow(/has expired/);
		expect(listMembers(owner, projectId).some((m) => m.email === 'old@invite.example')).toBe(false);
		// The owner still sees it, as expired, and can send a new link.
		expect(listInvitations(owner, projectId).find((i) => i.email === 'old@invite.example')?.state).toBe('expired');
	});

	it('a revoked link is refused', async () => {
		const inv = await createInvitation(owner, projectId, { email: 'rev@invite.example', role: 'viewer' }, ORIGIN);
		const token = linkTo('rev@invite.example');
		revokeInvitation(owner, projectId, inv.id);
		expect(invitationForToken(token)?.state).toBe('revoked');
		await expect(signUpByInvitation(token, { name: 'Revoked', password: 'revoked-pass-1' })).rejects.toThrow(/withdrawn/);
		expect(statusOf(() => revokeInvitation(owner, projectId, inv.id))).toBe(409);
		expect(listInvitations(owner, projectId).some((i) => i.id === inv.id)).toBe(false);
	});

	it('resending gives a new link; the old one stops working at once', async () => {
		const inv = await createInvitation(owner, projectId, { email: 'again@invite.example', role: 'viewer' }, ORIGIN);
		const first = linkTo('again@invite.example');
		await resendInvitation(owner, projectId, inv.id, ORIGIN);
		const second = linkTo('again@invite.example');
		expect(second).not.toBe(first);
		expect(invitationForToken(first)).toBeNull();
		await expect(signUpByInvitation(first, { name: 'Old Link', password: 'old-link-pass-1' })).rejects.toThrow(/unknown/);
		expect(invitationForToken(second)?.state).toBe('pending');
	});

	it('only the account with the invited address may accept; another is told so', async () => {
		await createInvitation(owner, projectId, { email: stranger.email, role: 'editor' }, ORIGIN);
		const token = linkTo(stranger.email);
		expect(invitationForToken(token)?.hasAccount).toBe(true);
		expect(statusOf(() => acceptInvitation(viewer, token))).toBe(403);
		expect(() => acceptInvitation(viewer, token)).toThrow(
			`This invitation is for ${stranger.email}, but you are signed in as ${viewer.email}`
		);
		expect(statusOf(() => acceptInvitation(null, token))).toBe(401);
		expect(acceptInvitation(stranger, token)).toEqual({ projectId, role: 'editor', alreadyMember: false });
		expect(listMembers(owner, projectId).find((m) => m.userId === stranger.id)?.role).toBe('editor');
	});
});

describe('owners only', () => {
	it('editors and viewers may not invite, list, resend or revoke; non-members get 404', async () => {
		const inv = await createInvitation(owner, projectId, { email: 'guarded@invite.example', role: 'viewer' }, ORIGIN);
		for (const who of [editor, viewer]) {
			expect(await asyncStatus(createInvitation(who, projectId, { email: 'x@invite.example', role: 'viewer' }, ORIGIN))).toBe(403);
			expect(statusOf(() => listInvitations(who, projectId))).toBe(403);
			expect(await asyncStatus(resendInvitation(who, projectId, inv.id, ORIGIN))).toBe(403);
			expect(statusOf(() => revokeInvitation(who, projectId, inv.id))).toBe(403);
		}
		expect(statusOf(() => listInvitations(admin, projectId))).toBe(404);
		expect(await asyncStatus(createInvitation(admin, projectId, { email: 'x@invite.example', role: 'viewer' }, ORIGIN))).toBe(404);
	});

	it('a member is not invited (409); a bad role is refused with the allowed ones', async () => {
		expect(await asyncStatus(createInvitation(owner, projectId, { email: editor.email, role: 'viewer' }, ORIGIN))).toBe(409);
		await expect(createInvitation(owner, projectId, { email: 'y@invite.example', role: 'admin' }, ORIGIN)).rejects.toThrow(
			/viewer, editor, owner/
		);
	});
});

describe('add or invite (the members form)', () => {
	it('an account joins at once; an unknown address gets an invitation, not an error; the answer reads the same', async () => {
		const other = await signUp({ name: 'Otto Other', email: 'otto@invite.example', password: 'long-enough-pw' });
		const known = await addOrInvite(owner, projectId, { email: other.email, role: 'viewer' }, ORIGIN);
		const unknown = await addOrInvite(owner, projectId, { email: 'brand-new@invite.example', role: 'viewer' }, ORIGIN);
		expect(known.message).toBe(addedOrInvitedMessage(other.email, 'viewer'));
		expect(unknown.message).toBe(addedOrInvitedMessage('brand-new@invite.example', 'viewer'));
		expect(unknown.message).toBe(known.message.split(other.email).join('brand-new@invite.example'));
		expect(listMembers(owner, projectId).some((m) => m.userId === other.id)).toBe(true);
		expect(listInvitations(owner, projectId).find((i) => i.email === 'brand-new@invite.example')).toMatchObject({
			role: 'viewer',
			state: 'pending',
			mailStatus: 'sent'
		});
		expect(capturedMail(1000).some((m) => m.to === other.email)).toBe(false);
	});
});

describe('the activity log', () => {
	it('records invited, joined and revoked, by whom', async () => {
		const p = createProject(owner, { name: 'Logged invitations' }).id;
		const inv = await createInvitation(owner, p, { email: 'logged@invite.example', role: 'viewer' }, ORIGIN);
		await signUpByInvitation(linkTo('logged@invite.example'), { name: 'Lea Logged', password: 'lea-password-1' });
		const gone = await createInvitation(owner, p, { email: 'gone@invite.example', role: 'editor' }, ORIGIN);
		revokeInvitation(owner, p, gone.id);
		const log = listActivity(owner, p).items.map((l) => ({ kind: l.kind, actorName: l.actorName, summary: l.summary }));
		expect(log.slice(0, 4)).toEqual([
			{ kind: 'invitation.revoked', actorName: 'Olga Owner', summary: 'revoked the invitation to gone@invite.example (editor)' },
			{ kind: 'invitation.sent', actorName: 'Olga Owner', summary: 'invited gone@invite.example as editor' },
			{ kind: 'invitation.accepted', actorName: 'Lea Logged', summary: 'joined as viewer by invitation' },
			{ kind: 'invitation.sent', actorName: 'Olga Owner', summary: 'invited logged@invite.example as viewer' }
		]);
		expect(inv.email).toBe('logged@invite.example');
	});

	it('a refused invitation writes no log line', async () => {
		const before = listActivity(owner, projectId, { limit: 200 }).items.length;
		await asyncStatus(createInvitation(editor, projectId, { email: 'no@invite.example', role: 'viewer' }, ORIGIN));
		await asyncStatus(createInvitation(owner, projectId, { email: viewer.email, role: 'viewer' }, ORIGIN));
		expect(listActivity(owner, projectId, { limit: 200 }).items.length).toBe(before);
	});
});

describe('when the mail cannot be sent', () => {
	it('the owner gets 502, the invitation stays (marked) for a resend, and a failed row is kept', async () => {
		useMailCatcher(null);
		const quiet = vi.spyOn(console, 'error').mockImplementation(() => {});
		try {
			await expect(createInvitation(owner, projectId, { email: 'unlucky@invite.example', role: 'viewer' }, ORIGIN)).rejects.toThrow(
				/The invitation to unlucky@invite.example is saved, but its mail could not be sent/
			);
			expect(listInvitations(owner, projectId).find((i) => i.email === 'unlucky@invite.example')?.mailStatus).toBe('failed');
			expect(capturedMail(1)[0]).toMatchObject({ to: 'unlucky@invite.example', status: 'failed', body: '' });
		} finally {
			quiet.mockRestore();
			useMailCatcher(catcher.url);
		}
		const inv = listInvitations(owner, projectId).find((i) => i.email === 'unlucky@invite.example')!;
		expect((await resendInvitation(owner, projectId, inv.id, ORIGIN)).mailStatus).toBe('sent');
		expect(invitationForToken(linkTo('unlucky@invite.example'))?.state).toBe('pending');
	});
});

describe('the caught-mail view', () => {
	it('masks a live invitation link and shows it once it is spent', async () => {
		await createInvitation(owner, projectId, { email: 'masked@invite.example', role: 'viewer' }, ORIGIN);
		const token = linkTo('masked@invite.example');
		process.env.MAIL_OUTBOX = 'on';
		try {
			const shown = () => outboxForAdmin(admin).find((m) => m.to === 'masked@invite.example' && m.status === 'caught')!;
			expect(shown().body).not.toContain(token);
			expect(shown().body).toContain(`/invite/${token.slice(0, 4)}…[hidden`);
			await signUpByInvitation(token, { name: 'Mia Masked', password: 'mia-password-1' });
			expect(shown().body).toContain(`/invite/${token}`);
		} finally {
			delete process.env.MAIL_OUTBOX;
		}
	});
});
