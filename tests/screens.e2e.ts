import { type Page } from '@playwright/test';
import { expect, gotoHydrated, newUser, shot, test } from './helpers';

/**
 * Rough edges found in use, at 1280 px and 768 px. Reference values: ²P₃/₂ has g_J = 4/3 with g_s = 2,
 * i.e. 2/3 + g_s/3 for any g_s (Landé formula with g_L = 1; Condon & Shortley 1935, Zeeman chapter);
 * 2p² has M_S = −1, 0, 1 and M_L = −2 … 2 (Condon & Shortley ch. VII); 3d⁵ has 37 levels
 * (sum over its 16 terms, Condon & Shortley table 1⁷, from memory).
 */

/** The right edge of every column is reachable: either on screen or inside a frame that scrolls. */
async function columnsReachable(page: Page, testid: string) {
	return page.getByTestId(testid).evaluate((table) => {
		const frame = table.parentElement!;
		const scrolls = getComputedStyle(frame).overflowX === 'auto' && frame.scrollWidth >= table.scrollWidth;
		return table.getBoundingClientRect().right <= window.innerWidth + 1 || scrolls;
	});
}

test('Builder: g in g_s, true minus signs, the Hund caution once in full, Level diagram heading and ground in view', async ({ page }) => {
	await page.goto('/builder?config=2p');
	await expect(page.getByTestId('hund-note').or(page.getByTestId('hund-caution'))).toBeVisible();
	await page.getByText('free electron').click();
	// ²P₃/₂: g_J = 2/3 + 1/3 g_s; with g_s = 2.00231930436 the decimal is 1.334106 (rounded).
	const p32 = page.locator('[data-testid="term-sheet"] tr[data-level="2P#1|3/2"]');
	await expect(p32.getByTestId('g-gs-form')).toHaveText('2/3 + 1/3gs');
	await expect(p32).toContainText('1.334106');
	await expect(p32).not.toContainText('4/3');

	// A second view: the caution is one line that opens on request.
	await page.goto('/builder?config=3d5%204s');
	await expect(page.getByTestId('hund-caution-compact')).toBeVisible();
	await expect(page.getByTestId('hund-caution')).toHaveCount(0);
	await page.getByTestId('hund-caution-compact').locator('summary').click();
	await expect(page.getByTestId('hund-caution-compact')).toContainText("Hund's rules");
	await shot(page, 'builder-1280');

	await page.goto('/builder?config=2p2');
	await page.getByRole('tab', { name: 'State grid' }).click();
	const grid = page.getByTestId('state-grid');
	await expect(grid).toContainText('−1');
	expect(await grid.innerText()).not.toMatch(/-\d/);
	await page.getByTestId('microstate-list').locator('summary').click();
	const list = page.getByTestId('microstate-list').locator('table');
	await expect(list).toContainText('−');
	expect(await list.innerText()).not.toMatch(/-\d/);

	// Level diagram of a configuration with many terms: heading above the frame, opened at the ground term.
	await page.goto('/builder?config=3d4%204s');
	await page.getByRole('tab', { name: 'Level diagram' }).click();
	await expect(page.getByTestId('level-diagram-svg-heading')).toContainText('LS terms and J levels');
	await expect(page.getByTestId('level-diagram-svg-heading')).toContainText('at the bottom');
	const frame = page.getByRole('region', { name: 'Level diagram, scrollable' });
	const atBottom = await frame.evaluate((f) => f.scrollHeight <= f.clientHeight + 2 || f.scrollTop + f.clientHeight >= f.scrollHeight - 2);
	expect(atBottom).toBe(true);
	if (await page.getByTestId('level-diagram-svg-scroll-cue').isVisible()) {
		await expect(page.getByTestId('level-diagram-svg-scroll-cue')).toContainText('scroll up for more');
		await page.getByRole('button', { name: 'Fit to frame' }).click();
		await expect(page.getByTestId('level-diagram-svg-scroll-cue')).toContainText('Fitted');
	}
	await shot(page, 'builder-level-diagram-1280');
});

test('Builder at 768 px: the Term sheet keeps every column reachable', async ({ page }) => {
	await page.setViewportSize({ width: 768, height: 1000 });
	await page.goto('/builder?config=3d5%204s');
	await expect(page.getByTestId('term-sheet')).toBeVisible();
	expect(await columnsReachable(page, 'term-sheet')).toBe(true);
	await shot(page, 'builder-768');
});

test('Coupling bridge: a large configuration says what to do instead; 3d5 shows its 37 levels', async ({ page }) => {
	await page.goto('/builder?config=3d5');
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await expect(panel.getByTestId('bridge-count-badge')).toHaveText(/LS 37 = jj 37 levels/);
	await shot(page, 'bridge-3d5');

	const res = await page.request.get('/api/v1/bridge?config=4f7%205d%206s%206p');
	expect(res.status()).toBe(400);
	const message = (await res.json()).error.message as string;
	expect(message).toContain('Term sheet');
	expect(message).not.toMatch(/jjLevel|CountsByJ/);
});

test('members page shows the role the server holds after it refuses a change; Shelf entry and exports at 768 px', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Olga Only', 'only-owner');
	await page.getByLabel('Name').fill('Single owner');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Single owner' })).toBeVisible();
	const projectId = page.url().split('/').pop()!;
	await gotoHydrated(page, `/projects/${projectId}/members`);
	const select = page.getByLabel('Role of Olga Only');
	await select.selectOption('viewer');
	await expect(page.getByRole('alert')).toContainText('at least one owner');
	await expect(page.getByLabel('Role of Olga Only')).toHaveValue('owner');
	await shot(page, 'members-refused-role');
	// Without scripts the select cannot submit itself, so each row has a Set button; the refusal reads the same.
	const plain = await browser.newContext({ javaScriptEnabled: false, storageState: await context.storageState() });
	const plainPage = await plain.newPage();
	await plainPage.goto(`/projects/${projectId}/members`);
	await plainPage.getByLabel('Role of Olga Only').selectOption('viewer');
	await plainPage.getByRole('button', { name: 'Set' }).click();
	await expect(plainPage.getByRole('alert')).toContainText('at least one owner');
	await expect(plainPage.getByLabel('Role of Olga Only')).toHaveValue('owner');
	await plain.close();

	const created = await page.request.post(`/api/v1/projects/${projectId}/shelf`, {
		data: { title: 'Fe II ground', species: 'Fe II', notation: '[Ar] 3d6 4s', tags: ['iron group', 'demo'] }
	});
	const entryId = (await created.json()).entry.id;
	// A note is never created as confirmed (the review rule), so the widest marks here are disputed and proposed.
	for (const [levelKey, observedEnergy, status] of [
		['6D#1|9/2', '0', 'disputed'],
		['6D#1|7/2', '384.7872', 'proposed'],
		['6D#1|5/2', '667.6829', 'proposed']
	]) {
		const saved = await page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
			data: { levelKey, observedEnergy, status, comment: 'invented value' }
		});
		expect(saved.ok(), await saved.text()).toBe(true);
	}
	await page.goto(`/projects/${projectId}/shelf/${entryId}`);
	await shot(page, 'shelf-entry-1280');
	await page.setViewportSize({ width: 768, height: 1000 });
	await page.reload();
	// Status marks and dates stay on one line.
	for (const key of ['6D#1|9/2', '6D#1|7/2']) {
		const row = page.locator(`tr[data-level="${key}"]`);
		expect((await row.locator('.status').boundingBox())!.height).toBeLessThan(24);
		// One line per row: the row stays about 28 px tall (UI.md), not a tall cell of wrapped marks and dates.
		expect((await row.boundingBox())!.height).toBeLessThan(40);
	}
	await shot(page, 'shelf-entry-768');
	await page.goto(`/projects/${projectId}`);
	await expect(page.getByTestId('shelf-list')).toBeVisible();
	await shot(page, 'shelf-list-768');

	// The three exports side by side, as text, for a look.
	const base = `/api/v1/projects/${projectId}/shelf/${entryId}/levels`;
	const [csv, json, tex] = await Promise.all(
		['csv', 'json', 'tex'].map(async (f) => (await page.request.get(`${base}?format=${f}`)).text())
	);
	expect(csv).toContain('6D J=7/2');
	expect(csv).toContain(',384.7872,');
	expect(JSON.parse(json).configuration).toBe('[Ar] 3d6 4s');
	expect(tex).toContain('[Ar]~3d$^{6}$~4s');
	// The first lines of each format side by side (the whole files are long).
	const head = (t: string, n: number) => t.split(/\r?\n/).slice(0, n).join('\n').replace(/&/g, '&amp;').replace(/</g, '&lt;');
	await page.setContent(
		`<body style="font: 11px monospace; margin: 8px; display: grid; grid-template-columns: 1fr 1fr 1fr; gap: 8px">${[
			head(csv, 40),
			head(json, 40),
			head(tex, 40)
		]
			.map((t) => `<pre style="white-space: pre-wrap; word-break: break-all; border: 1px solid #999; padding: 4px; margin: 0">${t}</pre>`)
			.join('')}</body>`
	);
	await page.screenshot({ path: 'tests/screenshots/shelf-exports-768.png' });
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.screenshot({ path: 'tests/screenshots/shelf-exports-1280.png' });
	await context.close();
});
