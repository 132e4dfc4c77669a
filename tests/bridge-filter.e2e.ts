import { expect, shot, test } from './helpers';

/**
 * The Coupling bridge drawn for chosen J values, and its compact rows. 2p 3d has the LS levels
 * ¹P₁ ³P₀,₁,₂ ¹D₂ ³D₁,₂,₃ ¹F₃ ³F₂,₃,₄ (non-equivalent p d, Condon & Shortley 1935, ch. VII): three
 * of J = 1 and three of J = 3, 12 in all; jK and jj have as many of each J (Cowan 1981, sec. 4.12).
 * 4f³ has 41 levels (from memory; the badge's own check compares LS and jj counts).
 */
test('filter the bridge of 2p 3d to J = 1 and 3: 6 levels drawn, the badge still counts 12; compact rows', async ({ page }) => {
	for (const width of [1280, 768]) {
		await page.setViewportSize({ width, height: 900 });
		await page.goto('/builder?config=' + encodeURIComponent('2p 3d'));
		await page.getByRole('tab', { name: 'Coupling bridge' }).click();
		const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(12);
		await expect(panel.getByTestId('bridge-showing')).toHaveCount(0);
		const filter = panel.getByTestId('bridge-filter');
		await expect(filter.getByRole('button', { name: 'J = 1 (3 levels)' })).toBeVisible();
		await filter.getByRole('button', { name: 'J = 1 (3 levels)' }).click();
		await filter.getByRole('button', { name: 'J = 3 (3 levels)' }).click();
		await expect(filter.getByRole('button', { name: 'J = 3 (3 levels)' })).toHaveAttribute('aria-pressed', 'true');
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(6);
		await expect(panel.getByTestId('bridge-jj-level')).toHaveCount(6);
		await expect(panel.getByTestId('bridge-jk-level')).toHaveCount(6);
		await expect(panel.getByTestId('bridge-link')).toHaveCount(6);
		const labels = await panel.getByTestId('bridge-ls-level').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
		expect(labels.every((l) => /[13]$/.test(l.replace(/\s/g, '')) || /J ?= ?[13]\b/.test(l))).toBe(true);
		await expect(panel.getByTestId('bridge-count-badge')).toHaveText(/LS 12 = jK 12 = jj 12 levels/);
		await expect(panel.getByTestId('bridge-showing')).toHaveText('showing 6 of 12 levels');
		await expect(panel.getByTestId('bridge-svg')).toContainText('J = 1, 3 only');
		// Compact rows: the same six levels in a shorter picture.
		const compact = filter.getByLabel('compact rows');
		await expect(compact).not.toBeChecked();
		const tall = Number(await panel.getByTestId('bridge-svg').getAttribute('height'));
		await compact.check();
		await expect.poll(async () => Number(await panel.getByTestId('bridge-svg').getAttribute('height'))).toBeLessThan(tall);
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(6);
		// At 768 px the three columns are wider than the frame: the page says it scrolls sideways.
		await expect(panel.getByTestId('bridge-scroll-cue')).toHaveCount(width === 768 ? 1 : 0);
		await shot(page, `bridge-filter-${width}`);
		// "all" shows the whole bridge again.
		await filter.getByRole('button', { name: 'all' }).click();
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(12);
		await expect(panel.getByTestId('bridge-showing')).toHaveCount(0);
	}
});

test('a bridge of many levels (4f3, 41) starts in compact rows', async ({ page }) => {
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=4f3');
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(41);
	await expect(panel.getByTestId('bridge-filter').getByLabel('compact rows')).toBeChecked();
	await shot(page, 'bridge-compact-4f3');
	await panel
		.getByTestId('bridge-filter')
		.getByRole('button', { name: /^J = 9\/2 / })
		.click();
	await expect(panel.getByTestId('bridge-showing')).toHaveText(/^showing \d+ of 41 levels$/);
	// Few levels left: the compact default no longer applies.
	await expect(panel.getByTestId('bridge-filter').getByLabel('compact rows')).not.toBeChecked();
	await shot(page, 'bridge-4f3-j9-2');
});
