/**
 * The outbox view for site admins in development and demos (see mail.ts for when it is on).
 * Reset links that still work are masked: an admin must not be able to take over an account
 * by reading its mail. Spent or expired links are shown in full (they open nothing).
 */
import { requireSiteAdmin, type Actor } from '../access';
import { notFound } from '../errors';
import { capturedMail, outboxViewIsOn } from '../mail';
import { resetTokenUser } from './password-reset';

const RESET_LINK = /(\/reset\/)([A-Za-z0-9_-]{16,})/g;

/** The body with every live reset token replaced by its first four characters and a note. */
export function maskLiveLinks(body: string, isLive: (token: string) => boolean): string {
	return body.replace(RESET_LINK, (whole, prefix: string, token: string) =>
		isLive(token) ? `${prefix}${token.slice(0, 4)}…[hidden while the link works; only the recipient may open it]` : whole
	);
}

/** Captured mail, newest first, with live links masked. 404 when the outbox view is off. */
export function outboxForAdmin(actor: Actor, limit = 100) {
	requireSiteAdmin(actor);
	if (!outboxViewIsOn()) throw notFound('The outbox view is off (set MAIL_OUTBOX=on in development or a demo)');
	return capturedMail(limit).map((m) => ({ ...m, body: maskLiveLinks(m.body, (t) => resetTokenUser(t) !== null) }));
}
