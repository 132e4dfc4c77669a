import { type Download, type Page } from '@playwright/test';
import { readFile } from 'node:fs/promises';
import { expect, shot, test } from './helpers';

/**
 * The Basis table page and the two pictures of the Builder (Level diagram, Coupling bridge).
 * The pictures are reached through the Builder's tabs; there are no test-only routes.
 */

async function downloadText(page: Page, click: () => Promise<void>): Promise<{ download: Download; text: string }> {
	const [download] = await Promise.all([page.waitForEvent('download'), click()]);
	const path = await download.path();
	return { download, text: await readFile(path!, 'utf8') };
}

async function downloadBytes(page: Page, click: () => Promise<void>): Promise<Buffer> {
	const [download] = await Promise.all([page.waitForEvent('download'), click()]);
	return readFile((await download.path())!);
}

test.describe('Basis table', () => {
	test('j1 = 3/2 ⊗ j2 = 1 has 12 states, and |5/2, 5/2⟩ = 1 · |3/2, 1⟩', async ({ page }) => {
		await page.goto('/basis');
		await page.getByLabel(/^j₁/i).fill('3/2');
		await page.getByLabel(/^j₂/i).fill('1');
		// (2·3/2 + 1)(2·1 + 1) = 12 product states; J runs from 1/2 to 5/2 (triangle rule).
		await expect(page.getByTestId('basis-count')).toContainText('j₁ = 3/2, j₂ = 1: 12 states');
		await expect(page.getByTestId('basis-coupled').locator('tbody tr')).toHaveCount(12);
		await expect(page.getByTestId('basis-uncoupled').locator('tbody tr')).toHaveCount(12);

		// The stretched state is the single product state with both projections maximal, coefficient exactly 1
		// (Condon & Shortley 1935, §3.14; any Clebsch–Gordan table, e.g. PDG "Clebsch-Gordan coefficients", 3/2 × 1 block).
		const top = page.getByTestId('basis-coupled').locator('tr[data-row="5/2 5/2"]');
		await expect(top.locator('[data-term]')).toHaveCount(1);
		await expect(top.locator('[data-term="3/2 1"] [data-exact]')).toHaveAttribute('data-exact', '1');
		await expect(top.locator('[data-term="3/2 1"] [data-testid="exact"]')).toHaveText('1');
		await expect(page).toHaveURL(/j1=3%2F2&j2=1|j1=3\/2&j2=1/);
		await expect(page.getByTestId('basis-note')).toContainText('Condon–Shortley');
		await shot(page, 'basis-table-3-2x1');
	});

	test('j1 = 1 ⊗ j2 = 1/2: ⟨1 0; 1/2 1/2 | 3/2 1/2⟩ = √(2/3) and ⟨1 0; 1/2 1/2 | 1/2 1/2⟩ = −√(1/3)', async ({ page }) => {
		await page.goto('/basis?j1=1&j2=1/2');
		await expect(page.getByTestId('basis-count')).toContainText('6 states');
		// Reference: PDG Review of Particle Physics, "Clebsch-Gordan coefficients, spherical harmonics, and
		// d functions", the 1 × 1/2 block (Condon–Shortley phases): ⟨1 0, 1/2 1/2|3/2 1/2⟩ = √(2/3),
		// ⟨1 0, 1/2 1/2|1/2 1/2⟩ = −√(1/3), ⟨1 1, 1/2 −1/2|1/2 1/2⟩ = √(2/3).
		const coupled = page.getByTestId('basis-coupled');
		const c32 = coupled.locator('tr[data-row="3/2 1/2"] [data-term="0 1/2"]');
		await expect(c32.locator('[data-exact]')).toHaveAttribute('data-exact', 'sqrt(2/3)');
		await expect(c32.getByTestId('exact')).toHaveText('√(2/3)');
		const c12 = coupled.locator('tr[data-row="1/2 1/2"]');
		await expect(c12.locator('[data-term="0 1/2"] [data-exact]')).toHaveAttribute('data-exact', '-sqrt(1/3)');
		await expect(c12.locator('[data-term="1 -1/2"] [data-exact]')).toHaveAttribute('data-exact', 'sqrt(2/3)');
		// The inverse table reads the same matrix by columns: |0, 1/2⟩ = √(2/3)|3/2, 1/2⟩ − √(1/3)|1/2, 1/2⟩.
		const back = page.getByTestId('basis-uncoupled').locator('tr[data-row="0 1/2"]');
		await expect(back.locator('[data-term="3/2 1/2"] [data-exact]')).toHaveAttribute('data-exact', 'sqrt(2/3)');
		await expect(back.locator('[data-term="1/2 1/2"] [data-exact]')).toHaveAttribute('data-exact', '-sqrt(1/3)');

		await page.getByText('Matrix by M').click();
		const block = page.getByTestId('basis-matrix').locator('table[data-block="1/2"]');
		await expect(block.locator('tbody tr')).toHaveCount(2);
		await expect(block).toContainText('√(2/3)');
		await shot(page, 'basis-table-1x1-2-matrix');
	});

	test('j1 = 11 is refused with the API limit message beside j1', async ({ page }) => {
		await page.goto('/basis?j1=2&j2=1/2');
		await expect(page.getByTestId('basis-count')).toContainText('10 states');
		await page.getByLabel(/^j₁/i).fill('11');
		await expect(page.getByTestId('basis-j1-error')).toContainText('from 0 to 10');
		await expect(page.getByLabel(/^j₁/i)).toHaveAttribute('aria-invalid', 'true');
		await expect(page.getByTestId('basis-j2-error')).toHaveText('');
		await page.getByLabel(/^j₂/i).fill('x');
		await page.getByLabel(/^j₁/i).fill('1');
		await expect(page.getByTestId('basis-j2-error')).toContainText('"x"');
		await shot(page, 'basis-table-error');
	});
});

test.describe('Builder pictures', () => {
	test('Level diagram of 2p2: ³P below ¹D below ¹S, ground level ³P₀, exports as SVG and PNG', async ({ page }) => {
		await page.goto('/builder?config=2p2');
		await page.getByRole('tab', { name: 'Level diagram' }).click();
		const panel = page.getByRole('tabpanel', { name: 'Level diagram' });
		const svg = panel.getByTestId('level-diagram-svg');
		await expect(svg).toBeVisible();
		// Terms of p²: ³P, ¹D, ¹S (Condon & Shortley 1935, table 1⁷); Hund's order ³P < ¹D < ¹S, ground ³P₀ (less than half full).
		await expect(svg).toHaveAttribute('aria-label', /³P, ¹D, ¹S\. Ground level by Hund's rules: ³P₀/);
		const items = panel.getByTestId('level-diagram-list').locator('li');
		await expect(items).toHaveCount(3);
		await expect(items.nth(0)).toContainText('³P: J = 0, 1, 2');
		await expect(items.nth(1)).toContainText('¹D: J = 2');
		await expect(items.nth(2)).toContainText('¹S: J = 0');
		await expect(panel.getByTestId('level-diagram-caution')).toContainText('Schematic');
		await expect(panel.getByTestId('level-diagram-caution')).toContainText('heuristic');
		await expect(svg).toContainText("schematic order (Hund's rules, heuristic) — no energies computed");

		const { download, text } = await downloadText(page, () => panel.getByRole('button', { name: 'Export SVG' }).click());
		expect(download.suggestedFilename()).toBe('level-diagram-2p2.svg');
		expect(text.startsWith('<svg')).toBe(true);
		expect(text).toContain('³P: J = 0, 1, 2');
		expect(text).toContain('¹D: J = 2');
		expect(text).toContain('ground level');
		expect(text).not.toContain('var(--'); // colours resolved, so the file stands alone
		const png = await downloadBytes(page, () => panel.getByRole('button', { name: 'Export PNG' }).click());
		expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
		await shot(page, 'level-diagram-2p2');
	});

	test('Ne I 2p5 3p: three columns, the jK levels in a table, the jj side grouped by the core j; ζ can be changed', async ({ page }) => {
		// Ne I 2p⁵3p: ten levels, six on the core ²P°₃/₂ and four on ²P°₁/₂ (Cowan 1981 sec. 4.12, from memory).
		await page.goto('/builder?config=' + encodeURIComponent('[He] 2s2 2p5 3p'));
		await page.getByRole('tab', { name: 'Coupling bridge' }).click();
		const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
		await expect(panel.getByTestId('bridge-jk-level')).toHaveCount(10);
		await expect(panel.getByTestId('bridge-count-badge')).toHaveText(/LS 10 = jK 10 = jj 10 levels/);
		await expect(panel.getByTestId('bridge-svg')).toContainText('jK coupling');
		const table = panel.getByTestId('jk-table');
		await expect(table.locator('tbody tr')).toHaveCount(10);
		await expect(table).toContainText('2p⁵(²P°₃/₂)3p ²[5/2]₃');
		const jj = await panel.getByTestId('bridge-jj-level').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
		// Lowest six jj levels have the 2p3/2 hole (2p1/2² 2p3/2³), the upper four the 2p1/2 hole.
		expect(jj.slice(0, 6).every((l) => l.includes('2p1/2^2 2p3/2^3'))).toBe(true);
		expect(jj.slice(6).every((l) => l.includes('2p1/2 2p3/2^4'))).toBe(true);
		await shot(page, 'bridge-jk-ne');
		// Equal ζ for 2p and 3p: the engine reorders the jj side (the groups by core j mix).
		const zeta3p = panel.getByTestId('zeta-controls').getByRole('spinbutton').nth(1);
		await zeta3p.fill('1');
		await zeta3p.press('Enter');
		await expect
			.poll(async () =>
				(await panel.getByTestId('bridge-jj-level').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''))).join('|')
			)
			.not.toBe(jj.join('|'));
	});

	test('Coupling bridge of 2p2 joins 5 LS levels to 5 jj levels; 2p 3p has 10 on each side', async ({ page }) => {
		await page.goto('/builder?config=2p2');
		await page.getByRole('tab', { name: 'Coupling bridge' }).click();
		const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
		// p²: ³P₀ ³P₁ ³P₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, terms of p²); jj: (1/2)² J=0, (1/2,3/2) J=1,2, (3/2)² J=0,2.
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(5);
		await expect(panel.getByTestId('bridge-jj-level')).toHaveCount(5);
		await expect(panel.getByTestId('bridge-link')).toHaveCount(5);
		const lsLabels = await panel.getByTestId('bridge-ls-level').evaluateAll((els) => els.map((e) => e.getAttribute('aria-label')));
		expect(lsLabels).toEqual(['3P0', '3P1', '3P2', '1D2', '1S0']);
		await expect(panel.getByTestId('bridge-count-badge')).toHaveText(/J counts agree: LS 5 = jj 5 levels/);
		await expect(panel.getByTestId('bridge-note')).toContainText(
			/Schematic: left in Hund's heuristic order, right by first-order\s+spin–orbit energy with one ζ per subshell; levels of equal J joined by the non-crossing rule\./
		);

		// Hover on ¹S₀ highlights its link (J = 0, to the upper J = 0 jj level, (3/2)² (0)₀).
		await panel.getByTestId('bridge-ls-level').nth(4).hover();
		await expect(panel.locator('[data-testid="bridge-link"][data-active="true"]')).toHaveCount(1);
		await expect(panel.locator('[data-testid="bridge-link"][data-active="true"]')).toHaveAttribute(
			'aria-label',
			/^J = 0: 1S0 — 2p3\/2\^2 \(0\)_0$/
		);
		// Keyboard: focusing a row of the link table highlights the same link.
		await page.mouse.move(0, 0);
		await panel.getByRole('button', { name: '3P1 joins 2p1/2 2p3/2 (1/2, 3/2)_1, J = 1' }).focus();
		await expect(panel.locator('[data-testid="bridge-link"][data-active="true"]')).toHaveAttribute('aria-label', /^J = 1: 3P1/);

		const { text } = await downloadText(page, () => panel.getByRole('button', { name: 'Export SVG' }).click());
		expect(text.startsWith('<svg')).toBe(true);
		for (const label of ['3P0', '1D2', '1S0', '(1/2, 3/2)', 'LS coupling', 'jj coupling']) expect(text).toContain(label);
		expect(text).not.toContain('var(--');
		await shot(page, 'coupling-bridge-2p2');

		// Two inequivalent p electrons: ¹S ¹P ¹D ³S ³P ³D → 10 levels; jj: 4 pairs (j₁, j₂) → 10 levels (Cowan 1981, §4-12).
		await page.goto('/builder?config=2p%203p');
		await page.getByRole('tab', { name: 'Coupling bridge' }).click();
		await expect(panel.getByTestId('bridge-ls-level')).toHaveCount(10);
		await expect(panel.getByTestId('bridge-jj-level')).toHaveCount(10);
		await expect(panel.getByTestId('bridge-link')).toHaveCount(10);
		await expect(panel.getByTestId('bridge-count-badge')).toHaveText(/J counts agree: LS 10 = jK 10 = jj 10 levels/);
		await panel.getByTestId('bridge-jj-level').nth(3).hover();
		await shot(page, 'coupling-bridge-2p3p');
	});
});
