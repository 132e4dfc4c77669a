/**
 * Outgoing mail through nodemailer. With SMTP_URL set, mail goes to that server. Without it
 * (development, the demo and tests) a JSON transport renders the message and it is kept in
 * the `outbox` table, which site admins read at /admin/outbox.
 */
import { createTransport } from 'nodemailer';
import { desc } from 'drizzle-orm';
import { db } from './db';
import { outbox } from './db/schema';

const smtpUrl = process.env.SMTP_URL;
const from = process.env.MAIL_FROM ?? 'Termwright <no-reply@termwright.localhost>';
const transport = smtpUrl ? createTransport(smtpUrl) : createTransport({ jsonTransport: true });

export const mailIsCaptured = !smtpUrl;

export async function sendMail(message: { to: string; subject: string; text: string }): Promise<void> {
	await transport.sendMail({ from, ...message });
	if (mailIsCaptured) db.insert(outbox).values({ to: message.to, subject: message.subject, body: message.text }).run();
}

export function capturedMail(limit = 100) {
	return db.select().from(outbox).orderBy(desc(outbox.id)).limit(limit).all();
}
