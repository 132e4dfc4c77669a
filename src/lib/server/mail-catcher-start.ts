/**
 * Starts the local mail catcher together with the app (hooks.server.ts `init`) and points the
 * app's mail at it. One catcher per process: the Vite dev server may run `init` again after a
 * reload, and the second call must not try to listen twice.
 */
import { mailCatcherPort, mailCatcherWanted } from './config';
import { startMailCatcher, type MailCatcher } from './mail-catcher';
import { keepCaughtMail, useMailCatcher } from './mail';

const KEY = Symbol.for('termwright.mailCatcher');
type WithCatcher = typeof globalThis & { [KEY]?: Promise<MailCatcher | null> };

export function startCatcherWithApp(isDev: boolean): Promise<MailCatcher | null> {
	if (!mailCatcherWanted(isDev)) return Promise.resolve(null);
	const g = globalThis as WithCatcher;
	g[KEY] ??= startMailCatcher({ port: mailCatcherPort(), store: keepCaughtMail }).then(
		(catcher) => {
			console.log(
				`Mail catcher on ${catcher.url}: the app's mail is caught there (site admins read it at /admin/outbox when MAIL_OUTBOX=on)`
			);
			return catcher;
		},
		(e: Error) => {
			// The app still runs; every mail then fails and says so to whoever asked for it.
			console.error(`Mail catcher could not start on 127.0.0.1:${mailCatcherPort()}: ${e.message}. Mail will not be sent.`);
			return null;
		}
	);
	return g[KEY].then((catcher) => {
		useMailCatcher(catcher?.url ?? null);
		return catcher;
	});
}
