/**
 * Password reset by one-time link (common practice, no source): the request never reveals
 * whether an account exists, the link works once, and it ends the account's sessions. The mail
 * goes over SMTP to a local catcher (catch-mail.ts), as in the app; the links are read from what
 * the catcher received.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { signUp, checkPassword } from './services/users';
import { requestPasswordReset, resetPassword, resetTokenUser } from './services/password-reset';
import { capturedMail, useMailCatcher } from './mail';
import { catchMailInTests } from './catch-mail';
import { startMailCatcher, type MailCatcher } from './mail-catcher';

let catcher: MailCatcher;
beforeAll(async () => {
	catcher = await catchMailInTests();
});
afterAll(() => catcher.close());

const linkIn = (text: string) => /\/reset\/([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('password reset', () => {
	it('mails a link to a known address and nothing to an unknown one', async () => {
		await signUp({ name: 'Forgetful', email: 'forgetful@example.org', password: 'first-password' });
		await requestPasswordReset('nobody@example.org', 'http://localhost', '127.0.0.1');
		expect(capturedMail()).toHaveLength(0);
		await requestPasswordReset('forgetful@example.org', 'http://localhost', '127.0.0.1');
		const [mail] = capturedMail();
		expect(mail.to).toBe('forgetful@example.org');
		expect(linkIn(mail.body)).toBeTruthy();
	});

	it('sets the new password once; the link is then spent', async () => {
		const token = linkIn(capturedMail()[0].body)!;
		expect(resetTokenUser(token)?.email).toBe('forgetful@example.org');
		await resetPassword(token, 'second-password');
		await expect(checkPassword({ email: 'forgetful@example.org', password: 'second-password' }, '1.2.3.4')).resolves.toMatchObject({
			email: 'forgetful@example.org'
		});
		await expect(resetPassword(token, 'third-password')).rejects.toThrow(/unknown or has expired/);
	});

	it('refuses a short new password with the rule', async () => {
		await requestPasswordReset('forgetful@example.org', 'http://localhost', '127.0.0.1');
		const token = linkIn(capturedMail()[0].body)!;
		await expect(resetPassword(token, 'short')).rejects.toThrow(/at least 10 characters/);
	});
});

describe('a new password ends every way in (sessions and API tokens)', () => {
	it('a reset revokes personal API tokens and ends sessions', async () => {
		const { lucia } = await import('./auth');
		const { createToken } = await import('./services/tokens');
		const { actorForToken } = await import('./services/tokens');
		const actor = await signUp({ name: 'Token Holder', email: 'tokens@example.org', password: 'first-password' });
		const { secret } = createToken(actor, 'script');
		const session = await lucia.createSession(actor.id, {});
		expect(actorForToken(secret)?.id).toBe(actor.id);
		await requestPasswordReset('tokens@example.org', 'http://localhost', '203.0.113.1');
		const ended = await resetPassword(linkIn(capturedMail()[0].body)!, 'second-password');
		expect(ended).toMatchObject({ userId: actor.id, tokens: 1, sessions: 1 });
		expect(actorForToken(secret)).toBeNull();
		expect((await lucia.validateSession(session.id)).session).toBeNull();
	});

	it('change password needs the current one, then ends sessions and revokes tokens', async () => {
		const { lucia } = await import('./auth');
		const { createToken, actorForToken } = await import('./services/tokens');
		const { changePassword } = await import('./services/account');
		const actor = await signUp({ name: 'Changer', email: 'changer@example.org', password: 'first-password' });
		const { secret } = createToken(actor, 'script');
		const session = await lucia.createSession(actor.id, {});
		await expect(changePassword(actor, { current: 'wrong-password', password: 'second-password' })).rejects.toThrow(
			/current password is not right/
		);
		expect(actorForToken(secret)?.id).toBe(actor.id);
		await expect(changePassword(actor, { current: 'first-password', password: 'first-password' })).rejects.toThrow(/must differ/);
		await expect(changePassword(actor, { current: 'first-password', password: 'short' })).rejects.toThrow(/at least 10/);
		await expect(changePassword(actor, { current: 'first-password', password: 'second-password' })).resolves.toEqual({
			sessions: 1,
			tokens: 1
		});
		expect(actorForToken(secret)).toBeNull();
		expect((await lucia.validateSession(session.id)).session).toBeNull();
		await expect(checkPassword({ email: 'changer@example.org', password: 'second-password' }, '203.0.113.2')).resolves.toBeTruthy();
	});

	it('sign out everywhere ends all sessions; tokens only when asked', async () => {
		const { lucia } = await import('./auth');
		const { createToken, actorForToken } = await import('./services/tokens');
		const { signOutEverywhere } = await import('./services/account');
		const actor = await signUp({ name: 'Everywhere', email: 'everywhere@example.org', password: 'first-password' });
		const { secret } = createToken(actor, 'script');
		const a = await lucia.createSession(actor.id, {});
		const b = await lucia.createSession(actor.id, {});
		expect(signOutEverywhere(actor)).toEqual({ sessions: 2, tokens: 0 });
		expect((await lucia.validateSession(a.id)).session).toBeNull();
		expect((await lucia.validateSession(b.id)).session).toBeNull();
		expect(actorForToken(secret)?.id).toBe(actor.id);
		expect(signOutEverywhere(actor, true)).toEqual({ sessions: 0, tokens: 1 });
		expect(actorForToken(secret)).toBeNull();
	});
});

describe('reset requests are limited', () => {
	it('one live link per account: a new request replaces the old link', async () => {
		await signUp({ name: 'Twice', email: 'twice@example.org', password: 'first-password' });
		await requestPasswordReset('twice@example.org', 'http://localhost', '203.0.113.3');
		const first = linkIn(capturedMail()[0].body)!;
		await requestPasswordReset('twice@example.org', 'http://localhost', '203.0.113.3');
		const second = linkIn(capturedMail()[0].body)!;
		expect(second).not.toBe(first);
		expect(resetTokenUser(first)).toBeNull();
		expect(resetTokenUser(second)?.email).toBe('twice@example.org');
	});

	it('at most three mails per hour go to one account, and the answer does not change', async () => {
		const { RESET_LIMITS } = await import('./services/password-reset');
		await signUp({ name: 'Flooded', email: 'flooded@example.org', password: 'first-password' });
		const before = capturedMail(1000).length;
		for (let i = 0; i < 6; i++)
			await expect(requestPasswordReset('flooded@example.org', 'http://localhost', `203.0.113.${10 + i}`)).resolves.toBeUndefined();
		expect(capturedMail(1000).length - before).toBe(RESET_LIMITS.mailsPerAccountPerHour);
	});

	it('one address may ask ten times an hour, then gets 429', async () => {
		for (let i = 0; i < 10; i++) await requestPasswordReset(`someone${i}@example.org`, 'http://localhost', '198.51.100.50');
		await expect(requestPasswordReset('someone-else@example.org', 'http://localhost', '198.51.100.50')).rejects.toThrow(
			/Too many reset requests/
		);
	});
});

describe('the outbox view', () => {
	it('is on only in development or with MAIL_OUTBOX=on, and never with SMTP_URL', async () => {
		const { outboxViewIsOn } = await import('./mail');
		expect(outboxViewIsOn({}, false)).toBe(false);
		expect(outboxViewIsOn({}, true)).toBe(true);
		expect(outboxViewIsOn({ MAIL_OUTBOX: 'on' }, false)).toBe(true);
		expect(outboxViewIsOn({ MAIL_OUTBOX: 'off' }, true)).toBe(false);
		expect(outboxViewIsOn({ MAIL_OUTBOX: 'on', SMTP_URL: 'smtp://mail.example:25' }, true)).toBe(false);
	});

	it('masks a live reset link and shows it once it is spent; only site admins read it; off means 404', async () => {
		const { outboxForAdmin } = await import('./services/outbox');
		const { ServiceError } = await import('./errors');
		const { db } = await import('./db');
		const { users } = await import('./db/schema');
		const { eq } = await import('drizzle-orm');
		const admin = db.select().from(users).where(eq(users.siteRole, 'admin')).get()!;
		const adminActor = { id: admin.id, email: admin.email, name: admin.name, siteRole: admin.siteRole };
		const member = await signUp({ name: 'Mailbox Owner', email: 'mailbox@example.org', password: 'first-password' });
		await requestPasswordReset('mailbox@example.org', 'http://localhost', '203.0.113.99');
		const token = linkIn(capturedMail()[0].body)!;
		process.env.MAIL_OUTBOX = 'on';
		try {
			expect(() => outboxForAdmin(member)).toThrow(ServiceError);
			const [shown] = outboxForAdmin(adminActor);
			expect(shown.body).not.toContain(token);
			expect(shown.body).toContain(`/reset/${token.slice(0, 4)}…[hidden`);
			await resetPassword(token, 'second-password');
			expect(outboxForAdmin(adminActor)[0].body).toContain(`/reset/${token}`);
			process.env.MAIL_OUTBOX = 'off';
			expect(() => outboxForAdmin(adminActor)).toThrow(/mail view is off/);
		} finally {
			delete process.env.MAIL_OUTBOX;
		}
	});
});

describe('when the mail server does not take the mail', () => {
	it('the request fails with 502 for a known and an unknown address alike, and no live link is left', async () => {
		await signUp({ name: 'Unlucky', email: 'unlucky@example.org', password: 'first-password' });
		const gone = await startMailCatcher({ port: 0, store: () => {} });
		await gone.close();
		useMailCatcher(gone.url);
		const quiet = vi.spyOn(console, 'error').mockImplementation(() => {});
		try {
			const known = requestPasswordReset('unlucky@example.org', 'http://localhost', '203.0.113.120');
			await expect(known).rejects.toThrow(/The reset link could not be sent: the mail server did not take it/);
			const unknown = requestPasswordReset('nobody-here@example.org', 'http://localhost', '203.0.113.121');
			await expect(unknown).rejects.toThrow(/The reset link could not be sent: the mail server did not take it/);
			expect(await known.catch((e: { status?: number }) => e.status)).toBe(502);
			expect(capturedMail(1)[0]).toMatchObject({ to: 'unlucky@example.org', status: 'failed', body: '' });
			const { db } = await import('./db');
			const { passwordResets, users } = await import('./db/schema');
			const { eq } = await import('drizzle-orm');
			const user = db.select().from(users).where(eq(users.email, 'unlucky@example.org')).get()!;
			expect(db.select().from(passwordResets).where(eq(passwordResets.userId, user.id)).all()).toEqual([]);
		} finally {
			quiet.mockRestore();
			useMailCatcher(catcher.url);
		}
	});
});
