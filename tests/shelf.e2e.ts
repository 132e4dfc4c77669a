import { addEntry, addMember, createProject, expect, newUser, shot, test, waitForHydration } from './helpers';

test('annotate a level on the Shelf, reload, export; viewers cannot annotate; stale notes are refused', async ({ browser }) => {
	const owner = await newUser(browser, 'Ola Owner', 'shelf-owner');
	const { page } = owner;
	const { projectUrl, projectId } = await createProject(page, 'Peculiar star');
	const { entryUrl, entryId } = await addEntry(page, projectUrl, {
		title: 'Iron II ground configuration',
		notation: '[Ar] 3d6 4s',
		species: 'Fe II',
		tags: 'iron group, test'
	});
	// The review rule: an editor proposes the note, the owner confirms it (nobody confirms their own).
	const editor = await newUser(browser, 'Eda Editor', 'shelf-editor');
	await addMember(page, projectUrl, { email: editor.email, name: 'Eda Editor' }, 'editor');

	// ⁶D₉/₂ is the Hund's-rule ground level of 3d⁶4s (Fe II ground level in the NIST/CRC ion tables).
	await editor.page.goto(entryUrl);
	const proposed = editor.page.locator('tr[data-level="6D#1|9/2"]');
	await proposed.getByRole('button', { name: 'Annotate' }).click();
	await editor.page.getByLabel('Observed energy (cm⁻¹)').fill('0');
	await editor.page.getByLabel('± (cm⁻¹)').fill('0.01');
	// A new note cannot be confirmed: the form does not offer it.
	await expect(editor.page.locator('select[name=status] option')).toHaveText(['proposed', 'disputed']);
	await editor.page.getByLabel('Comment').fill('adopted zero (test value)');
	await editor.page.getByRole('button', { name: 'Save note' }).click();
	await expect(proposed).toContainText('proposed');
	await expect(proposed).toContainText('Eda Editor');

	await page.goto(entryUrl);
	const row = page.locator('tr[data-level="6D#1|9/2"]');
	await row.getByRole('button', { name: 'Edit' }).click();
	await page.locator('select[name=status]').selectOption('confirmed');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(row).toContainText('confirmed');
	await page.reload();
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('adopted zero (test value)');
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('Ola Owner');
	await expect(page.locator('tr[data-level="6D#1|9/2"]')).toContainText('Eda Editor');
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
	await addMember(page, projectUrl, { email: viewer.email, name: 'Vic Viewer' }, 'viewer');
	await viewer.page.goto(entryUrl);
	await expect(viewer.page.locator('tr[data-level="6D#1|9/2"]')).toContainText('confirmed');
	await expect(viewer.page.getByRole('button', { name: 'Annotate' })).toHaveCount(0);
	await expect(viewer.page.getByRole('button', { name: 'Edit', exact: true })).toHaveCount(0);
	// The viewer reads the note's history: proposed by the editor, confirmed by the owner.
	await viewer.page.locator('tr[data-level="6D#1|9/2"]').getByRole('button', { name: 'History' }).click();
	const history = viewer.page.getByTestId('note-history').locator('tbody tr');
	await expect(history).toHaveCount(2);
	await expect(history.nth(0)).toContainText('created');
	await expect(history.nth(0)).toContainText('Eda Editor');
	await expect(history.nth(1)).toContainText('confirmed');
	await expect(history.nth(1)).toContainText('Ola Owner');
	const put = await viewer.page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '6D#1|7/2', observedEnergy: 1 }
	});
	expect(put.status()).toBe(403);

	// Two tabs of the owner: the second save from an old page is refused, not silently applied.
	const second = waitForHydration(await owner.context.newPage());
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
	await editor.context.close();
	await viewer.context.close();
});

test('from "Fe II" in the Builder to a saved, annotated and exported level table', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Fay Flow', 'flow');
	await createProject(page, 'Iron lines');

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
