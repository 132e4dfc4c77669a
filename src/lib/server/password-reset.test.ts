/**
 * Password reset by one-time link (common practice, no source): the request never reveals
 * whether an account exists, the link works once, and it ends the account's sessions.
 */
import { describe, expect, it } from 'vitest';
import { signUp, checkPassword } from './services/users';
import { requestPasswordReset, resetPassword, resetTokenUser } from './services/password-reset';
import { capturedMail } from './mail';

const linkIn = (text: string) => /\/reset\/([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('password reset', () => {
	it('mails a link to a known address and nothing to an unknown one', async () => {
		await signUp({ name: 'Forgetful', email: 'forgetful@example.org', password: 'first-password' });
		await requestPasswordReset('nobody@example.org', 'http://localhost');
		expect(capturedMail()).toHaveLength(0);
		await requestPasswordReset('forgetful@example.org', 'http://localhost');
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
		await requestPasswordReset('forgetful@example.org', 'http://localhost');
		const token = linkIn(capturedMail()[0].body)!;
		await expect(resetPassword(token, 'short')).rejects.toThrow(/at least 10 characters/);
	});
});
