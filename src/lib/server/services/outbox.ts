/**
 * The mail view for site admins in development and demos (see mail.ts for when it is on): what
 * the local catcher received, and mail the app could not send. One-time links that still work —
 * password resets and invitations — are masked: an admin must not be able to take over an account
 * or join a project by reading someone else's mail. Spent, expired or revoked links are shown in
 * full (they open nothing).
 */
import { requireSiteAdmin, type Actor } from '../access';
import { notFound } from '../errors';
import { capturedMail, outboxViewIsOn } from '../mail';
import { resetTokenUser } from './password-reset';
import { invitationForToken } from './invitations';

const ONE_TIME_LINK = /(\/(reset|invite)\/)([A-Za-z0-9_-]{16,})/g;

export type LinkKind = 'reset' | 'invite';

/** The body with every live one-time token replaced by its first four characters and a note. */
export function maskLiveLinks(body: string, isLive: (token: string, kind: LinkKind) => boolean): string {
	return body.replace(ONE_TIME_LINK, (whole, prefix: string, kind: LinkKind, token: string) =>
		isLive(token, kind) ? `${prefix}${token.slice(0, 4)}…[hidden while the link works; only the recipient may open it]` : whole
	);
}

const linkIsLive = (token: string, kind: LinkKind) =>
	kind === 'reset' ? resetTokenUser(token) !== null : invitationForToken(token)?.state === 'pending';

/** Caught and failed mail, newest first, with live links masked. 404 when the mail view is off. */
export function outboxForAdmin(actor: Actor, limit = 100) {
	requireSiteAdmin(actor);
	if (!outboxViewIsOn()) throw notFound('The mail view is off (set MAIL_OUTBOX=on in development or a demo)');
	return capturedMail(limit).map((m) => ({ ...m, body: maskLiveLinks(m.body, linkIsLive) }));
}
