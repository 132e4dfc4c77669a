/**
 * Password reset by e-mailed one-time link. The answer to a request never says whether the
 * address has an account. Links last one hour; an account has at most one live link (a new
 * request replaces the old one); using it ends every session and revokes every API token.
 * Requests are limited per address (429) and per e-mail (silently: at most a few mails per
 * hour go to one mailbox, whatever the answer says, so nobody can flood someone's inbox).
 */
import { eq, lt } from 'drizzle-orm';
import { db } from '../db';
import { passwordResets, users } from '../db/schema';
import { replacePassword, type AccessEnded } from './account';
import { ServiceError, badRequest, mailNotSent } from '../errors';
import { createLimiter, waitInWords } from '../rate-limit';
import { hashPassword } from '../password';
import { mailServerAnswers, sendMail } from '../mail';
import { hashSecret, newSecret } from '../secret-tokens';
import { emailSchema, parseInput, passwordSchema } from '../validation';

const LINK_LIFETIME_MS = 60 * 60_000;

export const RESET_LIMITS = { mailsPerAccountPerHour: 3, requestsPerAddressPerHour: 10 };
const perEmail = createLimiter(RESET_LIMITS.mailsPerAccountPerHour, 60 * 60_000);
const perAddress = createLimiter(RESET_LIMITS.requestsPerAddressPerHour, 60 * 60_000);

/** The one answer to a reset request, whatever happened behind it. */
export const RESET_REQUESTED = `If an account uses this e-mail, a reset link is on its way. It works for an hour and replaces any earlier link; at most ${RESET_LIMITS.mailsPerAccountPerHour} links are sent per hour.`;

/**
 * Mails a reset link when an account uses the e-mail. Throws 400 for a malformed e-mail,
 * 429 when `address` has asked too often and 502 when the mail server does not take the mail;
 * otherwise the caller shows `RESET_REQUESTED`. So that a dead mail server does not tell known
 * addresses from unknown ones, an unknown address gets the same 502 when the server does not answer.
 */
export async function requestPasswordReset(input: unknown, origin: string, address: string): Promise<void> {
	const email = parseInput(emailSchema, input);
	const wait = perAddress.check(address);
	if (wait > 0) throw new ServiceError(429, `Too many reset requests from this address; try again in ${waitInWords(wait * 1000)}`);
	perAddress.hit(address);
	if (perEmail.check(email) > 0) return;
	perEmail.hit(email);
	const user = db.select().from(users).where(eq(users.email, email)).get();
	if (!user) {
		const server = await mailServerAnswers();
		if (!server.sent) throw mailNotSent('The reset link');
		return;
	}
	const { secret: token, hash } = newSecret();
	db.transaction((tx) => {
		tx.delete(passwordResets).where(lt(passwordResets.expiresAt, new Date())).run();
		// One live link per account: the new one replaces any earlier one.
		tx.delete(passwordResets).where(eq(passwordResets.userId, user.id)).run();
		tx.insert(passwordResets)
			.values({ tokenHash: hash, userId: user.id, expiresAt: new Date(Date.now() + LINK_LIFETIME_MS) })
			.run();
	});
	const mail = await sendMail({
		to: user.email,
		subject: 'Reset your Termwright password',
		text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Termwright account. If it was you, open this link within an hour:\n\n${origin}/reset/${token}\n\nIf it was not you, ignore this message; your password stays as it is.\n`
	});
	if (!mail.sent) {
		// The link went nowhere: drop it, so the account has no live link that nobody holds.
		db.delete(passwordResets).where(eq(passwordResets.tokenHash, hash)).run();
		throw mailNotSent('The reset link');
	}
}

/** The account a reset token belongs to, or null when it is unknown or expired. */
export function resetTokenUser(token: string) {
	const row = db
		.select()
		.from(passwordResets)
		.where(eq(passwordResets.tokenHash, hashSecret(token)))
		.get();
	if (!row || row.expiresAt.getTime() < Date.now()) return null;
	return db.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, row.userId)).get() ?? null;
}

/**
 * Sets the new password from a live link. In one transaction: the new hash, every link of the
 * account spent, every session ended and every personal API token revoked (whoever asked for
 * the reset may not be the only one who knew the old password). Returns the account and what
 * was ended, so the page can say so.
 */
export async function resetPassword(token: string, password: unknown): Promise<{ userId: string } & AccessEnded> {
	const newPassword = parseInput(passwordSchema, password);
	const user = resetTokenUser(token);
	if (!user) throw badRequest('This reset link is unknown or has expired; ask for a new one', { field: 'token' });
	const passwordHash = await hashPassword(newPassword);
	const ended = replacePassword(user.id, passwordHash, (tx) => tx.delete(passwordResets).where(eq(passwordResets.userId, user.id)).run());
	return { userId: user.id, ...ended };
}
