import { addEntry, addMember, createProject, expect, newUser, shot, test } from './helpers';

/**
 * Review of a level note in the built app: an editor proposes, the same editor is not offered
 * "confirmed" (and a forged save is refused with a message), a second editor confirms; the note's
 * History, the project's activity log and the Awaiting review panel show each step. The rule is
 * the product's (issue #13; common practice for shared records, no source). Levels of 2p²:
 * ³P₀,₁,₂ ¹D₂ ¹S₀ (Condon & Shortley 1935, ch. VII). The energy is invented.
 */
test('an editor proposes, cannot confirm their own note, another editor confirms; history, log and review panel follow', async ({
	browser
}) => {
	const owner = await newUser(browser, 'Olga Owner', 'review-owner');
	const { projectUrl, projectId } = await createProject(owner.page, 'Review nebula');
	const { entryUrl, entryId } = await addEntry(owner.page, projectUrl, {
		title: 'O III ground',
		notation: '1s2 2s2 2p2',
		species: 'O III'
	});
	const ed = await newUser(browser, 'Ed Itor', 'review-ed');
	const rita = await newUser(browser, 'Rita Reviewer', 'review-rita');
	const viewer = await newUser(browser, 'Vera Viewer', 'review-viewer');
	await addMember(owner.page, projectUrl, { email: ed.email, name: 'Ed Itor' }, 'editor');
	await addMember(owner.page, projectUrl, { email: rita.email, name: 'Rita Reviewer' }, 'editor');
	await addMember(owner.page, projectUrl, { email: viewer.email, name: 'Vera Viewer' }, 'viewer');

	// Ed proposes ³P₁: a new note is offered only proposed or disputed, and the form says why.
	await ed.page.goto(entryUrl);
	const edRow = ed.page.locator('tr[data-level="3P#1|1"]');
	await edRow.getByRole('button', { name: 'Annotate' }).click();
	await expect(ed.page.locator('select[name=status] option')).toHaveText(['proposed', 'disputed']);
	await expect(ed.page.getByTestId('review-rule')).toContainText('an owner or another editor then confirms it');
	await ed.page.getByLabel('Observed energy (cm⁻¹)').fill('113.2');
	await ed.page.getByLabel('± (cm⁻¹)').fill('0.1');
	await ed.page.getByRole('button', { name: 'Save note' }).click();
	await expect(edRow).toContainText('proposed');
	await expect(edRow).toContainText('Ed Itor');

	// Editing his own proposal, Ed is still not offered "confirmed", and is told why.
	await edRow.getByRole('button', { name: 'Edit' }).click();
	await expect(ed.page.locator('select[name=status] option')).toHaveText(['proposed', 'disputed']);
	await expect(ed.page.getByTestId('review-rule')).toHaveText(
		/You proposed these values, so “confirmed” is not offered to you: an owner or another editor confirms them\./
	);
	// A forged form (the option put back by hand) is refused by the server, with a message.
	await ed.page.locator('select[name=status]').evaluate((select: HTMLSelectElement) => {
		select.add(new Option('confirmed', 'confirmed', true, true));
	});
	await ed.page.getByRole('button', { name: 'Save note' }).click();
	await expect(ed.page.getByTestId('status-error')).toContainText('You proposed this note, so you cannot confirm it yourself');
	await shot(ed.page, 'review-own-proposal');
	// So is a forged API call.
	const forged = await ed.page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '3P#1|1', observedEnergy: '113.2', uncertainty: '0.1', status: 'confirmed', version: 1 }
	});
	expect(forged.status()).toBe(403);
	expect((await forged.json()).error.message).toMatch(
		/You proposed this note, so you cannot confirm it yourself: an owner or another editor/
	);
	await ed.page.reload();
	await expect(ed.page.locator('tr[data-level="3P#1|1"]')).toContainText('proposed');

	// The Awaiting review panel: Rita sees Ed's proposal; Ed sees it marked as his; the viewer has no panel.
	await rita.page.goto(projectUrl);
	const panel = rita.page.getByTestId('awaiting-review');
	const waiting = panel.locator('tr[data-level="3P#1|1"]');
	await expect(waiting).toContainText('O III ground');
	await expect(waiting).toContainText('3P J=1');
	await expect(waiting).toContainText('113.2 ± 0.1');
	await expect(waiting).toContainText('proposed');
	await expect(waiting).toContainText('Ed Itor');
	await expect(waiting).not.toContainText('(you');
	await shot(rita.page, 'review-awaiting');
	await ed.page.goto(projectUrl);
	const own = ed.page.getByTestId('awaiting-review').locator('tr[data-level="3P#1|1"]');
	await expect(own).toContainText('(you)');
	await expect(own.getByTitle('You proposed it: another editor or an owner confirms it')).toBeVisible();
	await viewer.page.goto(projectUrl);
	await expect(viewer.page.getByTestId('shelf-list')).toContainText('O III ground');
	await expect(viewer.page.getByTestId('awaiting-review')).toHaveCount(0);
	expect((await viewer.page.request.get(`/api/v1/projects/${projectId}/review`)).status()).toBe(403);

	// Rita follows the link to the entry, is offered "confirmed", and confirms.
	await waiting.getByRole('link', { name: 'O III ground' }).click();
	await expect(rita.page.getByTestId('entry-title')).toHaveText('O III ground');
	const ritaRow = rita.page.locator('tr[data-level="3P#1|1"]');
	await ritaRow.getByRole('button', { name: 'Edit' }).click();
	await expect(rita.page.locator('select[name=status] option')).toHaveText(['proposed', 'confirmed', 'disputed']);
	await expect(rita.page.getByTestId('review-rule')).toContainText('Proposed by Ed Itor. You may confirm it');
	await rita.page.locator('select[name=status]').selectOption('confirmed');
	await rita.page.getByRole('button', { name: 'Save note' }).click();
	await expect(ritaRow).toContainText('confirmed');

	// The note's History lists both steps: what, who, when.
	await ritaRow.getByRole('button', { name: 'History' }).click();
	const steps = rita.page.getByTestId('note-history').locator('tbody tr');
	await expect(steps).toHaveCount(2);
	await expect(steps.nth(0)).toHaveAttribute('data-change', 'created');
	await expect(steps.nth(0)).toContainText('Ed Itor');
	await expect(steps.nth(0)).toContainText('113.2 ± 0.1 cm⁻¹');
	await expect(steps.nth(1)).toHaveAttribute('data-change', 'confirmed');
	await expect(steps.nth(1)).toContainText('Rita Reviewer');
	await expect(steps.nth(1)).toContainText('confirmed');
	await expect(steps.nth(0)).toContainText(/\d{4}-\d\d-\d\d \d\d:\d\d UTC/);
	await shot(rita.page, 'review-history');

	// The viewer reads the status and the history, with no controls.
	await viewer.page.goto(entryUrl);
	const viewerRow = viewer.page.locator('tr[data-level="3P#1|1"]');
	await expect(viewerRow).toContainText('confirmed');
	await expect(viewerRow.getByRole('button', { name: 'Edit', exact: true })).toHaveCount(0);
	await viewerRow.getByRole('button', { name: 'History' }).click();
	await expect(viewer.page.getByTestId('note-history').locator('tbody tr')).toHaveCount(2);

	// The project's activity log shows each step.
	await owner.page.goto(`${projectUrl}/activity`);
	const log = owner.page.getByRole('table', { name: 'Activity log' });
	await expect(log.locator('tr[data-kind="note.confirmed"]')).toHaveCount(1);
	await expect(log.locator('tr[data-kind="note.confirmed"]')).toContainText('Rita Reviewer');
	await expect(log.locator('tr[data-kind="note.confirmed"]')).toContainText(
		'confirmed the note on 3P J=1 of “O III ground”: 113.2 ± 0.1 cm⁻¹'
	);
	await expect(log.locator('tr[data-kind="note.saved"]')).toHaveCount(1);
	await expect(log.locator('tr[data-kind="note.saved"]')).toContainText('Ed Itor');
	await expect(log.locator('tr[data-kind="note.saved"]')).toContainText(
		'added the note on 3P J=1 of “O III ground”: 113.2 ± 0.1 cm⁻¹ (proposed)'
	);

	// Nothing awaits review any more.
	await rita.page.goto(projectUrl);
	await expect(rita.page.getByTestId('awaiting-review')).toContainText('Nothing awaits review');
	await expect(rita.page.getByTestId('awaiting-review').locator('tbody tr')).toHaveCount(0);

	// New values on the confirmed note make it proposed again, by Ed: the page says so and the note waits for review again.
	await ed.page.goto(entryUrl);
	await ed.page.locator('tr[data-level="3P#1|1"]').getByRole('button', { name: 'Edit' }).click();
	await ed.page.getByLabel('Observed energy (cm⁻¹)').fill('113.25');
	await ed.page.getByRole('button', { name: 'Save note' }).click();
	await expect(ed.page.getByTestId('note-reopened')).toContainText('its values changed, so it is proposed again');
	await expect(ed.page.locator('tr[data-level="3P#1|1"]')).toContainText('proposed');
	await ed.page.locator('tr[data-level="3P#1|1"]').getByRole('button', { name: 'History' }).click();
	await expect(ed.page.getByTestId('note-history').locator('tbody tr').nth(2)).toContainText('proposed again');
	await rita.page.goto(projectUrl);
	await expect(rita.page.getByTestId('awaiting-review').locator('tr[data-level="3P#1|1"]')).toContainText('113.25 ± 0.1');

	for (const who of [owner, ed, rita, viewer]) await who.context.close();
});
