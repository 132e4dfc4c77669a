import { expect, test } from '@playwright/test';
import { newUser, shot } from './helpers';

test('annotate a level on the Shelf, reload, export; viewers cannot annotate; stale notes are refused', async ({ browser }) => {
	const owner = await newUser(browser, 'Ola Owner', 'shelf-owner');
	const { page } = owner;
	await page.getByLabel('Name').fill('Peculiar star');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Peculiar star' })).toBeVisible();
	const projectUrl = page.url();
	const projectId = projectUrl.split('/').pop()!;

	await page.getByRole('link', { name: 'Add configuration' }).click();
	await page.getByLabel('Title').fill('Iron II ground configuration');
	await page.getByLabel('Configuration').fill('[Ar] 3d6 4s');
	await page.getByLabel('Species').fill('Fe II');
	await page.getByLabel('Tags (comma separated)').fill('iron group, test');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('Iron II ground configuration');
	const entryUrl = page.url();
	const entryId = entryUrl.split('/').pop()!;

	// ⁶D₉/₂ is the Hund's-rule ground level of 3d⁶4s (Fe II ground level in the NIST/CRC ion tables).
	const row = page.locator('tr[data-level="6D#1|9/2"]');
	await row.getByRole('button', { name: 'Annotate' }).click();
	await page.getByLabel('Observed energy (cm⁻¹)').fill('0');
	await page.getByLabel('± (cm⁻¹)').fill('0.01');
	await page.locator('select[name=status]').selectOption('confirmed');
	await page.getByLabel('Comment').fill('adopted zero (test value)');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(row).toContainText('confirmed');
	await page.reload();
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('adopted zero (test value)');
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('Ola Owner');
	// A level with an observed energy appears on the cm⁻¹ diagram.
	await expect(page.getByTestId('observed-diagram-svg')).toBeVisible();
	await expect(page.getByTestId('observed-diagram-svg')).toHaveAttribute('aria-label', /⁶D₉\/₂ at 0 \(confirmed\)/);
	await shot(page, 'shelf-entry-levels');

	// Exports carry the note.
	const csv = await (await page.request.get(`/api/v1/projects/${projectId}/shelf/${entryId}/levels?format=csv`)).text();
	expect(csv.split('\r\n')[0]).toBe(
		'configuration,level,term,occurrence,J,g,observed_energy_cm-1,uncertainty_cm-1,status,comment,updated_by,updated_at,parentage'
	);
	// Fe II a⁶D is 3d⁶(⁵D)4s (NIST ASD, from memory): the note's level carries its parent.
	expect(csv).toMatch(/6D J=9\/2,6D,1,9\/2,14\/9,.*,3d⁶\(⁵D\)4s ⁶D/);
	await expect(page.locator('tr[data-level="6D#1|9/2"]').getByTestId('level-parentage')).toHaveText('3d⁶(⁵D)4s ⁶D');
	// g(⁶D₉/₂) = 14/9 (Landé formula, g_s = 2: 1 + (99/4 + 35/4 − 6)/(2·99/4)).
	expect(csv).toContain('6D J=9/2,6D,1,9/2,14/9,0,0.01,confirmed,adopted zero (test value),Ola Owner,');
	const download = page.waitForEvent('download');
	await page.getByRole('link', { name: 'LaTeX' }).click();
	const tex = await (await download).path().then((p) => import('node:fs').then((fs) => fs.readFileSync(p!, 'utf8')));
	expect(tex).toContain('\\toprule');
	expect(tex).toContain('$^{6}\\mathrm{D}_{9/2}$ & $14/9$ & $0$ & $0.01$ & confirmed');

	// A viewer sees the note but has no way to change it, and the API refuses.
	const viewer = await newUser(browser, 'Vic Viewer', 'shelf-viewer');
	await page.goto(`${projectUrl}/members`);
	await page.getByLabel('E-mail of their account').fill(viewer.email);
	await page.getByRole('button', { name: 'Add' }).click();
	await expect(page.getByTestId('member-list')).toContainText('Vic Viewer');
	await viewer.page.goto(entryUrl);
	await expect(viewer.page.locator('tr[data-level="6D#1|9/2"]')).toContainText('confirmed');
	await expect(viewer.page.getByRole('button', { name: 'Annotate' })).toHaveCount(0);
	const put = await viewer.page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '6D#1|7/2', observedEnergy: 1 }
	});
	expect(put.status()).toBe(403);

	// Two tabs of the owner: the second save from an old page is refused, not silently applied.
	const second = await owner.context.newPage();
	await second.goto(entryUrl);
	await page.goto(entryUrl);
	await page.locator('tr[data-level="6D#1|9/2"]').getByRole('button', { name: 'Edit' }).click();
	await page.getByLabel('Comment').fill('first tab wins');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('first tab wins');
	await second.locator('tr[data-level="6D#1|9/2"]').getByRole('button', { name: 'Edit' }).click();
	await second.getByLabel('Comment').fill('second tab loses');
	await second.getByRole('button', { name: 'Save note' }).click();
	await expect(second.getByRole('alert')).toContainText('changed by someone else');
	await shot(second, 'shelf-stale-note');

	await owner.context.close();
	await viewer.context.close();
});

test('from "Fe II" in the Builder to a saved, annotated and exported level table', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Fay Flow', 'flow');
	await page.getByLabel('Name').fill('Iron lines');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Iron lines' })).toBeVisible();

	await page.goto('/builder');
	await page.getByPlaceholder('Fe II, Nd3+').fill('Fe II');
	await page.getByRole('button', { name: 'Ground configuration' }).click();
	// Fe II ground configuration 3d⁶4s, 420 = C(10,6)·C(2,1) microstates (NIST/CRC ion ground levels; combinatorics).
	await expect(page.getByText('420 microstates').first()).toBeVisible();
	await page.getByTestId('save-to-shelf').getByRole('link', { name: 'Save…' }).click();
	await expect(page).toHaveURL(/\/shelf\/new\?/);
	await expect(page.getByLabel('Configuration', { exact: true })).toHaveValue('[Ar] 3d6 4s');
	await expect(page.getByLabel('Species')).toHaveValue('Fe II');
	// The title is prefilled from the species and the configuration.
	await expect(page.getByLabel('Title')).toHaveValue('Fe II [Ar] 3d6 4s');
	await page.getByLabel('Title').fill('Fe II ground configuration');
	// A bad tag is refused with the message under the Tags field, which points to it; the rest is kept.
	const tags = page.getByLabel('Tags (comma separated)');
	await tags.fill('iron; nebula');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(tags).toHaveAttribute('aria-invalid', 'true');
	const tagError = page.locator(`[id="${await tags.getAttribute('aria-describedby')}"]`);
	await expect(tagError).toContainText('A tag may hold letters, digits, spaces and . _ + - /');
	await expect(page.getByRole('alert')).toHaveCount(1);
	await expect(page.getByLabel('Title')).not.toHaveAttribute('aria-invalid');
	await expect(page.getByLabel('Title')).toHaveValue('Fe II ground configuration');
	await shot(page, 'shelf-new-tag-error');
	await tags.fill('iron, nebula');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('Fe II ground configuration');

	// The Hund ground level comes first in the level table.
	const first = page.getByTestId('level-notes').locator('tbody tr').first();
	await expect(first).toHaveAttribute('data-level', '6D#1|9/2');
	await first.getByRole('button', { name: 'Annotate' }).click();
	await page.getByLabel('Observed energy (cm⁻¹)').fill('0');
	await page.locator('select[name=status]').selectOption('proposed');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(first).toContainText('proposed');

	const download = page.waitForEvent('download');
	await page.getByRole('link', { name: 'CSV' }).click();
	const file = await download;
	expect(file.suggestedFilename()).toBe('Fe_II_Ar_3d6_4s.csv');
	await context.close();
});
