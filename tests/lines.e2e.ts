/**
 * Transition finder, air/vacuum and Line matcher routes, as scripts use them (no sign-in). Check values name their sources.
 */
import { expect, newUser, test } from './helpers';

test.describe('GET /api/v1/transitions', () => {
	test('3s → 3p: ²S–²P° with strengths 4 : 2, i.e. 2 : 1 (Condon & Shortley 1935 ch. IX)', async ({ request }) => {
		const res = await request.get('/api/v1/transitions?lower=3s&upper=3p&types=E1');
		expect(res.status()).toBe(200);
		const body = await res.json();
		expect(body.jump).toEqual({ from: '3s', to: '3p', deltaL: 1 });
		expect(body.multiplets).toHaveLength(1);
		expect(body.multiplets[0].label).toBe('²S–²P°');
		expect(body.multiplets[0].lines.map((l: { JUpper: string; strength: { exact: string } }) => [l.JUpper, l.strength.exact])).toEqual([
			['3/2', '4'],
			['1/2', '2']
		]);
		expect(body.energies).toBe('unknown');
		expect(body.caution).toMatch(/approximations/);
	});

	test('2p 3s → 2p 3p gives ³P°–³D with 84 : 45 : 20 : 15 : 15 : 1 (multiplet tables, from memory)', async ({ request }) => {
		const body = await (
			await request.get('/api/v1/transitions?' + new URLSearchParams({ lower: '2p 3s', upper: '2p 3p', types: 'E1' }))
		).json();
		const m = body.multiplets.find((x: { label: string }) => x.label === '³P°–³D');
		expect(m.lsAllowed).toBe(true);
		const scaled = m.lines
			.map((l: { strength: { value: number } }) => Math.round(l.strength.value * 4))
			.sort((a: number, b: number) => b - a);
		expect(scaled).toEqual([84, 45, 20, 15, 15, 1]);
		const ic = body.multiplets.find((x: { label: string }) => x.label === '³P°–¹D');
		expect(ic).toMatchObject({ intercombination: true, lsAllowed: false });
	});

	test('bad input is a 400 that says what is allowed', async ({ request }) => {
		const bad = await request.get('/api/v1/transitions?lower=3s&upper=3p&types=E3');
		expect(bad.status()).toBe(400);
		expect((await bad.json()).error.message).toMatch(/E1, M1, E2/);
		const noUpper = await request.get('/api/v1/transitions?lower=3s');
		expect((await noUpper.json()).error.message).toMatch(/"upper" is required/);
		const notation = await request.get('/api/v1/transitions?lower=3s&upper=3p7');
		expect(notation.status()).toBe(400);
		expect((await notation.json()).error.token).toBe('3p7');
	});
});

test.describe('GET /api/v1/airvac', () => {
	test('Hα: 6564.61 Å vacuum ↔ 6562.80 Å air (from memory); the index is the Morton 2000 value at 6564.61 Å', async ({ request }) => {
		const toAir = await (await request.get('/api/v1/airvac?vacuum=6564.61')).json();
		expect(toAir.air).toBeCloseTo(6562.797, 3); // hand computation with bc from the Morton formula: 6562.79702
		expect(toAir.refractiveIndex - 1).toBeCloseTo(2.7625e-4, 8);
		const toVac = await (await request.get('/api/v1/airvac?air=6562.80')).json();
		expect(toVac.vacuum).toBeCloseTo(6564.613, 2);
	});
	test('below 2000 Å there is no air wavelength, and exactly one parameter is needed', async ({ request }) => {
		const low = await request.get('/api/v1/airvac?vacuum=1215.67');
		expect(low.status()).toBe(400);
		expect((await low.json()).error.message).toMatch(/vacuum by convention/);
		const both = await request.get('/api/v1/airvac?vacuum=5000&air=5000');
		expect((await both.json()).error.message).toMatch(/exactly one/);
		const text = await request.get('/api/v1/airvac?air=red');
		expect((await text.json()).error.message).toMatch(/positive number of ångström/);
	});
});

test.describe('POST /api/v1/match', () => {
	// Invented levels (cm⁻¹): an even ³P ground term and an odd ³D° term.
	const levels = [
		{ energy: 0, J: 0, parity: 'even', term: '3P', label: 'a 3P0', uncertainty: 0.02 },
		{ energy: 140.25, J: 1, parity: 'even', term: '3P', label: 'a 3P1', uncertainty: 0.02 },
		{ energy: 401.6, J: 2, parity: 'even', term: '3P', label: 'a 3P2', uncertainty: 0.02 },
		{ energy: 30120.7, J: 1, parity: 'odd', term: '3D°', label: 'z 3D1', uncertainty: 0.02 },
		{ energy: 30233.15, J: 2, parity: 'odd', term: '3D°', label: 'z 3D2', uncertainty: 0.02 },
		{ energy: 30410.9, J: 3, parity: 'odd', term: '3D°', label: 'z 3D3', uncertainty: 0.02 }
	];

	test('finds the pair behind each line and ranks by |residual|; reports the unexplained line', async ({ request }) => {
		// ³P₂–³D°₃: σ = 30410.9 − 401.6 = 30009.3 cm⁻¹, sent as a wavenumber; ³P₀–³D°₁: σ = 30120.7 cm⁻¹ as a vacuum wavelength.
		const lines = [
			{ wavelength: 30009.31, unit: 'cm-1', medium: 'vacuum', uncertainty: 0.01 },
			{ wavelength: 1e8 / 30120.69, unit: 'A', medium: 'vacuum', uncertainty: 0.0002 },
			{ wavelength: 4000, unit: 'A', medium: 'air', uncertainty: 0.001 }
		];
		const res = await request.post('/api/v1/match', { data: { levels, lines, types: ['E1'] } });
		expect(res.status()).toBe(200);
		const body = await res.json();
		expect(body.matches[0].candidates[0]).toMatchObject({ lower: 2, upper: 5, type: 'E1' });
		expect(body.matches[0].candidates[0].residual).toBeCloseTo(0.01, 6);
		expect(body.matches[0].candidates[0].strength.exact).toBe('21'); // 84/4, strongest line of ³P–³D°
		expect(body.matches[1].candidates[0]).toMatchObject({ lower: 0, upper: 3 });
		expect(body.unexplained).toEqual([2]);
		expect(body.caution).toMatch(/review/);
		// With a fixed 0.001 cm⁻¹ tolerance the first line (residual 0.01) is no longer explained.
		const tight = await (await request.post('/api/v1/match', { data: { levels, lines, tolerance: 0.001 } })).json();
		expect(tight.unexplained).toContain(0);
	});

	test('names the field at fault', async ({ request }) => {
		const res = await request.post('/api/v1/match', { data: { levels, lines: [{ wavelength: 5000, unit: 'parsec', medium: 'air' }] } });
		expect(res.status()).toBe(400);
		const body = await res.json();
		expect(body.error.field).toBe('lines[0].unit');
		expect(body.error.message).toMatch(/"A", "nm", "um", "cm-1"/);
		const notJson = await request.post('/api/v1/match', { data: 'levels=1', headers: { 'content-type': 'application/json' } });
		expect(notJson.status()).toBe(400);
	});
});

test.describe('Transition finder screen', () => {
	test('2p² → 2p 3s: multiplets grouped with strengths, intercombination flagged, export and address kept', async ({ page }) => {
		await page.goto('/transitions?lower=2p2&upper=2p%203s&types=E1');
		const table = page.getByTestId('transition-table');
		await expect(table).toBeVisible();
		// ³P–³P°: six lines (9 J pairs less 0–0, 0–2, 2–0: the J rules of Condon & Shortley 1935).
		const rows = table.locator('tr[data-multiplet="³P–³P°"]');
		await expect(rows).toHaveCount(6);
		await expect(table.locator('tr[data-multiplet="³P–¹P°"]').first()).toContainText('intercombination');
		await expect(page.getByTestId('finder-summary')).toContainText('jump 2p → 3s');
		await page.screenshot({ path: 'tests/screenshots/transition-finder.png', fullPage: true });

		const download = page.waitForEvent('download');
		await page.getByRole('button', { name: 'CSV' }).click();
		const file = await download;
		expect(file.suggestedFilename()).toBe('transitions-2p2-2p_3s.csv');

		await page.getByLabel('Upper configuration').fill('2p3');
		await expect(page.getByTestId('finder-error')).toHaveText('');
		await page.getByLabel('Upper configuration').fill('2p 3s7');
		await expect(page.getByTestId('finder-error')).toContainText('3s7');
		await expect(page.getByLabel('Upper configuration')).toHaveAttribute('aria-invalid', 'true');
		await expect(page).toHaveURL(/upper=2p\+3s7/);
	});

	test('a signed-in person is offered the configurations on their Shelves; a visitor is told to sign in', async ({ browser, page }) => {
		// Product rule, no source: only the Shelves of one's own projects are offered (shelf-picks.ts).
		await page.goto('/transitions');
		await expect(page.getByTestId('shelf-hint')).toContainText('Sign in to pick configurations');
		const { page: member } = await newUser(browser, 'Fina Finder', 'finder');
		await member.getByLabel('Name').fill('Finder project');
		await member.getByRole('button', { name: 'Create project' }).click();
		await member.getByRole('link', { name: 'Add configuration' }).click();
		await member.getByLabel('Title').fill('O III excited');
		await member.getByLabel('Configuration').fill('2p 3p');
		await member.getByRole('button', { name: 'Save to Shelf' }).click();
		await expect(member.getByTestId('entry-title')).toHaveText('O III excited');
		await member.goto('/transitions');
		await expect(member.getByTestId('shelf-hint')).toContainText('the 1 configuration on your projects');
		await expect(member.getByTestId('shelf-configs').locator('option')).toHaveAttribute('value', '2p 3p');
		await expect(member.getByLabel('Upper configuration')).toHaveAttribute('list', 'shelf-configs');
	});

	test('is linked from the top bar', async ({ page }) => {
		await page.goto('/basis');
		await page.getByRole('link', { name: 'Transition finder' }).click();
		await expect(page).toHaveURL(/\/transitions/);
	});
});

test.describe('Line matcher screen (stateless)', () => {
	test('matches the invented demo lists: one unexplained line, one strong line not observed, sticks drawn', async ({ page }) => {
		await page.goto('/matcher');
		await expect(page.getByTestId('levels-status')).toHaveText('12 levels read');
		await expect(page.getByTestId('lines-status')).toHaveText('21 lines read');
		await page.getByRole('button', { name: 'Match' }).click();
		// The demo line list was made from the levels with one extra line (5012.345 Å air) and the strongest
		// ³P₂–³D°₃ line left out (src/lib/lines/demo.ts).
		await expect(page.getByTestId('matcher-summary')).toContainText('20 of 21 lines explained, 1 unexplained');
		await expect(page.getByTestId('match-table').locator('tr[data-unexplained="true"]')).toHaveCount(1);
		await expect(page.getByTestId('unobserved-table')).toContainText('2p2 3P2 – 2p3d 3D3');
		await expect(page.getByTestId('stick-spectrum').locator('line')).not.toHaveCount(0);
		// The Grotrian diagram: the demo levels' terms as columns (2p² ³P ¹D ¹S, 2p3s ³P° ¹P°, 2p3d ³D°),
		// one line drawn per explained line (20) between its two level bars.
		const grotrian = page.getByTestId('grotrian-svg');
		await expect(grotrian).toHaveAttribute(
			'aria-label',
			'Grotrian diagram: 12 levels in 6 term columns, 20 lines drawn (best candidate of each explained line)'
		);
		const download = page.waitForEvent('download');
		await page.getByRole('region', { name: 'Grotrian diagram' }).getByRole('button', { name: 'Export PNG' }).click();
		expect((await download).suggestedFilename()).toMatch(/^grotrian.*\.png$/);
		await page.screenshot({ path: 'tests/screenshots/line-matcher.png', fullPage: true });

		await page.getByLabel(/^Lines/).fill('wavelength,unit\n5000,parsec');
		await expect(page.getByTestId('lines-status')).toContainText('row 1, unit');
		await expect(page.getByRole('button', { name: 'Match' })).toBeDisabled();
	});
});
