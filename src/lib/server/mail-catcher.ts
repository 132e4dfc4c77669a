/**
 * The local mail catcher: a small SMTP server (the `smtp-server` package) on the loopback address
 * that accepts every message and hands it to `store`, instead of delivering it anywhere. The app
 * sends to it with nodemailer over SMTP exactly as it would to a real server, so development,
 * demos and the browser tests run the code path a production install runs.
 *
 * It listens on 127.0.0.1 only — nobody on the network can drop mail into it — offers no
 * STARTTLS (there is nothing to protect on the loopback) and accepts any login, so an SMTP_URL
 * with credentials works against it too. Messages over 1 MB are refused.
 */
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';
import type { AddressInfo } from 'node:net';

export const CATCHER_HOST = '127.0.0.1';
const MAX_MESSAGE_BYTES = 1024 * 1024;

/** One message as the catcher received it. */
export interface CaughtMessage {
	/** The envelope's recipients (RCPT TO), comma-separated. */
	to: string;
	/** The envelope's sender (MAIL FROM), or the From header when the envelope has none. */
	from: string;
	subject: string;
	/** The plain-text body, decoded (quoted-printable, base64, character set). */
	text: string;
	receivedAt: Date;
}

export interface MailCatcher {
	/** The URL to give nodemailer: smtp://127.0.0.1:<port>. */
	url: string;
	port: number;
	close(): Promise<void>;
}

const addressText = (a: AddressObject | AddressObject[] | undefined) =>
	Array.isArray(a) ? a.map((x) => x.text).join(', ') : (a?.text ?? '');

/**
 * Starts a catcher on 127.0.0.1:`port` (0 picks a free port) and resolves once it listens;
 * rejects when the port is taken. Each message is parsed and passed to `store`; when `store`
 * throws, the sender gets a temporary SMTP error (451), so the failure shows on its side.
 * @example const catcher = await startMailCatcher({ port: 2525, store: (m) => console.log(m.subject) });
 */
export function startMailCatcher(options: { port: number; store: (message: CaughtMessage) => void | Promise<void> }): Promise<MailCatcher> {
	const server = new SMTPServer({
		banner: 'Termwright local mail catcher; nothing is delivered',
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		size: MAX_MESSAGE_BYTES,
		logger: false,
		onAuth: (_auth, _session, callback) => callback(null, { user: 'catcher' }),
		onData(stream, session, callback) {
			simpleParser(stream)
				.then(async (parsed) => {
					if (stream.sizeExceeded) throw Object.assign(new Error('Message is over 1 MB'), { responseCode: 552 });
					const envelopeFrom = session.envelope.mailFrom ? session.envelope.mailFrom.address : '';
					await options.store({
						to: session.envelope.rcptTo.map((r) => r.address).join(', ') || addressText(parsed.to),
						from: envelopeFrom || addressText(parsed.from),
						subject: parsed.subject ?? '',
						text: (parsed.text ?? '').replace(/\r\n/g, '\n'),
						receivedAt: new Date()
					});
					callback();
				})
				.catch((e: Error & { responseCode?: number }) => {
					console.error(`Mail catcher: a message could not be stored: ${e.message}`);
					callback(Object.assign(new Error(e.message), { responseCode: e.responseCode ?? 451 }));
				});
		}
	});
	return new Promise((resolve, reject) => {
		const onListenError = (e: Error) => reject(e);
		server.once('error', onListenError);
		server.listen(options.port, CATCHER_HOST, () => {
			server.off('error', onListenError);
			// Errors of single connections must not end the process.
			server.on('error', (e) => console.error(`Mail catcher: ${e.message}`));
			const port = (server.server.address() as AddressInfo).port;
			resolve({
				url: `smtp://${CATCHER_HOST}:${port}`,
				port,
				close: () => new Promise<void>((done) => server.close(() => done()))
			});
		});
	});
}
