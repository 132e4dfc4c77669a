/**
 * Outgoing mail, always over SMTP through nodemailer: to the server in SMTP_URL, or — when
 * SMTP_URL is unset — to the local mail catcher this process started (mail-catcher.ts, started
 * by hooks.server.ts with MAIL_CATCHER=on: the demo, the browser tests and the Vite dev server).
 * The catcher stores what it receives in the `outbox` table. With a real SMTP_URL nothing is kept.
 *
 * A mail that cannot be handed to the server is never lost silently: `sendMail` logs it (without
 * credentials), keeps a row with status 'failed' (without the body, which may hold a one-time link)
 * and tells its caller, which tells the person who asked.
 *
 * Who may read the caught mail: site admins at /admin/outbox, and only when the mail view is on —
 * `MAIL_OUTBOX=on` (the demo sets it) or the Vite dev server, and never while SMTP_URL is set.
 * Even then, a one-time link that still works is masked in the view (services/outbox.ts).
 */
import { createTransport, type Transporter } from 'nodemailer';
import { desc } from 'drizzle-orm';
import { dev } from '$app/environment';
import { db } from './db';
import { outbox } from './db/schema';
import { mailFrom, smtpUrl } from './config';
import type { CaughtMessage } from './mail-catcher';

/**
 * The URL of the catcher this process runs, once it listens (see `useMailCatcher`). Kept on
 * globalThis because the Vite dev server may load this module afresh while the catcher runs on.
 */
const CATCHER_URL = Symbol.for('termwright.mailCatcherUrl');
const shared = globalThis as typeof globalThis & { [CATCHER_URL]?: string | null };
let transport: { url: string; transporter: Transporter } | null = null;

/** Sends this process's mail to the local catcher at `url` (null: stop). SMTP_URL still wins. */
export function useMailCatcher(url: string | null): void {
	shared[CATCHER_URL] = url;
	transport = null;
}

/** Where mail goes: SMTP_URL, else the local catcher, else nowhere (every send fails, and says so). */
export function mailServerUrl(): string | null {
	return smtpUrl() ?? shared[CATCHER_URL] ?? null;
}

/** True when this process's mail lands in its own catcher (and so in the outbox table). */
export const mailIsCaught = () => !smtpUrl() && (shared[CATCHER_URL] ?? null) !== null;

function transporter(url: string): Transporter {
	if (transport?.url !== url)
		// Short timeouts: the person who asked waits for the answer, and a dead server must not hold the page for minutes.
		transport = { url, transporter: createTransport({ url, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 }) };
	return transport.transporter;
}

/** True when /admin/outbox may show caught mail (development and demo only). */
export function outboxViewIsOn(env: Record<string, string | undefined> = process.env, isDev = dev): boolean {
	if (env.SMTP_URL) return false;
	const flag = env.MAIL_OUTBOX?.toLowerCase();
	if (flag === 'on' || flag === '1' || flag === 'true') return true;
	if (flag === 'off' || flag === '0' || flag === 'false') return false;
	return isDev;
}

const NO_MAIL_SERVER = 'no mail server is set (SMTP_URL) and no local catcher runs (MAIL_CATCHER=on)';

export type MailResult = { sent: true } | { sent: false; reason: string };

/** The transport's words without anything that could be a credential from SMTP_URL. */
function withoutSecrets(message: string, url: string | null): string {
	let text = message;
	if (url) {
		try {
			const { username, password } = new URL(url);
			for (const secret of [password, decodeURIComponent(password), username].filter((s) => s.length > 0))
				text = text.split(secret).join('…');
		} catch {
			// An unparsable URL: nothing of it is printed anyway.
		}
	}
	return text.slice(0, 300);
}

/**
 * Hands one mail to the SMTP server. Never throws for a mail that cannot be sent: it logs it,
 * keeps a 'failed' row and answers `{ sent: false, reason }` so the caller can tell the person.
 */
export async function sendMail(message: { to: string; subject: string; text: string }): Promise<MailResult> {
	const url = mailServerUrl();
	try {
		if (!url) throw new Error(NO_MAIL_SERVER);
		await transporter(url).sendMail({ from: mailFrom(), ...message });
		return { sent: true };
	} catch (e) {
		const reason = withoutSecrets(e instanceof Error ? e.message : String(e), url);
		console.error(`Mail to ${message.to} (“${message.subject}”) could not be sent: ${reason}`);
		db.insert(outbox)
			.values({ to: message.to, sender: mailFrom(), subject: message.subject, body: '', status: 'failed', error: reason })
			.run();
		return { sent: false, reason };
	}
}

/**
 * Whether the mail server answers (an SMTP greeting and EHLO). Used where an answer must not depend
 * on whether a mail was due, so a dead server shows the same to everyone (see password-reset.ts).
 */
export async function mailServerAnswers(): Promise<MailResult> {
	const url = mailServerUrl();
	if (!url) return { sent: false, reason: NO_MAIL_SERVER };
	try {
		await transporter(url).verify();
		return { sent: true };
	} catch (e) {
		const reason = withoutSecrets(e instanceof Error ? e.message : String(e), url);
		console.error(`The mail server does not answer: ${reason}`);
		return { sent: false, reason };
	}
}

/** The catcher's store: one 'caught' row per received message. */
export function keepCaughtMail(message: CaughtMessage): void {
	db.insert(outbox)
		.values({
			to: message.to,
			sender: message.from,
			subject: message.subject,
			body: message.text,
			status: 'caught',
			createdAt: message.receivedAt
		})
		.run();
}

/** Caught and failed mail, newest first. */
export function capturedMail(limit = 100) {
	return db.select().from(outbox).orderBy(desc(outbox.id)).limit(limit).all();
}
