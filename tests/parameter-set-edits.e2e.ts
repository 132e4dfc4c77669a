import { addEntry, addMember, createProject, expect, newUser, shot, test, waitForHydration } from './helpers';

/*
 * Renaming, re-commenting and deleting a saved parameter set on a Shelf entry (product rules, common
 * practice, no source). The fit made from the set uses the five invented 3d² levels of
 * parameters.e2e.ts (Racah B = 800, C = 3200 cm⁻¹, ζ = 0; Racah 1942, Condon & Shortley 1935 §7⁵).
 */
const OBSERVED = [
	{ J: '2', energy: 0, assign: '3F' },
	{ J: '2', energy: 10400, assign: '1D' },
	{ J: '0', energy: 12000, assign: '3P' },
	{ J: '4', energy: 16000, assign: '1G' },
	{ J: '0', energy: 40000, assign: '1S' }
];

test('an editor renames a saved set, a stale rename in a second tab is refused with the present values, the set is deleted after a confirmation, a viewer sees no controls', async ({
	browser
}) => {
	const viewer = await newUser(browser, 'Vera Viewer', 'sets-viewer');
	const editor = await newUser(browser, 'Emil Editor', 'sets-editor');
	const page = editor.page;
	const { projectUrl, projectId } = await createProject(page, 'Invented ions');
	await addMember(page, projectUrl, { email: viewer.email, name: 'Vera Viewer' }, 'viewer');
	const { entryUrl, entryId } = await addEntry(page, projectUrl, { title: 'Invented 3d2 ion', notation: '3d2' });

	// Save a set from the Energy solver.
	await page.getByTestId('open-solver').click();
	await page.getByTestId('param-zeta(3d)').fill('0');
	await page.getByTestId('params-name').fill('start');
	await page.getByTestId('params-save').click();
	await expect(page.getByTestId('params-saved')).toContainText('Saved as “start” (version 1)');
	const set = page.getByTestId('parameter-set');
	await expect(set).toHaveCount(1);
	const setId = (await (await page.request.get(`/api/v1/projects/${projectId}/shelf/${entryId}/parameters`)).json()).parameterSets[0]
		.id as string;
	// A fit report made from the set (typed levels), to see what its deletion says about it.
	const fit = await page.request.post(`/api/v1/projects/${projectId}/shelf/${entryId}/fits`, {
		data: {
			parameters: {
				Eav: 0,
				F: [
					{ k: 2, a: '3d', b: '3d', value: 55000 },
					{ k: 4, a: '3d', b: '3d', value: 36000 }
				],
				zeta: [{ shell: '3d', value: 0 }]
			},
			vary: ['Eav', 'F2(3d,3d)', 'F4(3d,3d)'],
			observed: OBSERVED,
			parameterSetId: setId
		}
	});
	expect(fit.status(), await fit.text()).toBe(201);

	// A second tab opens the entry while the set is still at version 1.
	const second = waitForHydration(await editor.context.newPage());
	await second.goto(entryUrl);
	await expect(second.getByTestId('set-title')).toHaveText('start');

	// Rename with a comment, in place.
	await page.goto(entryUrl);
	await set.getByText('Rename or change the comment').click();
	await set.getByTestId('set-name').fill('start, ζ = 0');
	await set.getByTestId('set-comment').fill('from Racah B and C');
	await set.getByTestId('set-save').click();
	await expect(set.getByTestId('set-saved')).toHaveText('Saved as “start, ζ = 0” (version 2).');
	await expect(set.getByTestId('set-title')).toHaveText('start, ζ = 0');
	await expect(set.getByTestId('set-comment-text')).toHaveText('from Racah B and C');

	// An empty name says what is allowed, and nothing changes (the editor closed after the save).
	await expect(set.getByTestId('set-name')).toBeHidden();
	await set.getByText('Rename or change the comment').click();
	await set.getByTestId('set-name').fill('  ');
	await set.getByTestId('set-save').click();
	await expect(set.getByTestId('name-error')).toContainText('name must not be empty');
	await expect(set.getByTestId('set-title')).toHaveText('start, ζ = 0');

	// The second tab's rename is stale: refused, their values shown, what was typed kept.
	const theirs = second.getByTestId('parameter-set');
	await theirs.getByText('Rename or change the comment').click();
	await theirs.getByTestId('set-name').fill('my own name');
	await theirs.getByTestId('set-save').click();
	await expect(theirs.getByTestId('form-error')).toContainText('changed by someone else (Emil Editor)');
	await expect(theirs.getByTestId('form-error')).toContainText('Nothing was changed');
	await expect(theirs.getByTestId('set-theirs')).toContainText('name “start, ζ = 0”, comment “from Racah B and C”');
	await expect(theirs.getByTestId('set-name')).toHaveValue('my own name');
	await expect(theirs.getByTestId('set-title')).toHaveText('start, ζ = 0');
	await second.setViewportSize({ width: 768, height: 900 });
	await theirs.scrollIntoViewIfNeeded();
	await shot(second, 'parameter-set-stale-768');
	// Having seen theirs, saving again replaces them on purpose (the form now carries version 2).
	await theirs.getByTestId('set-save').click();
	await expect(theirs.getByTestId('set-saved')).toHaveText('Saved as “my own name” (version 3).');
	await second.close();

	// The viewer sees the set but no controls, and the API refuses a viewer's change.
	await viewer.page.goto(entryUrl);
	await expect(viewer.page.getByTestId('set-title')).toHaveText('my own name');
	await expect(viewer.page.getByTestId('set-edit')).toHaveCount(0);
	await expect(viewer.page.getByTestId('set-delete')).toHaveCount(0);
	const refused = await viewer.page.request.patch(`/api/v1/projects/${projectId}/shelf/${entryId}/parameters/${setId}`, {
		data: { name: 'viewer', version: 3 }
	});
	expect(refused.status()).toBe(403);

	// Delete after a confirmation that names the set and says the fit report stays.
	await page.goto(entryUrl);
	await set.getByText('Delete…').click();
	await expect(set.getByTestId('set-delete-warning')).toContainText('Delete the parameter set “my own name”?');
	await expect(set.getByTestId('set-delete-warning')).toContainText('The fit report made from it stays: it keeps the starting values');
	await page.setViewportSize({ width: 1280, height: 900 });
	await set.scrollIntoViewIfNeeded();
	await shot(page, 'parameter-set-delete-1280');
	await set.getByTestId('set-delete-confirm').click();
	await expect(page.getByTestId('set-deleted')).toContainText('Deleted the parameter set “my own name”');
	await expect(page.getByTestId('no-parameter-sets')).toBeVisible();
	await expect(page.getByTestId('saved-fit')).toHaveCount(1);
});
