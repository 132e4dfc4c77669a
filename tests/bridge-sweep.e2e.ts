import { expect, shot, test } from './helpers';

/**
 * The Coupling bridge's computed curves: the engine's LS → jj sweep drawn for the Energy solver's starting
 * parameters. p² has 5 levels, ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII), two of them with J = 2;
 * d² has 9 (³F₂,₃,₄ ³P₀,₁,₂ ¹D₂ ¹G₄ ¹S₀, same source).
 */
test('2p2 on the Coupling bridge: computed curves, 5 levels, J = 2 shows 2, with the model-energy caution', async ({ page }) => {
	for (const width of [1280, 768]) {
		await page.setViewportSize({ width, height: 900 });
		await page.goto('/builder?config=2p2');
		await page.getByRole('tab', { name: 'Coupling bridge' }).click();
		const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(5);
		await panel.getByRole('radio', { name: "Computed curves (from the Energy solver's parameters)" }).check();
		const curves = panel.getByTestId('bridge-sweep-curve');
		await expect(curves).toHaveCount(5);
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(0);
		// One continuous polyline per level, 61 points (the sweep's default).
		const points = await curves.evaluateAll((els) => els.map((e) => (e.getAttribute('points') ?? '').trim().split(/\s+/).length));
		expect(points).toEqual([61, 61, 61, 61, 61]);
		const caution = panel.getByTestId('bridge-sweep-caution');
		await expect(caution).toContainText('model energies from the parameters below, not measurements');
		await expect(panel.getByTestId('bridge-sweep-parameters')).toContainText('C I 2p²');
		await expect(panel.getByTestId('bridge-sweep-parameters')).toContainText('F²(2p,2p) = 42 500');
		await expect(panel.getByTestId('bridge-sweep-svg')).toContainText('cm⁻¹');
		// LS labels at the left end, jj groups at the right: (1/2)², (1/2 3/2), (3/2)².
		await expect(panel.getByTestId('bridge-sweep-ls-label')).toHaveCount(5);
		await expect(panel.getByTestId('bridge-sweep-jj-label')).toHaveCount(3);
		// The text alternative: one row per curve with its two ends.
		await expect(panel.getByTestId('bridge-sweep-table').locator('tbody tr')).toHaveCount(5);
		await shot(page, `bridge-sweep-${width}`);

		const filter = panel.getByTestId('bridge-filter');
		await filter.getByRole('button', { name: 'J = 2 (2 levels)' }).click();
		await expect(curves).toHaveCount(2);
		expect(await curves.evaluateAll((els) => els.map((e) => e.getAttribute('data-j')))).toEqual(['2', '2']);
		await expect(panel.getByTestId('bridge-showing')).toHaveText('showing 2 of 5 levels');
		// Compact rows give a shorter picture of the same curves.
		const tall = Number(await panel.getByTestId('bridge-sweep-svg').getAttribute('height'));
		await filter.getByLabel('compact rows').check();
		await expect.poll(async () => Number(await panel.getByTestId('bridge-sweep-svg').getAttribute('height'))).toBeLessThan(tall);
		await expect(curves).toHaveCount(2);
		await shot(page, `bridge-sweep-j2-${width}`);
	}
});

test('the computed bridge opens its parameters in the Energy solver, and goes back to the schematic', async ({ page }) => {
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=3d2');
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await panel.getByRole('radio', { name: "Computed curves (from the Energy solver's parameters)" }).check();
	await expect(panel.getByTestId('bridge-sweep-curve')).toHaveCount(9);
	await expect(panel.getByTestId('bridge-sweep-parameters')).toContainText('V³⁺ free ion 3d²');
	await panel.getByRole('radio', { name: 'Schematic' }).check();
	await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(9);
	await expect(panel.getByTestId('bridge-note')).toContainText('Schematic');
	await panel.getByRole('radio', { name: "Computed curves (from the Energy solver's parameters)" }).check();
	await panel.getByTestId('bridge-open-solver').click();
	const solver = page.getByRole('tabpanel', { name: 'Energy solver' });
	await expect(solver.getByTestId('energy-preset')).toHaveValue('v3-3d2');
});

test('2p2 stretched: each t on its own scale opens the jj end, whose three groups lie 3ζ apart in all', async ({ page }) => {
	// jj end of p²: −2ζ, −ζ/2, +ζ (Condon & Shortley 1935, ch. X), so the middle group sits half-way once stretched;
	// on the common axis the three share 3ζ = 81 cm⁻¹ of the 15F2 = 25 500 cm⁻¹ LS spread (the C I starting set).
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=2p2');
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await panel.getByRole('radio', { name: "Computed curves (from the Energy solver's parameters)" }).check();
	await expect(panel.getByTestId('bridge-sweep-curve')).toHaveCount(5);
	const stretch = panel.getByTestId('bridge-sweep-stretch');
	await expect(stretch).toHaveAttribute('aria-pressed', 'false');
	await expect(panel.getByText('One energy axis: the LS end spans')).toContainText('the jj end 81.0 cm⁻¹');
	const jjEnds = async () =>
		panel
			.getByTestId('bridge-sweep-curve')
			.evaluateAll((els) => els.map((e) => Number((e.getAttribute('points') ?? '').trim().split(/\s+/).at(-1)!.split(',')[1])));
	const spanOf = (ys: number[]) => Math.max(...ys) - Math.min(...ys);
	expect(spanOf(await jjEnds())).toBeLessThan(5);
	await stretch.click();
	await expect(stretch).toHaveAttribute('aria-pressed', 'true');
	const ys = [...new Set((await jjEnds()).map((y) => y.toFixed(1)))].map(Number).sort((a, b) => a - b);
	expect(ys).toHaveLength(3);
	expect(ys[1] - ys[0]).toBeCloseTo(ys[2] - ys[1], 0);
	expect(ys[2] - ys[0]).toBeGreaterThan(300);
	await expect(panel.getByTestId('bridge-sweep-spread')).toHaveText(['spread 25 500 cm⁻¹', 'spread 81.0 cm⁻¹']);
	await shot(page, 'bridge-sweep-stretched');
	await stretch.click();
	await expect(panel.getByTestId('bridge-sweep-spread')).toHaveCount(0);
});

test('a configuration too large for a sweep: the computed curves say so and offer the schematic', async ({ page }) => {
	// 4f5 5d: C(14,5) × 10 = 20 020 determinants, over the 12 000 a sweep may take (the API's own message).
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=' + encodeURIComponent('4f5 5d'));
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	// The bridge's own limit and message stay: too many levels to draw until a J is chosen (the bridge takes seconds here).
	test.setTimeout(120_000);
	await expect(panel.getByTestId('bridge-too-many')).toBeVisible({ timeout: 60_000 });
	// Its table of links comes a page (200, the picture's limit) at a time, not all of its levels at once.
	const linkRows = panel.getByTestId('bridge-table').locator('tbody tr');
	await expect(linkRows).toHaveCount(200);
	await expect(panel.getByTestId('bridge-table-shown')).toHaveText(/^200 of \d{4} links shown$/);
	await panel.getByTestId('bridge-table-more').click();
	await expect(linkRows).toHaveCount(400);
	await panel
		.getByTestId('bridge-filter')
		.getByRole('button', { name: /^J = 0 / })
		.click();
	await panel.getByRole('radio', { name: "Computed curves (from the Energy solver's parameters)" }).check();
	const refusal = panel.getByTestId('bridge-sweep-error');
	await expect(refusal).toContainText('not available for this configuration');
	await expect(refusal).toContainText(/at most 12000/);
	await expect(panel.getByTestId('bridge-sweep-curve')).toHaveCount(0);
	await refusal.getByRole('button', { name: 'Show the schematic bridge' }).click();
	await expect(panel.getByRole('radio', { name: 'Schematic' })).toBeChecked();
	await expect(panel.getByTestId('bridge-ls-level').first()).toBeVisible();
});
