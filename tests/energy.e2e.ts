import { expect, shot, test } from './helpers';

/*
 * Reference values for 3d² with ζ = 0: ³F = A − 8B and ³P = A + 7B, so ³P lies 15B above ³F
 * (Racah 1942; Griffith 1961, Table A20). Hund's rules give ³F₂ as the lowest level of d².
 */

test('Energy solver: 3d2 levels with a literature starting set, the 15B gap of ³P, the picture and the caution', async ({ page }) => {
	await page.goto('/builder?config=3d2');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	const rows = page.locator('[data-testid="energy-levels"] tbody tr');
	await expect(rows).toHaveCount(9);
	await expect(page.getByTestId('energy-preset')).toHaveValue('v3-3d2');
	await expect(page.getByTestId('energy-preset-note')).toContainText('quoted from memory');
	await expect(rows.first()).toHaveAttribute('data-label', '3F');
	await expect(rows.first()).toHaveAttribute('data-j', '2');
	await expect(page.getByTestId('energy-caution')).toContainText('not measurements');
	await expect(page.getByTestId('energy-picture')).toBeVisible();

	// Without spin–orbit every level of a term sits at the term energy.
	await page.getByTestId('param-zeta(3d)').fill('0');
	const p0 = page.locator('[data-testid="energy-levels"] tbody tr[data-label="3P"][data-j="0"] td').nth(1);
	await expect(async () => {
		const B = Number(await page.getByTestId('racah-B-3d').inputValue());
		expect(Math.abs(Number(await p0.innerText()) - 15 * B)).toBeLessThan(0.2);
	}).toPass();

	// Scaling F^k to 80 % scales B and the gap with it.
	await page.getByTestId('energy-scale').fill('80');
	await expect(async () => expect(Math.abs(Number(await page.getByTestId('racah-B-3d').inputValue()) - 688.8)).toBeLessThan(0.05)).toPass();
	await expect(async () => expect(Math.abs(Number(await p0.innerText()) - 15 * 688.8)).toBeLessThan(0.2)).toPass();
	await shot(page, 'energy-solver-3d2');
});

test('Energy solver: typing Racah B and C sets F² = 49B + 7C and F⁴ = 63C/5; F₂ = F²/49 is shown; ³P lies 15B above ³F', async ({
	page
}) => {
	// Racah 1942, Phys. Rev. 62, 438; Condon & Shortley 1935, §6⁸ (F₂ = F²/49, F₄ = F⁴/441).
	await page.goto('/builder?config=3d2');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(page.locator('[data-testid="energy-levels"] tbody tr')).toHaveCount(9);
	await page.getByTestId('param-zeta(3d)').fill('0');
	await page.getByTestId('racah-B-3d').fill('1000');
	await page.getByTestId('racah-B-3d').press('Tab');
	await page.getByTestId('racah-C-3d').fill('4000');
	await page.getByTestId('racah-C-3d').press('Tab');
	await expect(page.getByTestId('param-F2(3d,3d)')).toHaveValue('77000');
	await expect(page.getByTestId('param-F4(3d,3d)')).toHaveValue('50400');
	await expect(page.getByTestId('cs-F2(3d,3d)')).toContainText('1571.43');
	await expect(page.getByTestId('cs-F4(3d,3d)')).toContainText('114.29');
	const p0 = page.locator('[data-testid="energy-levels"] tbody tr[data-label="3P"][data-j="0"] td').nth(1);
	await expect(async () => expect(Math.abs(Number(await p0.innerText()) - 15_000)).toBeLessThan(0.05)).toPass();
});

test('Energy solver API: 400s name the impossible integral and the size limit', async ({ request }) => {
	let res = await request.post('/api/v1/energies', { data: { config: '3d2', parameters: { F: [{ k: 3, a: '3d', b: '3d', value: 1 }] } } });
	expect(res.status()).toBe(400);
	expect((await res.json()).error.message).toMatch(/F\^3\(3d,3d\) cannot occur/);
	// 4f⁷ 5d 6s: 3432 × 10 × 2 = 68 640 determinants, over the 40 000 a request may take.
	res = await request.post('/api/v1/energies', { data: { config: '4f7 5d 6s' } });
	expect(res.status()).toBe(400);
	expect((await res.json()).error.message).toMatch(/at most \d+/);
	res = await request.post('/api/v1/fit', { data: { config: '3d2', vary: ['Eav', 'F2(3d,3d)'], observed: [{ J: '2', energy: 0 }] } });
	expect(res.status()).toBe(400);
	expect((await res.json()).error.message).toMatch(/needs at least as many observed levels as free parameters/);
	res = await request.post('/api/v1/energies/sweep', {
		data: { config: '2p2', parameters: { zeta: [{ shell: '2p', value: 100 }] }, points: 5 }
	});
	expect(res.status()).toBe(200);
	expect((await res.json()).t).toEqual([0, 0.25, 0.5, 0.75, 1]);
});

test('Energy solver: LS → jj curves and a fit to three invented ³F levels', async ({ page }) => {
	await page.goto('/builder?config=3d2');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(page.locator('[data-testid="energy-levels"] tbody tr')).toHaveCount(9);
	await page.getByLabel('show LS → jj curves').check();
	// one curve per level (9 for d²)
	await expect(page.locator('[data-testid="energy-sweep"] polyline')).toHaveCount(9);

	// Invented observed ³F levels; varying E_av and ζ only (2 free parameters, 3 levels, 1 degree of freedom).
	await page.getByTestId('fit-observed').fill('2 1000 1 3F\n3 1190 1 3F\n4 1440 1 3F');
	for (const id of ['F2(3d,3d)', 'F4(3d,3d)']) await page.getByRole('checkbox', { name: id }).uncheck();
	await page.getByTestId('fit-run').click();
	const report = page.getByTestId('fit-report');
	await expect(report).toContainText('1 degrees of freedom');
	await expect(report.locator('tbody tr')).toHaveCount(4 + 3);

	// Too few levels for the free parameters: the server says so.
	await page.getByTestId('fit-observed').fill('2 1000');
	await page.getByTestId('fit-run').click();
	await expect(page.getByTestId('fit-error')).toContainText('needs at least as many observed levels as free parameters');
	await shot(page, 'energy-solver-fit');
});

test('Energy solver: a literature set starts only the configuration it was derived for (3d³ does not start from V³⁺ 3d²)', async ({
	page
}) => {
	// Common practice, no source: parameters fitted to one ion are not a default for another.
	await page.goto('/builder?config=3d3');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(page.locator('[data-testid="energy-levels"] tbody tr').first()).toBeVisible();
	await expect(page.getByTestId('energy-preset')).toHaveValue('typical');
	await page.goto('/builder?config=[Ar] 3d8');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(page.getByTestId('energy-preset')).toHaveValue('ni2-3d8');
});

test('Energy solver: 4f7 5d, the largest configuration the API takes, in a compute worker: 3 106 levels, a paged table, a J filter', async ({
	page
}) => {
	// 4f⁷ 5d: C(14,7) × 10 = 34 320 determinants, one state per level in the M_J = 0 block: 3 106 levels (binomial counts;
	// the level count equals the LS count of terms.ts, checked in levels-ic.test.ts). Several seconds of work, hence the time.
	test.setTimeout(150_000);
	await page.goto('/builder?config=' + encodeURIComponent('4f7 5d'));
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(page.getByTestId('energy-progress')).toBeVisible();
	const rows = page.locator('[data-testid="energy-levels"] tbody tr');
	await expect(rows).toHaveCount(200, { timeout: 120_000 });
	await expect(page.getByTestId('energy-level-count')).toHaveText('200 of 3106 levels shown');
	// Hund's rules for 4f⁷ 5d: ⁹D°, and the lowest J = |L − S| = 2 for the less than half-filled 5d (heuristic).
	await expect(rows.first()).toHaveAttribute('data-label', '9D°');
	await expect(rows.first()).toHaveAttribute('data-j', '2');
	await page.getByTestId('energy-level-more').click();
	await expect(rows).toHaveCount(400);
	await page.getByTestId('energy-level-filter').getByRole('combobox').selectOption('0');
	await expect(page.getByTestId('energy-level-count')).toContainText('(3106 in all)');
	for (const j of await rows.evaluateAll((trs) => trs.map((tr) => tr.getAttribute('data-j')))) expect(j).toBe('0');
	await expect(page.getByTestId('energy-picture')).toContainText('The table lists every level');
	await shot(page, 'energy-solver-4f7-5d');
});
