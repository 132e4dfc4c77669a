/**
 * Accounts: sign-up, password check with a rate limit, and the admin's list of users.
 */
import { asc, eq, sql } from 'drizzle-orm';
import { db } from '../db';
import { users } from '../db/schema';
import { requireSiteAdmin, type Actor } from '../access';
import { ServiceError, badRequest, notFound } from '../errors';
import { newId } from '../ids';
import { hashPassword, verifyPassword } from '../password';
import { createBackoffLimiter, createLimiter, waitInWords } from '../rate-limit';
import { parseInput, signInSchema, signUpSchema, siteRoleSchema } from '../validation';
import type { Tx } from './activity';

/**
 * Sign-in throttling that nobody can aim at someone else's account:
 * - per (account, address) pair, exponential backoff: four free failures, then 30 s, 1 min,
 *   2 min … up to 15 min per further failure; forgotten after a day without failures or on success.
 *   A wrong password from one address never blocks the right password from another.
 * - per address, a looser cap on failures across all accounts: 50 in 15 minutes (password
 *   spraying from one address). An office behind one NAT address shares this budget.
 * Unknown e-mails count like known ones, so the answers do not tell them apart.
 */
export const SIGN_IN_PAIR_BACKOFF = { freeFailures: 4, baseMs: 30_000, maxMs: 15 * 60_000, forgetMs: 24 * 60 * 60_000 };
export const SIGN_IN_ADDRESS_LIMIT = { failures: 50, windowMs: 15 * 60_000 };
const perPair = createBackoffLimiter(SIGN_IN_PAIR_BACKOFF);
const perAddress = createLimiter(SIGN_IN_ADDRESS_LIMIT.failures, SIGN_IN_ADDRESS_LIMIT.windowMs);

/** The same words whether the e-mail is unknown or the password wrong. */
export const SIGN_IN_FAILED = 'E-mail or password is not right';

export async function signUp(input: unknown): Promise<Actor> {
	const account = await prepareAccount(input);
	return db.transaction((tx) => insertAccount(tx, account));
}

/** A checked sign-up with its password hashed, ready for `insertAccount` (hashing is slow, so it runs before any transaction). */
export interface PreparedAccount {
	id: string;
	email: string;
	name: string;
	passwordHash: string;
}

/** Validates a sign-up (name, e-mail, password) and hashes the password; 400 when the e-mail is taken. */
export async function prepareAccount(input: unknown): Promise<PreparedAccount> {
	const data = parseInput(signUpSchema, input);
	const taken = db.select({ id: users.id }).from(users).where(eq(users.email, data.email)).get();
	// Saying "taken" reveals that an account exists; a sign-up form cannot avoid that
	// without e-mail confirmation, so we keep the words neutral.
	if (taken) throw badRequest('An account cannot be made with this e-mail; sign in instead, or use another address', { field: 'email' });
	return { id: newId(), email: data.email, name: data.name, passwordHash: await hashPassword(data.password) };
}

/** Writes a prepared account with `tx`; the first account on a fresh site administers it. */
export function insertAccount(tx: Tx, account: PreparedAccount): Actor {
	const count = tx
		.select({ n: sql<number>`count(*)` })
		.from(users)
		.get()!.n;
	const siteRole = count === 0 ? 'admin' : 'member';
	tx.insert(users)
		.values({ ...account, siteRole })
		.run();
	return { id: account.id, email: account.email, name: account.name, siteRole };
}

export async function checkPassword(input: unknown, address: string): Promise<Actor> {
	const data = parseInput(signInSchema, input);
	const pairKey = `${data.email}\n${address}`;
	const wait = Math.max(perPair.waitMs(pairKey), perAddress.check(address) * 1000);
	if (wait > 0) throw new ServiceError(429, `Too many failed sign-ins from this address; try again in ${waitInWords(wait)}`);
	// Count the attempt before the (slow) hash check, so parallel guesses cannot all slip through
	// the check above; a success forgets it again.
	perPair.fail(pairKey);
	const user = db.select().from(users).where(eq(users.email, data.email)).get();
	// Verify against a dummy hash for unknown e-mails so timing does not tell them apart.
	const ok = user
		? await verifyPassword(user.passwordHash, data.password)
		: (await verifyPassword(await dummyHash(), data.password), false);
	if (!user || !ok) {
		perAddress.hit(address);
		throw badRequest(SIGN_IN_FAILED);
	}
	perPair.succeed(pairKey);
	return { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole };
}

let dummy: Promise<string> | null = null;
const dummyHash = () => (dummy ??= hashPassword('termwright-dummy-password'));

export function listUsers(actor: Actor) {
	requireSiteAdmin(actor);
	return db
		.select({ id: users.id, name: users.name, email: users.email, siteRole: users.siteRole, createdAt: users.createdAt })
		.from(users)
		.orderBy(asc(users.name))
		.all();
}

export function setSiteRole(actor: Actor, userId: string, role: unknown) {
	requireSiteAdmin(actor);
	const siteRole = parseInput(siteRoleSchema, role);
	db.transaction((tx) => {
		const user = tx.select().from(users).where(eq(users.id, userId)).get();
		if (!user) throw notFound('No such user');
		if (user.siteRole === 'admin' && siteRole !== 'admin') {
			const admins = tx
				.select({ n: sql<number>`count(*)` })
				.from(users)
				.where(eq(users.siteRole, 'admin'))
				.get()!.n;
			if (admins === 1) throw new ServiceError(409, 'The site needs at least one admin; make someone else admin first');
		}
		tx.update(users).set({ siteRole }).where(eq(users.id, userId)).run();
	});
}
