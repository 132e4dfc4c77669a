/**
 * Outgoing mail through nodemailer. With SMTP_URL set, mail goes to that server and nothing is
 * kept. Without it (development, the demo and tests) a JSON transport renders the message and
 * it is kept in the `outbox` table.
 *
 * Who may read the captured mail: site admins at /admin/outbox, and only when the outbox view
 * is on — `MAIL_OUTBOX=on` (the demo sets it) or the Vite dev server, and never while SMTP_URL
 * is set. Even then, a one-time link that still works is masked in the view; only the mailbox
 * of the recipient would ever hold it.
 */
import { createTransport } from 'nodemailer';
import { desc } from 'drizzle-orm';
import { dev } from '$app/environment';
import { db } from './db';
import { outbox } from './db/schema';

const smtpUrl = process.env.SMTP_URL;
const from = process.env.MAIL_FROM ?? 'Termwright <no-reply@termwright.localhost>';
const transport = smtpUrl ? createTransport(smtpUrl) : createTransport({ jsonTransport: true });

export const mailIsCaptured = !smtpUrl;

/** True when /admin/outbox may show captured mail (development and demo only). */
export function outboxViewIsOn(env: Record<string, string | undefined> = process.env, isDev = dev): boolean {
	if (env.SMTP_URL) return false;
	const flag = env.MAIL_OUTBOX?.toLowerCase();
	if (flag === 'on' || flag === '1' || flag === 'true') return true;
	if (flag === 'off' || flag === '0' || flag === 'false') return false;
	return isDev;
}

export async function sendMail(message: { to: string; subject: string; text: string }): Promise<void> {
	await transport.sendMail({ from, ...message });
	if (mailIsCaptured) db.insert(outbox).values({ to: message.to, subject: message.subject, body: message.text }).run();
}

export function capturedMail(limit = 100) {
	return db.select().from(outbox).orderBy(desc(outbox.id)).limit(limit).all();
}
