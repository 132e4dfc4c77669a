import { addMember, createProject, expect, newUser, shot, test } from './helpers';

/**
 * Pasting a column of observed energies on a Shelf entry: the preview says line by line where each
 * value goes or why not, a refused line keeps the Save button off, an existing note is shown as
 * replaced, and the save writes all notes at once. Viewers see no paste tool. Levels of p²:
 * ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII). Energies are invented.
 */
test('paste → preview → save; a refused line saves nothing; viewers have no paste tool', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Pia Paste', 'paste');
	const { projectId } = await createProject(page, 'Nebula paste');
	const created = await page.request.post(`/api/v1/projects/${projectId}/shelf`, {
		data: { title: 'O III ground', species: 'O III', notation: '2p2' }
	});
	expect(created.status()).toBe(201);
	const entryId = (await created.json()).entry.id;
	const entryUrl = `/projects/${projectId}/shelf/${entryId}`;
	// An existing disputed note on ¹D₂: the paste must say it replaces it (and that it becomes proposed).
	const put = await page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '1D#1|2', observedEnergy: '1880', status: 'disputed', comment: 'old plate' }
	});
	expect(put.status()).toBeLessThan(300);

	for (const width of [1280, 768]) {
		await page.setViewportSize({ width, height: 900 });
		await page.goto(entryUrl);
		await page.getByText('Paste a column of observed energies').click();
		const box = page.getByLabel(/One level per line/);
		await box.fill('0  3P0\n16.4 3P1 ±0.2\n43.5  J=2 3P2\n17,300 1D2\n15867.9 1D2\n99 4P1');
		const preview = page.getByTestId('paste-preview');
		await expect(preview.locator('tr[data-line="1"]')).toContainText('new note');
		await expect(preview.locator('tr[data-line="2"]')).toContainText('16.4 ± 0.2 cm⁻¹');
		await expect(preview.locator('tr[data-line="4"]')).toContainText('comma, which is ambiguous');
		await expect(preview.locator('tr[data-line="5"]')).toContainText('replaces 1880 cm⁻¹');
		await expect(preview.locator('tr[data-line="5"]')).toContainText('disputed → proposed');
		await expect(preview.locator('tr[data-line="6"]')).toContainText('4P is not a term of 2p2');
		await expect(page.getByTestId('paste-summary')).toContainText('4 of 6 lines go to a level; 2 refused — nothing is saved');
		await expect(page.getByRole('button', { name: 'Save', exact: true })).toBeDisabled();
		await shot(page, `paste-preview-${width}`);
	}

	// Remove the refused lines: the four others are saved together.
	await page.getByLabel(/One level per line/).fill('0  3P0\n16.4 3P1 ±0.2\n43.5  J=2 3P2\n15867.9 1D2 "new plate"');
	await expect(page.getByTestId('paste-summary')).toContainText('4 of 4 lines go to a level.');
	await page.getByRole('button', { name: 'Save 4 notes' }).click();
	await expect(page.getByTestId('paste-saved')).toContainText(
		'Saved 4 notes (1 replaced); new values are proposed, for an owner or another editor to confirm.'
	);
	await expect(page.locator('tr[data-level="3P#1|1"]')).toContainText('16.4');
	await expect(page.locator('tr[data-level="3P#1|1"]')).toContainText('0.2');
	await expect(page.locator('tr[data-level="1D#1|2"]')).toContainText('15867.9');
	await expect(page.locator('tr[data-level="1D#1|2"]')).toContainText('proposed');
	await expect(page.locator('tr[data-level="1D#1|2"]')).toContainText('new plate');
	await expect(page.getByLabel(/One level per line/)).toHaveValue('');
	await shot(page, 'paste-saved-1280');
	// The paste is in the note's history, by the person who pasted, after the note it replaced.
	await page.locator('tr[data-level="1D#1|2"]').getByRole('button', { name: 'History' }).click();
	const history = page.getByTestId('note-history');
	await expect(history.locator('tbody tr')).toHaveCount(2);
	await expect(history.locator('tbody tr').nth(0)).toContainText('created');
	await expect(history.locator('tbody tr').nth(1)).toContainText('changed');
	await expect(history.locator('tbody tr').nth(1)).toContainText('15867.9 cm⁻¹');
	await expect(history.locator('tbody tr').nth(1)).toContainText('Pia Paste');
	await page.locator('tr[data-level="1D#1|2"]').getByRole('button', { name: 'History' }).click();

	// The same paste again, but someone changes ³P₁ after the preview: the save is refused whole.
	await page.getByLabel(/One level per line/).fill('1 3P0\n16.5 3P1');
	await expect(page.getByTestId('paste-preview').locator('tr[data-line="2"]')).toContainText('replaces 16.4 ± 0.2 cm⁻¹');
	const again = await page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '3P#1|1', observedEnergy: '16.45', version: 1 }
	});
	expect(again.status()).toBeLessThan(300);
	await page.getByRole('button', { name: 'Save 2 notes' }).click();
	await expect(page.getByTestId('form-error')).toContainText('Nothing was saved: the note on 3P J=1 was changed by someone else');
	// The observed-energy column (third) of ³P₀ still holds the first paste's 0.
	await expect(page.locator('tr[data-level="3P#1|0"] td').nth(2)).toHaveText('0');

	// A viewer has no paste tool.
	const viewer = await newUser(browser, 'Vic Viewer', 'paste-viewer');
	await addMember(page, `/projects/${projectId}`, { email: viewer.email, name: 'Vic Viewer' }, 'viewer');
	await viewer.page.goto(entryUrl);
	await expect(viewer.page.locator('tr[data-level="1D#1|2"]')).toContainText('15867.9');
	await expect(viewer.page.getByTestId('paste-energies')).toHaveCount(0);
	await viewer.context.close();
	await context.close();
});
