/**
 * Password reset by e-mailed one-time link. The answer to a request never says whether the
 * address has an account. Links last one hour; using one ends every session of the account.
 */
import { createHash, randomBytes } from 'node:crypto';
import { eq, lt } from 'drizzle-orm';
import { db } from '../db';
import { passwordResets, sessions, users } from '../db/schema';
import { badRequest } from '../errors';
import { hashPassword } from '../password';
import { sendMail } from '../mail';
import { emailSchema, parseInput, passwordSchema } from '../validation';

const LINK_LIFETIME_MS = 60 * 60_000;
const sha256 = (token: string) => createHash('sha256').update(token).digest('hex');

export async function requestPasswordReset(input: unknown, origin: string): Promise<void> {
	const email = parseInput(emailSchema, input);
	db.delete(passwordResets).where(lt(passwordResets.expiresAt, new Date())).run();
	const user = db.select().from(users).where(eq(users.email, email)).get();
	if (!user) return;
	const token = randomBytes(32).toString('base64url');
	db.insert(passwordResets)
		.values({ tokenHash: sha256(token), userId: user.id, expiresAt: new Date(Date.now() + LINK_LIFETIME_MS) })
		.run();
	await sendMail({
		to: user.email,
		subject: 'Reset your Termwright password',
		text: `Hello ${user.name},\n\nSomeone asked to reset the password of your Termwright account. If it was you, open this link within an hour:\n\n${origin}/reset/${token}\n\nIf it was not you, ignore this message; your password stays as it is.\n`
	});
}

/** The account a reset token belongs to, or null when it is unknown or expired. */
export function resetTokenUser(token: string) {
	const row = db
		.select()
		.from(passwordResets)
		.where(eq(passwordResets.tokenHash, sha256(token)))
		.get();
	if (!row || row.expiresAt.getTime() < Date.now()) return null;
	return db.select({ id: users.id, email: users.email }).from(users).where(eq(users.id, row.userId)).get() ?? null;
}

export async function resetPassword(token: string, password: unknown): Promise<string> {
	const newPassword = parseInput(passwordSchema, password);
	const user = resetTokenUser(token);
	if (!user) throw badRequest('This reset link is unknown or has expired; ask for a new one', { field: 'token' });
	const passwordHash = await hashPassword(newPassword);
	db.transaction((tx) => {
		tx.update(users).set({ passwordHash }).where(eq(users.id, user.id)).run();
		tx.delete(passwordResets).where(eq(passwordResets.userId, user.id)).run();
		tx.delete(sessions).where(eq(sessions.userId, user.id)).run();
	});
	return user.id;
}
