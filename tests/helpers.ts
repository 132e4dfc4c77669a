import { expect, type Browser, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';

export const PASSWORD = 'e2e-password-123';

/** A unique address per run, so tests never collide with earlier accounts. */
export const uniqueEmail = (who: string) => `${who}-${Date.now().toString(36)}-${Math.floor(Math.random() * 1e6)}@e2e.example`;

export async function signUp(page: Page, name: string, email: string) {
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

export async function shot(page: Page, name: string) {
	mkdirSync('tests/screenshots', { recursive: true });
	await page.screenshot({ path: `tests/screenshots/${name}.png`, fullPage: true });
}
