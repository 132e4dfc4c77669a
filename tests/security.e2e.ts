import { type Page } from '@playwright/test';
import { request as httpRequest } from 'node:http';
import { caughtMailTo, expect, linkPath, newUser, PASSWORD, shot, test, waitForHydration } from './helpers';

/**
 * Account safety and hardening against the built server: redirects after sign-in, security
 * headers and the page CSP (no violations while the pages and exports run), the API's one
 * error shape for 404/405/413/431, and a reset that revokes API tokens. Reset links are read
 * from what the app's local mail catcher received over SMTP (tests/helpers.ts), not through any route.
 */
const PORT = Number(process.env.E2E_PORT ?? 4173);

/** The newest reset link mailed to `email`, as the app's local SMTP catcher received it. */
async function resetLinkFor(email: string): Promise<string> {
	const mail = await caughtMailTo(email);
	expect(mail.sender).toBe('no-reply@termwright.localhost');
	return linkPath(mail, 'reset');
}

/** Collects CSP violations reported in the page (console and securitypolicyviolation events). */
async function watchCsp(page: Page): Promise<string[]> {
	const violations: string[] = [];
	page.on('console', (m) => {
		if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text());
	});
	await page.addInitScript(() => {
		document.addEventListener('securitypolicyviolation', (e) => console.error(`Refused to … CSP ${e.violatedDirective} ${e.blockedURI}`));
	});
	return violations;
}

test('after sign-in, next= goes only to paths on this site', async ({ browser }) => {
	const { context, page, email } = await newUser(browser, 'Rita Redirect', 'redirect');
	await page.getByRole('button', { name: 'Sign out' }).click();
	for (const next of ['/\\evil.example', '/%09/evil.example', '//evil.example', 'https://evil.example/']) {
		await page.goto(`/signin?next=${next.startsWith('/%') ? next : encodeURIComponent(next)}`);
		await page.getByLabel('E-mail').fill(email);
		await page.getByLabel('Password').fill(PASSWORD);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect(page).toHaveURL(new RegExp(`^http://localhost:${PORT}/projects$`));
		// Signed in, the page itself redirects too: still only here.
		const answer = await page.request.get(`/signin?next=${encodeURIComponent(next)}`, { maxRedirects: 0 });
		expect(answer.status()).toBe(303);
		expect(new URL(answer.headers()['location'], `http://localhost:${PORT}`).origin).toBe(`http://localhost:${PORT}`);
		await page.getByRole('button', { name: 'Sign out' }).click();
	}
	await context.close();
});

test('pages and API answers carry the security headers; the page CSP has a nonce and forbids framing', async ({ request }) => {
	const page = await request.get('/builder');
	const h = page.headers();
	expect(h['x-content-type-options']).toBe('nosniff');
	expect(h['referrer-policy']).toBe('same-origin');
	expect(h['x-frame-options']).toBe('DENY');
	const csp = h['content-security-policy'];
	expect(csp).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]+'/);
	expect(csp).toContain("frame-ancestors 'none'");
	expect(csp).toContain("object-src 'none'");
	expect(csp.match(/script-src[^;]*/)![0]).not.toContain('unsafe-inline');
	// Served over http here, so no HSTS (it is sent only over https).
	expect(h['strict-transport-security']).toBeUndefined();
	const api = await request.get('/api/v1/terms?config=2p2');
	expect(api.headers()['x-content-type-options']).toBe('nosniff');
	expect(api.headers()['content-security-policy']).toContain("default-src 'none'");
});

test('the Builder, the Shelf entry page and the picture exports run under the CSP without violations', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Cora Csp', 'csp');
	const violations = await watchCsp(page);
	await page.goto('/builder?config=3d5%204s');
	await expect(page.getByRole('tab', { name: 'Level diagram' })).toBeVisible();
	await page.getByRole('tab', { name: 'Level diagram' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Level diagram' });
	await expect(panel.getByTestId('level-diagram-svg')).toBeVisible();
	const [svg] = await Promise.all([page.waitForEvent('download'), panel.getByRole('button', { name: 'Export SVG' }).click()]);
	expect(svg.suggestedFilename()).toMatch(/\.svg$/);
	const [png] = await Promise.all([page.waitForEvent('download'), panel.getByRole('button', { name: 'Export PNG' }).click()]);
	expect(png.suggestedFilename()).toMatch(/\.png$/);
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	await expect(page.getByRole('tabpanel', { name: 'Coupling bridge' }).getByTestId('bridge-link').first()).toBeVisible();

	// A Shelf entry page with its level table (fonts, styles, enhanced forms).
	await page.goto('/projects');
	await page.getByLabel('Name').fill('CSP check');
	await page.getByRole('button', { name: 'Create project' }).click();
	await page.getByRole('link', { name: 'Add configuration' }).click();
	await page.getByLabel('Title').fill('Nitrogen ground');
	await page.getByLabel('Configuration').fill('1s2 2s2 2p3');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('Nitrogen ground');
	await page.reload();
	await expect(page.locator('tr[data-level]').first()).toBeVisible();
	// The self-hosted fonts load (font-src 'self').
	expect(await page.evaluate(() => document.fonts.check('16px "Fira Sans"'))).toBe(true);
	await shot(page, 'csp-shelf-entry');
	expect(violations).toEqual([]);
	await context.close();
});

test('every public page loads under the CSP without violations', async ({ page }) => {
	const violations = await watchCsp(page);
	for (const path of ['/', '/builder?config=2p5%203p', '/basis?j1=1&j2=1/2', '/transitions', '/signin', '/signup', '/forgot']) {
		const answer = await page.goto(path);
		expect(answer?.status(), path).toBe(200);
		await page.waitForLoadState('networkidle');
	}
	expect(violations).toEqual([]);
});

test('API failures outside the handlers answer in the one error shape: 404, 405, 413, 431', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Bea Body', 'big-body');
	const request = page.request;
	const notFound = await request.get('/api/v1/no-such-route', { headers: { accept: 'text/html' } });
	expect(notFound.status()).toBe(404);
	expect(await notFound.json()).toEqual({ error: { message: 'No such API route; GET /api/v1 lists them' } });

	const wrongMethod = await request.put('/api/v1/terms?config=2p2', { data: {} });
	expect(wrongMethod.status()).toBe(405);
	expect((await wrongMethod.json()).error.message).toBeTruthy();

	// A body over the limit is refused with 413 — by the API's own JSON cap (256 KB) or, when
	// BODY_SIZE_LIMIT is lower than that, by adapter-node (npm start raises it for project restores).
	const big = await request.post('/api/v1/projects', { data: { name: 'x'.repeat(600 * 1024) } });
	expect(big.status()).toBe(413);
	const bigBody = await big.json();
	expect(bigBody.error.message).toMatch(/over \d+ bytes|exceeds limit of \d+ bytes/);
	expect(JSON.stringify(bigBody)).not.toMatch(/at .*\.js|node_modules/);

	// An over-long URL is refused by Node's parser (16 KB of headers) — still JSON in the shape.
	const long = await new Promise<{ status: number; body: string }>((resolve, reject) => {
		const req = httpRequest({ host: 'localhost', port: PORT, path: `/api/v1/terms?config=${'2p'.repeat(12_000)}` }, (res) => {
			let body = '';
			res.on('data', (c) => (body += c));
			res.on('end', () => resolve({ status: res.statusCode!, body }));
		});
		req.on('error', reject);
		req.end();
	});
	expect(long.status).toBe(431);
	expect(JSON.parse(long.body).error.message).toMatch(/over the server limit/);
	await context.close();
});

test('a password reset signs out other sessions and revokes API tokens, and the account page says so', async ({ browser }) => {
	const { context, page, email } = await newUser(browser, 'Tom Token', 'reset-tokens');
	await page.goto('/account');
	await page.getByLabel('Name').fill('nightly script');
	await page.getByRole('button', { name: 'Create token' }).click();
	const token = (await page.getByTestId('new-token').textContent())!.trim();
	const authorised = { headers: { authorization: `Bearer ${token}` } };
	expect((await page.request.get('/api/v1/projects', authorised)).status()).toBe(200);

	// The same person forgets the password in another browser.
	const other = await browser.newContext();
	const otherPage = waitForHydration(await other.newPage());
	await otherPage.goto('/forgot');
	await otherPage.getByLabel('E-mail').fill(email);
	await otherPage.getByRole('button', { name: 'Send reset link' }).click();
	await expect(otherPage.getByRole('status')).toContainText('If an account uses this e-mail');
	await otherPage.goto(await resetLinkFor(email));
	await otherPage.getByLabel(/New password/).fill('a-brand-new-password');
	await otherPage.getByRole('button', { name: 'Set password and sign in' }).click();
	await expect(otherPage).toHaveURL(/\/account\?ended=reset/);
	await expect(otherPage.getByTestId('ended-notice')).toHaveText(
		'Your new password is set. Every other session is signed out. 1 personal API token was revoked; create new ones below for your scripts.'
	);
	await shot(otherPage, 'account-after-reset');

	// The token and the first browser's session no longer work.
	const refused = await otherPage.request.get('/api/v1/projects', authorised);
	expect(refused.status()).toBe(401);
	expect(await refused.json()).toEqual({ error: { message: 'The API token is not valid; create one on your account page' } });
	await page.goto('/projects');
	await expect(page).toHaveURL(/\/signin\?next=/);
	await context.close();
	await other.close();
});

test('change password needs the current one; sign out everywhere ends the other sessions', async ({ browser }) => {
	const { context, page, email } = await newUser(browser, 'Pia Password', 'change-pw');
	const second = await browser.newContext();
	const secondPage = waitForHydration(await second.newPage());
	await secondPage.goto('/signin');
	await secondPage.getByLabel('E-mail').fill(email);
	await secondPage.getByLabel('Password').fill(PASSWORD);
	await secondPage.getByRole('button', { name: 'Sign in' }).click();
	await expect(secondPage).toHaveURL(/\/projects$/);

	await page.goto('/account');
	await page.getByLabel('Current password').fill('not-my-password');
	await page.getByLabel('New password (at least 10 characters)').fill('another-good-password');
	await page.getByRole('button', { name: 'Change password' }).click();
	await expect(page.getByRole('alert')).toHaveText('The current password is not right');
	await page.getByLabel('Current password').fill(PASSWORD);
	await page.getByLabel('New password (at least 10 characters)').fill('another-good-password');
	await page.getByRole('button', { name: 'Change password' }).click();
	await expect(page.getByTestId('ended-notice')).toContainText('Your password is changed. Every other session is signed out.');
	// This browser stays signed in; the other one is out.
	await page.goto('/projects');
	await expect(page).toHaveURL(/\/projects$/);
	await secondPage.goto('/projects');
	await expect(secondPage).toHaveURL(/\/signin\?next=/);

	// Sign in again there, then end it from here with "sign out everywhere".
	await secondPage.getByLabel('E-mail').fill(email);
	await secondPage.getByLabel('Password').fill('another-good-password');
	await secondPage.getByRole('button', { name: 'Sign in' }).click();
	await expect(secondPage).toHaveURL(/\/projects$/);
	await page.goto('/account');
	await page.getByRole('button', { name: 'Sign out everywhere else' }).click();
	await expect(page.getByTestId('ended-notice')).toHaveText('Every other session is signed out.');
	await secondPage.goto('/projects');
	await expect(secondPage).toHaveURL(/\/signin\?next=/);
	await page.goto('/projects');
	await expect(page).toHaveURL(/\/projects$/);
	await shot(page, 'account-signed-out-everywhere');
	await context.close();
	await second.close();
});

test('the caught-mail view is off outside development and demos, even for the site admin', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Ada Admin', 'outbox');
	const answer = await page.goto('/admin/outbox');
	// 404 for the view that is off, or 403 when this account is not the site admin (another test signed up first).
	expect([403, 404]).toContain(answer?.status());
	await expect(page.getByRole('link', { name: 'Caught mail' })).toHaveCount(0);
	await context.close();
});
