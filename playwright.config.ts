import { defineConfig } from '@playwright/test';

const PORT = Number(process.env.E2E_PORT ?? 4173);
// One throwaway database per port, so runs on different ports do not meet.
const DB = `data/e2e-${PORT}.db`;

/** End-to-end tests run against the built app (`node build`) on a throwaway database. */
export default defineConfig({
	testDir: 'tests',
	testMatch: '**/*.e2e.ts',
	fullyParallel: false,
	workers: 1,
	retries: 0,
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
		env: { PORT: String(PORT), DATABASE_PATH: DB, COOKIE_SECURE: 'false', E2E: '1' }
	}
});
