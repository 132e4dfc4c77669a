import { type Locator, type Page } from '@playwright/test';
import { readFileSync } from 'node:fs';
import Papa from 'papaparse';
import { expect, shot, test, waitForHydration } from './helpers';

/*
 * Reference values for 3d5 4s:
 * - microstates: C(10,5) · C(2,1) = 252 · 2 = 504 (combinatorics: 5 electrons in the 10
 *   spin-orbitals of 3d, 1 in the 2 of 4s).
 * - Hund's-rule level: 7S3 (3d5 half full gives 6S, the 4s spin parallel gives S = 3, L = 0, J = 3);
 *   it is the ground level of neutral Cr in the NIST/CRC periodic table of ground levels.
 */

const tray = (page: Page, key: string) => page.locator(`[aria-label="Subshells in the Tray"] [data-chip="${key}"]`);
const railZone = (page: Page) => page.getByLabel('Rail: the configuration', { exact: true });
const railChip = (page: Page, key: string) => page.locator(`[data-rail-key="${key}"]`);

/** A real pointer drag (svelte-dnd-action starts after a few pixels of movement). */
async function drag(page: Page, from: Locator, to: Locator) {
	const a = (await from.boundingBox())!;
	const b = (await to.boundingBox())!;
	await page.mouse.move(a.x + a.width / 2, a.y + a.height / 2);
	await page.mouse.down();
	await page.mouse.move(a.x + a.width / 2 + 6, a.y + a.height / 2 + 6, { steps: 3 });
	await page.mouse.move(b.x + b.width - 30, b.y + b.height / 2, { steps: 15 });
	await page.waitForTimeout(150);
	await page.mouse.up();
}

/** The Term sheet shows 7S3 as the lowest level by Hund's rules (two open subshells: heuristic) and 504 microstates. */
async function expectCr(page: Page) {
	await expect(page.getByTestId('summary-microstates')).toHaveText('504');
	const ground = page.locator('[data-testid="term-sheet"] tr[data-ground="true"]');
	await expect(ground).toHaveCount(1);
	await expect(ground).toHaveAttribute('data-level', '7S#1|3');
	await expect(ground).toContainText('lowest (Hund, heuristic)');
	// Hund order by default: the lowest level leads the sheet.
	await expect(page.locator('[data-testid="term-sheet"] tbody tr').first()).toHaveAttribute('data-ground', 'true');
	// Two open subshells: Hund's rules are a heuristic, said in amber.
	await expect(page.getByTestId('hund-caution')).toBeVisible();
	await expect(page.getByTestId('totals')).toContainText('504 microstates');
	await expect(page.getByTestId('totals')).toContainText('✓');
}

test('dragging 3d and 4s onto the Rail and stepping 3d to 5 gives 504 microstates and the 7S3 ground level', async ({ page }) => {
	await page.goto('/builder');
	await drag(page, tray(page, '3d'), railZone(page));
	await expect(railChip(page, '3d')).toBeVisible();
	// The Tray keeps its chip (copy on drag), shown as not available now.
	await expect(tray(page, '3d')).toHaveAttribute('data-blocked', 'true');
	for (let i = 0; i < 4; i++) await page.getByRole('button', { name: 'One electron more in 3d' }).click();
	await drag(page, tray(page, '4s'), railZone(page));
	await expect(railChip(page, '4s')).toBeVisible();
	await expect(page.getByLabel('Notation')).toHaveValue('3d5 4s');
	await expectCr(page);
	await expect(page).toHaveURL(/\/builder\?config=3d5(\+|%20)4s/);
	await shot(page, 'builder-drag');
});

test('keyboard only: Enter adds a Tray chip, ArrowUp steps the occupancy, Space carries a chip to the Rail', async ({ page }) => {
	await page.goto('/builder');
	await tray(page, '3d').focus();
	await page.keyboard.press('Enter');
	await expect(railChip(page, '3d')).toBeVisible();
	await railChip(page, '3d').focus();
	for (let i = 0; i < 4; i++) await page.keyboard.press('ArrowUp');
	await expect(page.getByLabel('Notation')).toHaveValue('3d5');
	// The Pauli limit bounds the stepper: 3d holds at most 10.
	for (let i = 0; i < 8; i++) await page.keyboard.press('ArrowUp');
	await expect(page.getByLabel('Notation')).toHaveValue('3d10');
	for (let i = 0; i < 5; i++) await page.keyboard.press('ArrowDown');
	await expect(page.getByLabel('Notation')).toHaveValue('3d5');

	// Keyboard drag (svelte-dnd-action): Space picks 4s up, Tab moves it to the Rail, Space drops it.
	await tray(page, '4s').focus();
	await page.keyboard.press('Space');
	await page.keyboard.press('Tab');
	await page.keyboard.press('Space');
	await expect(railChip(page, '4s')).toBeVisible();
	await expectCr(page);

	// Delete removes the focused chip; Enter on the Tray chip puts it back.
	await railChip(page, '4s').focus();
	await page.keyboard.press('Delete');
	await expect(railChip(page, '4s')).toHaveCount(0);
	await expect(page.getByLabel('Notation')).toHaveValue('3d5');
	await tray(page, '4s').focus();
	await page.keyboard.press('Enter');
	await expectCr(page);
	await shot(page, 'builder-keyboard');
});

test('a bad notation keeps the text and shows the engine message beside the field', async ({ page }) => {
	await page.goto('/builder');
	await page.getByLabel('Notation').fill('3d11');
	// Message text from src/lib/physics/parse.ts (checkSubshell): the Pauli limit 2(2l+1) = 10 for d.
	await expect(page.getByTestId('notation-error')).toContainText('a d subshell holds at most 10 electrons');
	await expect(page.getByTestId('notation-error').locator('mark')).toHaveText('3d11');
	await expect(page.getByLabel('Notation')).toHaveValue('3d11');
	await expect(page.getByLabel('Notation')).toHaveAttribute('aria-invalid', 'true');
	await shot(page, 'builder-error');
	await page.getByLabel('Notation').fill('3d10');
	await expect(page.getByTestId('notation-error')).toHaveCount(0);
	await expect(railChip(page, '3d')).toBeVisible();
});

test('the species picker fills the ground configuration of Fe II', async ({ page }) => {
	await page.goto('/builder');
	await page.getByLabel('Species').fill('Fe II');
	await page.getByRole('button', { name: 'Ground configuration' }).click();
	// src/lib/physics/elements.ts: Fe II is not in the table of ion exceptions, so one electron is
	// removed from 4s of Fe I [Ar] 3d6 4s2, giving [Ar] 3d6 4s, with the ion caution.
	await expect(page.getByLabel('Notation')).toHaveValue(/3d6 4s$/);
	await expect(page.getByTestId('species-caution')).toBeVisible();
	await expect(railChip(page, '[Ar]')).toBeVisible();
	await expect(railChip(page, '3d')).toBeVisible();
	await expect(page.getByTestId('summary-microstates')).toHaveText('420'); // C(10,6) · C(2,1) = 210 · 2
	await shot(page, 'builder-species');
});

test('the Term sheet exports as CSV and LaTeX', async ({ page }) => {
	await page.goto('/builder?config=3d5%204s');
	await expectCr(page);

	const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'CSV', exact: true }).click()]);
	expect(csv.suggestedFilename()).toBe('terms-3d5_4s.csv');
	const csvText = readFileSync((await csv.path())!, 'utf8');
	const lines = csvText.split(/\r?\n/);
	expect(lines[0]).toBe('term,occurrence,parentage,count,seniority,S,L,parity,J,g,g_decimal,weight');
	// 7S3: S = 3, L = 0, J = 3, g_J = 2 (L = 0 gives g_J = g_s = 2), 2J+1 = 7; parent 3d⁵ ⁶S (Cr I, NIST ASD, from memory).
	expect(lines).toContain('7S,1,3d⁵(⁶S)4s ⁷S,1,,3,0,even,3,2,2,7');

	const [tex] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'LaTeX', exact: true }).click()]);
	expect(tex.suggestedFilename()).toBe('terms-3d5_4s.tex');
	const texText = readFileSync((await tex.path())!, 'utf8');
	expect(texText).toContain('\\toprule');
	expect(texText).toContain('^{7}\\mathrm{S}');
	// The caption is typeset and the table breaks across pages (longtable package).
	expect(texText).toContain('\\caption{LS terms and levels of 3d$^{5}$~4s}');
	expect(texText).toContain('\\begin{longtable}');
	await shot(page, 'builder-sheet');
});

test('the State grid peels the terms off one by one until it is empty', async ({ page }) => {
	await page.goto('/builder?config=2p2');
	await expect(page.getByTestId('summary-microstates')).toHaveText('15'); // C(6,2) = 15
	await page.getByRole('tab', { name: 'State grid' }).click();
	const grid = page.getByTestId('state-grid');
	await expect(grid).toBeVisible();
	// p2 gives 3P, 1D, 1S (Condon & Shortley 1935; any textbook table of equivalent-electron terms).
	await page.getByRole('button', { name: /^3P/ }).click();
	await expect(page.getByTestId('grid-outline')).toBeVisible();
	await shot(page, 'builder-grid');
	for (let i = 0; i < 3; i++) await page.getByTestId('peel-next').click();
	await expect(page.getByTestId('peel-status')).toContainText('3 of 3 terms taken out — the grid is empty');
	await expect(page.getByTestId('peel-next')).toBeDisabled();
});

test('the microstates themselves are listed only on request, a page at a time', async ({ page }) => {
	await page.goto('/builder?config=' + encodeURIComponent('3d2'));
	// d²: C(10,2) = 45 microstates (combinatorics), so a page of 50 holds them all; 2p 3d: 6·10 = 60 needs two.
	await page.getByRole('tab', { name: 'State grid' }).click();
	const list = page.getByTestId('microstate-list');
	await list.getByText('List the microstates themselves').click();
	await expect(list).toContainText('1–45 of 45');
	await expect(list.locator('tbody tr')).toHaveCount(45);
	await page.getByLabel('Notation').fill('2p 3d');
	await expect(list).toContainText('1–50 of 60');
	await list.getByRole('button', { name: 'Next' }).click();
	await expect(list).toContainText('51–60 of 60');
	await shot(page, 'builder-microstates');
});

test('on a touch screen, taps add chips and step the occupancy (tablet width)', async ({ browser }) => {
	const context = await browser.newContext({ hasTouch: true, isMobile: true, viewport: { width: 768, height: 1024 } });
	const page = waitForHydration(await context.newPage());
	await page.goto('/builder');
	await tray(page, '3d').tap();
	await tray(page, '4s').tap();
	await expect(railChip(page, '3d')).toBeVisible();
	const plus = railChip(page, '3d').getByRole('button', { name: /increase|more|\+/i });
	for (let i = 0; i < 4; i++) await plus.tap();
	await expectCr(page);
	await shot(page, 'builder-tablet-touch');
	await context.close();
});

test.describe('labels as the trade writes them', () => {
	test('Fe II 3d6 4s: every term with its parent; typing 3d6(5D) 4s keeps only ⁶D and ⁴D', async ({ page }) => {
		// Fe II a⁶D and a⁴D are 3d⁶(⁵D)4s (NIST ASD, from memory); 24 term occurrences (d⁶ × s).
		await page.goto('/builder?config=' + encodeURIComponent('[Ar] 3d6 4s'));
		const sheet = page.getByTestId('term-sheet');
		await expect(sheet.getByTestId('parent-cell').first()).toHaveText('3d⁶(⁵D)4s');
		await expect(sheet.getByTestId('parent-cell')).toHaveCount(24);
		await expect(page.getByTestId('parent-note')).toContainText('seniority');
		// The parent filter keeps the terms on ³H: ⁴H and ²H.
		await page.getByTestId('parent-filter').selectOption({ label: '3d⁶(³H)' });
		await expect(sheet.getByTestId('parent-cell')).toHaveCount(2);
		await shot(page, 'builder-parents');

		await page.getByLabel('Notation').fill('[Ar] 3d6(5D) 4s');
		await expect(page.getByTestId('typed-parents')).toBeVisible();
		await page.getByRole('button', { name: 'clear' }).click();
		await expect(sheet.getByTestId('parent-cell')).toHaveCount(2);
		await expect(sheet.locator('tbody tr[data-level="6D#1|9/2"]')).toBeVisible();
		await expect(sheet.locator('tbody tr[data-level="4D#1|7/2"]')).toBeVisible();
	});

	test('odd configurations: every level in the Term sheet, its export and the summary carries °', async ({ page }) => {
		// 3d⁵4s4p is odd (Σl = 11); Mn I z⁸P° (NIST ASD, from memory).
		await page.goto('/builder?config=' + encodeURIComponent('3d5 4s 4p'));
		const sheet = page.getByTestId('term-sheet');
		await expect(sheet.locator('tbody tr').first()).toBeVisible();
		const symbols = await sheet.locator('tbody .term-symbol').allTextContents();
		expect(symbols.length).toBeGreaterThan(10);
		for (const s of symbols) expect(s).toContain('°');
		const parents = await sheet.getByTestId('parent-cell').allTextContents();
		expect(parents).toContain('3d⁵(⁶S)4s(⁷S)4p');
		await expect(page.getByTestId('summary-ground')).toContainText('°');
		await expect(page.getByTestId('summary-ground')).toContainText("lowest level by Hund's rules");

		const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'CSV', exact: true }).click()]);
		const parsed = Papa.parse<string[]>(readFileSync((await csv.path())!, 'utf8').trim());
		const rows = parsed.data.slice(1);
		expect(rows.length).toBeGreaterThan(10);
		for (const row of rows) {
			const [term, , parentage] = row;
			expect(term).toMatch(/°$/);
			expect(parentage).toMatch(/°$/);
		}
	});
});
