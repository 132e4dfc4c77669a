/**
 * For server tests that send mail: starts a local catcher on a free loopback port, storing into
 * the test's database like the app's catcher, and points `sendMail` at it — the same SMTP path
 * the app takes. Call in `beforeAll`, close in `afterAll`.
 */
import { keepCaughtMail, useMailCatcher } from './mail';
import { startMailCatcher, type MailCatcher } from './mail-catcher';

export async function catchMailInTests(): Promise<MailCatcher> {
	const catcher = await startMailCatcher({ port: 0, store: keepCaughtMail });
	useMailCatcher(catcher.url);
	return {
		...catcher,
		close: async () => {
			useMailCatcher(null);
			await catcher.close();
		}
	};
}
