import { addEntry, addMember, createProject, expect, newUser, shot, test } from './helpers';

test('the project Activity page lists each change, filters by kind and person, and viewers read it', async ({ browser }) => {
	const owner = await newUser(browser, 'Alma Owner', 'activity-owner');
	const { page } = owner;
	const { projectUrl } = await createProject(page, 'Log of a nebula');
	await addEntry(page, projectUrl, { title: 'O III ground', notation: '1s2 2s2 2p2' });

	const viewer = await newUser(browser, 'Vito Viewer', 'activity-viewer');
	await addMember(page, projectUrl, { email: viewer.email, name: 'Vito Viewer' }, 'viewer');

	await page.getByRole('link', { name: 'Activity' }).click();
	const log = page.getByRole('table', { name: 'Activity log' });
	await expect(log.locator('tbody tr')).toHaveCount(3);
	await expect(log.locator('tbody tr').nth(0)).toContainText('added Vito Viewer as viewer');
	await expect(log.locator('tbody tr').nth(1)).toContainText('added “O III ground” (1s2 2s2 2p2) to the Shelf');
	await expect(log.locator('tbody tr').nth(2)).toContainText('created the project “Log of a nebula”');
	await expect(log).toContainText('Alma Owner');
	await shot(page, 'activity-log');

	// Filter by kind: only the Shelf line stays; the entry's line links to the entry.
	await page.getByLabel('Kind').selectOption('entry.created');
	await page.getByRole('button', { name: 'Show' }).click();
	await expect(log.locator('tbody tr')).toHaveCount(1);
	await log.getByRole('link', { name: /O III ground/ }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('O III ground');

	// The viewer reads the same log, filtered by person.
	await viewer.page.goto(`${projectUrl}/activity`);
	await viewer.page.getByLabel('Person').selectOption({ label: 'Alma Owner' });
	await viewer.page.getByRole('button', { name: 'Show' }).click();
	await expect(viewer.page.getByRole('table', { name: 'Activity log' }).locator('tbody tr')).toHaveCount(3);
	const api = await viewer.page.request.get(`/api/v1/projects/${projectUrl.split('/').pop()}/activity?limit=2`);
	expect(api.status()).toBe(200);
	const body = await api.json();
	expect(body.items).toHaveLength(2);
	expect(body.nextCursor).toEqual(expect.any(String));

	// A stranger gets 404 from the page and the API.
	const stranger = await newUser(browser, 'Stan Stranger', 'activity-stranger');
	const res = await stranger.page.goto(`${projectUrl}/activity`);
	expect(res?.status()).toBe(404);
});
