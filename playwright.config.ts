import { defineConfig } from '@playwright/test';

const PORT = Number(process.env.E2E_PORT ?? 4173);
// One throwaway database per port, so runs on different ports do not meet.
const DB = `data/e2e-${PORT}.db`;
// The app's local mail catcher listens on a loopback port derived from the app's (4173 → 2573), so
// parallel runs on different ports do not meet there either; E2E_MAIL_PORT sets it outright.
const MAIL_PORT = Number(process.env.E2E_MAIL_PORT ?? PORT - 1600);

/** End-to-end tests run against the built app (`node build`) on a throwaway database. */
export default defineConfig({
	testDir: 'tests',
	testMatch: '**/*.e2e.ts',
	fullyParallel: false,
	workers: 1,
	// On CI one retry, as Playwright's own template sets it; a test that passes only on the retry is
	// listed as "flaky" in the report and is a bug to fix, not a pass to keep.
	retries: process.env.CI ? 1 : 0,
	reporter: [['list']],
	timeout: 60_000,
	use: {
		baseURL: `http://localhost:${PORT}`,
		browserName: 'chromium',
		viewport: { width: 1280, height: 800 },
		launchOptions: {
			executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
			args: [
				'--no-sandbox',
				'--disable-gpu',
				'--disable-background-networking',
				'--disable-component-update',
				'--disable-sync',
				'--no-first-run',
				'--disable-quic'
			]
		}
	},
	webServer: {
		command: `rm -f ${DB} ${DB}-* && node scripts/start.js`,
		url: `http://localhost:${PORT}/api/v1`,
		reuseExistingServer: false,
		timeout: 60_000,
		// The mail goes over SMTP to the catcher; the tests read what it received from the database.
		// No SMTP_URL (a real server in the environment must not get test mail) and no MAIL_OUTBOX: the admin view stays off.
		env: {
			PORT: String(PORT),
			DATABASE_PATH: DB,
			COOKIE_SECURE: 'false',
			E2E: '1',
			MAIL_CATCHER: 'on',
			MAIL_CATCHER_PORT: String(MAIL_PORT),
			SMTP_URL: '',
			MAIL_OUTBOX: ''
		}
	}
});
