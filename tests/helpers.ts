import { test as base, expect, type Browser, type Page } from '@playwright/test';
import Database from 'better-sqlite3';
import { mkdirSync } from 'node:fs';

export const PASSWORD = 'e2e-password-123';

/** A unique address per run, so tests never collide with earlier accounts. */
export const uniqueEmail = (who: string) => `${who}-${Date.now().toString(36)}-${Math.floor(Math.random() * 1e6)}@e2e.example`;

export async function signUp(page: Page, name: string, email: string) {
	waitForHydration(page);
	await page.goto('/signup');
	await page.getByLabel('Name').fill(name);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(PASSWORD);
	await page.getByRole('button', { name: 'Create account' }).click();
	await expect(page).toHaveURL(/\/projects$/);
}

export async function newUser(browser: Browser, name: string, who: string) {
	const context = await browser.newContext();
	const page = await context.newPage();
	const email = uniqueEmail(who);
	await signUp(page, name, email);
	return { context, page, email };
}

const patched = new WeakSet<Page>();

/**
 * From now on, page.goto and page.reload of an HTML page return only once the client has hydrated it
 * (the root layout sets html[data-hydrated]). A select that submits on change, or a button with a
 * click handler, does nothing before that, and a slow machine makes the gap long enough to lose a step.
 */
export function waitForHydration(page: Page): Page {
	if (patched.has(page)) return page;
	patched.add(page);
	const settle = async <T extends Awaited<ReturnType<Page['goto']>>>(response: T): Promise<T> => {
		if (response?.headers()['content-type']?.startsWith('text/html') && response.ok()) {
			await expect(page.locator('html[data-hydrated="true"]')).toHaveCount(1, { timeout: 15_000 });
		}
		return response;
	};
	const goto = page.goto.bind(page);
	const reload = page.reload.bind(page);
	page.goto = async (url, options) => settle(await goto(url, options));
	page.reload = async (options) => settle(await reload(options));
	return page;
}

/** Playwright's test, with the page fixture waiting for hydration after each goto and reload. */
export const test = base.extend({
	page: async ({ page }, use) => {
		await use(waitForHydration(page));
	}
});
export { expect };

/** Opens a page and waits until the client has hydrated it. */
export async function gotoHydrated(page: Page, url: string) {
	await waitForHydration(page).goto(url);
}

export async function shot(page: Page, name: string) {
	mkdirSync('tests/screenshots', { recursive: true });
	await page.screenshot({ path: `tests/screenshots/${name}.png`, fullPage: true });
}

/** The test server's database file (playwright.config.ts: one per port). */
export const E2E_DB = `data/e2e-${Number(process.env.E2E_PORT ?? 4173)}.db`;

export interface CaughtMail {
	to: string;
	sender: string;
	subject: string;
	body: string;
}

/**
 * A test-only reader of the mail catcher's store: the newest message the app's local SMTP catcher
 * RECEIVED for `to` (rows with status 'caught' in the outbox table of the test database; the app
 * writes only 'failed' rows itself). Waits a little, as a mailbox would be checked.
 */
export async function caughtMailTo(to: string): Promise<CaughtMail> {
	let found: CaughtMail | undefined;
	await expect
		.poll(
			() => {
				const db = new Database(E2E_DB, { readonly: true, fileMustExist: true });
				try {
					found = db
						.prepare(`select "to", sender, subject, body from outbox where "to" = ? and status = 'caught' order by id desc limit 1`)
						.get(to) as CaughtMail | undefined;
				} finally {
					db.close();
				}
				return found !== undefined;
			},
			{ message: `a caught mail to ${to}`, timeout: 10_000 }
		)
		.toBe(true);
	return found!;
}

/** The path of the first link to this site in a mail that matches `/reset/…` or `/invite/…`. */
export function linkPath(mail: CaughtMail, kind: 'reset' | 'invite'): string {
	const link = new RegExp(`https?://\\S+/${kind}/[A-Za-z0-9_-]+`).exec(mail.body)?.[0];
	if (!link) throw new Error(`no ${kind} link in the mail to ${mail.to}`);
	return new URL(link).pathname;
}

/** Creates a project from the Projects page (where sign-up lands) and opens it. */
export async function createProject(page: Page, name: string) {
	await page.goto('/projects');
	await page.getByLabel('Name').fill(name);
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name })).toBeVisible();
	const projectUrl = page.url();
	return { projectUrl, projectId: projectUrl.split('/').pop()! };
}

/** Adds a Shelf entry from the project's page and opens it. */
export async function addEntry(
	page: Page,
	projectUrl: string,
	entry: { title: string; notation: string; species?: string; tags?: string }
) {
	await page.goto(projectUrl);
	await page.getByRole('link', { name: 'Add configuration' }).click();
	await page.getByLabel('Title').fill(entry.title);
	await page.getByLabel('Configuration').fill(entry.notation);
	if (entry.species !== undefined) await page.getByLabel('Species').fill(entry.species);
	if (entry.tags !== undefined) await page.getByLabel('Tags (comma separated)').fill(entry.tags);
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText(entry.title);
	const entryUrl = page.url();
	return { entryUrl, entryId: entryUrl.split('/').pop()! };
}

/** An owner adds an existing account to the project with a role, on the Members page. */
export async function addMember(
	page: Page,
	projectUrl: string,
	member: { email: string; name: string },
	role: 'viewer' | 'editor' | 'owner'
) {
	await page.goto(`${projectUrl}/members`);
	await page.getByLabel('E-mail of their account').fill(member.email);
	await page.locator('form[action="?/add"] select[name=role]').selectOption(role);
	await page.getByRole('button', { name: 'Add or invite' }).click();
	await expect(page.getByTestId('member-list')).toContainText(member.name);
}
