import { expect, newUser, shot, test } from './helpers';

/**
 * The Shelf never loses or bends a value, in the browser: energies as typed, the question before a
 * configuration change detaches notes, detached notes reattached and deleted, species warnings,
 * the Shelf list paged. Levels of p² and p⁴: ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII).
 */
test('energies as typed; a configuration change asks, then detaches; notes reattach and delete', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Vera Values', 'values');
	await page.getByLabel('Name').fill('Nebula values');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Nebula values' })).toBeVisible();
	const projectId = page.url().split('/').pop()!;
	const created = await page.request.post(`/api/v1/projects/${projectId}/shelf`, {
		data: { title: 'O III ground', species: 'O III', notation: '2p2' }
	});
	expect(created.status()).toBe(201);
	const entryId = (await created.json()).entry.id;
	await page.goto(`/projects/${projectId}/shelf/${entryId}`);

	// A comma is refused with the reason, and what was typed stays in the field.
	const row = page.locator('tr[data-level="3P#1|1"]');
	await row.getByRole('button', { name: 'Annotate' }).click();
	await page.getByLabel('Observed energy (cm⁻¹)').fill('17,300');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(page.getByRole('alert')).toContainText('comma, which is ambiguous');
	await expect(page.getByLabel('Observed energy (cm⁻¹)')).toHaveValue('17,300');
	// Thin-space groups and the typographic minus are read; the digits are shown as typed.
	await page.getByLabel('Observed energy (cm⁻¹)').fill('19\u2009500.12345');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(row).toContainText('19500.12345');
	await page.locator('tr[data-level="1D#1|2"]').getByRole('button', { name: 'Annotate' }).click();
	await page.getByLabel('Observed energy (cm⁻¹)').fill('1880');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(page.locator('tr[data-level="1D#1|2"]')).toContainText('1880');
	await expect(page.locator('tr[data-level="1D#1|2"]')).not.toContainText('1880.000');
	await page.locator('tr[data-level="1S#1|0"]').getByRole('button', { name: 'Annotate' }).click();
	await page.getByLabel('± (cm⁻¹)').fill('0.5');
	await page.getByRole('button', { name: 'Save note' }).click();
	await expect(page.getByRole('alert')).toContainText('uncertainty needs an observed energy');

	// Changing 2p2 to 2p4 asks first, saying how many notes it affects.
	await page.getByText('Edit entry').click();
	await page.getByLabel('Configuration').fill('2p4');
	await page.getByRole('button', { name: 'Save changes' }).click();
	await expect(page.getByTestId('notation-error')).toContainText('detaches 2 notes');
	await shot(page, 'shelf-confirm-detach');
	await page.getByRole('button', { name: 'Save and detach 2 notes' }).click();
	await expect(page.getByTestId('detached-notes')).toContainText('2 notes detached');
	// The new ³P₁ has no note: nothing moved silently onto the level of the same label.
	await expect(page.locator('tr[data-level="3P#1|1"]')).not.toContainText('19500.12345');
	// O III with 2p4: the species check warns and says what it assumed.
	await expect(page.getByTestId('entry-warning')).toContainText('1s2 2s2 assumed');
	await shot(page, 'shelf-detached-notes');

	// Reattach one, delete the other.
	const detached = page.getByTestId('detached-notes');
	const first = detached.locator('tr[data-detached="3P#1|1"]');
	await first.getByLabel('Level to reattach to').selectOption('3P#1|2');
	await first.getByRole('button', { name: 'Reattach' }).click();
	await expect(page.locator('tr[data-level="3P#1|2"]')).toContainText('19500.12345');
	page.once('dialog', (d) => d.accept());
	await page.getByTestId('detached-notes').getByRole('button', { name: 'Delete' }).click();
	await expect(page.getByTestId('detached-notes')).toHaveCount(0);

	// A note on a level can be deleted too.
	page.once('dialog', (d) => d.accept());
	await page.locator('tr[data-level="3P#1|2"]').getByRole('button', { name: 'Delete' }).click();
	await expect(page.locator('tr[data-level="3P#1|2"]')).not.toContainText('19500.12345');
	await context.close();
});

test('the Shelf list comes in pages with a way to show more, and the filter asks the server', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Paul Pager', 'pager');
	await page.getByLabel('Name').fill('Long shelf');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Long shelf' })).toBeVisible();
	const projectId = page.url().split('/').pop()!;
	for (let i = 0; i < 55; i++) {
		const r = await page.request.post(`/api/v1/projects/${projectId}/shelf`, {
			data: { title: `Entry ${String(i).padStart(2, '0')}`, notation: '2p2', tags: i === 3 ? ['needle'] : [] }
		});
		expect(r.status()).toBe(201);
	}
	const api = await (await page.request.get(`/api/v1/projects/${projectId}/shelf?limit=20`)).json();
	expect(api.entries).toHaveLength(20);
	expect(api.nextCursor).toBeTruthy();
	await page.reload();
	await expect(page.getByTestId('shelf-list').locator('tbody tr')).toHaveCount(50);
	await page.getByRole('button', { name: 'Show 50 more' }).click();
	await expect(page.getByTestId('shelf-list').locator('tbody tr')).toHaveCount(55);
	await expect(page.getByRole('button', { name: 'Show 50 more' })).toHaveCount(0);
	await page.getByLabel('Filter the Shelf').fill('needle');
	await expect(page.getByTestId('shelf-list').locator('tbody tr')).toHaveCount(1);
	await expect(page.getByTestId('shelf-list')).toContainText('Entry 03');
	await context.close();
});
