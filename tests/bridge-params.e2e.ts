import { type Locator, type Page } from '@playwright/test';
import { expect, shot, test } from './helpers';

/**
 * The Builder keeps the Energy solver's parameters between its tabs, and the Coupling bridge's computed curves
 * use them. 2p² starts from the C I set (F²(2p,2p) = 42 500 cm⁻¹, literature-presets.json). At the LS end (ζ = 0)
 * the levels are multiples of F₂ = F²/25 from E_av (Condon & Shortley 1935, ch. VII), so a smaller F² moves the
 * LS-end energies and leaves the jj end (F = 0, ζ only) where it was.
 */
const COMPUTED = "Computed curves (from the Energy solver's parameters)";

async function openComputed(page: Page): Promise<Locator> {
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await panel.getByRole('radio', { name: COMPUTED }).check();
	await expect(panel.getByTestId('bridge-sweep-curve')).toHaveCount(5);
	return panel;
}

/** The end table's column `n` (3: LS end energy, 5: jj end energy), as text. */
const column = (panel: Locator, n: number) =>
	panel.getByTestId('bridge-sweep-table').locator(`tbody tr td:nth-child(${n})`).allTextContents();

test('an F² typed in the Energy solver stays across tabs and drives the computed curves; a new configuration starts from its preset', async ({
	page
}) => {
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=2p2');

	// Before any edit: the starting set, named so.
	let panel = await openComputed(page);
	const params = panel.getByTestId('bridge-sweep-parameters');
	await expect(params).toContainText('C I 2p²');
	await expect(params).toContainText('F²(2p,2p) = 42 500');
	await expect(panel.getByTestId('bridge-sweep-origin')).toHaveText('the starting set');
	const lsBefore = await column(panel, 3);
	const jjBefore = await column(panel, 5);

	// Edit F² in the Energy solver.
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	const solver = page.getByRole('tabpanel', { name: 'Energy solver' });
	await expect(solver.getByTestId('energy-preset')).toHaveValue('c1-2p2');
	await solver.getByTestId('param-F2(2p,2p)').fill('30000');
	await expect(solver.locator('[data-testid="energy-levels"] tbody tr')).toHaveCount(5);

	// Term sheet and back: the typed value is still there.
	await page.getByRole('tab', { name: 'Term sheet' }).click();
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(solver.getByTestId('param-F2(2p,2p)')).toHaveValue('30000');

	// The computed curves use it and say so; the model-energy caution stays.
	panel = await openComputed(page);
	await expect(params).toContainText('F²(2p,2p) = 30 000');
	await expect(panel.getByTestId('bridge-sweep-origin')).toHaveText('as edited in the Energy solver');
	await expect(panel.getByTestId('bridge-sweep-caution')).toContainText('not measurements');
	await expect(panel.getByTestId('bridge-sweep-svg')).toContainText('as edited in the Energy solver');
	await expect.poll(() => column(panel, 3)).not.toEqual(lsBefore);
	// p² at ζ = 0 relative to E_av: ³P = −3F₂, ¹D = +3F₂, ¹S = +12F₂ (Condon & Shortley 1935, ch. VII), F₂ = 30 000/25 = 1 200.
	const ls = (await column(panel, 3)).map((t) => Number(t.replace(/\s/g, '').replace('−', '-')));
	expect(ls).toEqual([-3600, 14400, -3600, -3600, 3600]);
	// The jj end has F = G = 0: it depends on ζ only, which was not changed.
	expect(await column(panel, 5)).toEqual(jjBefore);
	await shot(page, 'bridge-params-edited');

	// "Open these in the Energy solver" opens the same values.
	await panel.getByTestId('bridge-open-solver').click();
	await expect(solver.getByTestId('param-F2(2p,2p)')).toHaveValue('30000');

	// Another configuration starts from its own preset; 2p² keeps its edit.
	await page.getByLabel('Notation').fill('3d2');
	await expect(solver.getByTestId('energy-preset')).toHaveValue('v3-3d2');
	await expect(solver.getByTestId('param-F2(3d,3d)')).not.toHaveValue('30000');
	await page.getByLabel('Notation').fill('2p2');
	await expect(solver.getByTestId('param-F2(2p,2p)')).toHaveValue('30000');

	// A reload of the page keeps the edit (the tab's session storage); the computed curves still use it.
	await page.reload();
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	await expect(solver.getByTestId('param-F2(2p,2p)')).toHaveValue('30000');
	panel = await openComputed(page);
	await expect(params).toContainText('F²(2p,2p) = 30 000');
});

test('a computed curve highlights under the pointer or keyboard focus, shows its level, and Enter keeps it', async ({ page }) => {
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=2p2');
	const panel = await openComputed(page);
	const curves = panel.getByTestId('bridge-sweep-curve');
	const readout = panel.getByTestId('bridge-sweep-highlight');
	// The first curve of the engine's list is the lowest J = 0 level, ³P₀ (p²: Condon & Shortley 1935, ch. VII).
	await curves.first().focus();
	await expect(curves.first()).toHaveAttribute('data-active', 'true');
	await expect(panel.getByTestId('bridge-sweep-active-label')).toContainText('J = 0: ³P₀');
	await expect(readout).toContainText('Highlighted: J = 0: ³P₀');
	// Tab moves on to the next curve; the others are dimmed, only one is highlighted.
	await page.keyboard.press('Tab');
	await expect(curves.nth(1)).toHaveAttribute('data-active', 'true');
	await expect(panel.locator('[data-testid="bridge-sweep-curve"][data-active="true"]')).toHaveCount(1);
	await expect(readout).toContainText('J = 0: ¹S₀');
	await page.keyboard.press('Enter');
	await expect(curves.nth(1)).toHaveAttribute('aria-pressed', 'true');
	await shot(page, 'bridge-params-highlight');
	// Focus leaves; the kept curve stays highlighted until released.
	await panel.getByRole('radio', { name: COMPUTED }).focus();
	await expect(readout).toContainText('J = 0: ¹S₀');
	await expect(readout).toContainText('kept');
	await curves.nth(1).focus();
	await page.keyboard.press('Enter');
	await panel.getByRole('radio', { name: COMPUTED }).focus();
	await expect(readout).toHaveText('');
	// The text alternative stays: one row per curve.
	await expect(panel.getByTestId('bridge-sweep-table').locator('tbody tr')).toHaveCount(5);
});

test('[Xe] 4f2 5d: the computed bridge keeps the core as typed in its title and says the Energy solver’s scaling', async ({ page }) => {
	// 4f² 5d: C(14,2) × 10 = 910 determinants; [Xe] is closed, so it adds no parameters (a fact of the Slater–Condon rules);
	// parity (−1)^Σl = (−1)^(3+3+2), even (a general fact of the field).
	await page.setViewportSize({ width: 1280, height: 900 });
	await page.goto('/builder?config=' + encodeURIComponent('[Xe] 4f2 5d'));
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	const solver = page.getByRole('tabpanel', { name: 'Energy solver' });
	await solver.getByTestId('energy-scale').fill('85');
	await page.getByRole('tab', { name: 'Coupling bridge' }).click();
	const panel = page.getByRole('tabpanel', { name: 'Coupling bridge' });
	await panel.getByRole('radio', { name: COMPUTED }).check();
	await expect(panel.getByTestId('bridge-sweep-svg')).toHaveAttribute(
		'aria-label',
		/^\[Xe\] 4f² 5d — Coupling bridge, computed curves, even parity/
	);
	await expect(panel.getByTestId('bridge-sweep-parameters')).toContainText('E_av = 0 (Fᵏ, Gᵏ scaled to 85 %).');
	await expect(panel.getByTestId('bridge-sweep-origin')).toHaveText('as edited in the Energy solver');
});
