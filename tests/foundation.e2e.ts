import { expect, newUser, PASSWORD, shot, test } from './helpers';

test('sign up, create a project, add to the Shelf; viewers cannot edit; strangers get 404; sign out', async ({ browser }) => {
	const owner = await newUser(browser, 'Olga Owner', 'owner');
	const { page } = owner;
	await shot(page, 'projects-empty');

	// Create a project.
	await page.getByLabel('Name').fill('Test nebula');
	await page.getByLabel('Description').fill('End-to-end test project');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Test nebula' })).toBeVisible();
	const projectUrl = page.url();
	const projectId = projectUrl.split('/').pop()!;

	// Add a Shelf entry; a bad notation first gets the parser's message.
	await page.getByRole('link', { name: 'Add configuration' }).click();
	await page.getByLabel('Title').fill('Carbon-like ground');
	await page.getByLabel('Configuration').fill('1s2 2s2 2p7');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('notation-error')).toContainText('6');
	await shot(page, 'shelf-new-error');
	await page.getByLabel('Configuration').fill('1s2 2s2 2p2');
	await page.getByLabel('Species').fill('C I');
	await page.getByRole('button', { name: 'Save to Shelf' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('Carbon-like ground');
	const entryUrl = page.url();

	// The project page lists the entry (fetched from /api/v1 in the browser).
	await page.goto(projectUrl);
	await expect(page.getByTestId('shelf-list')).toContainText('Carbon-like ground');
	await shot(page, 'project-shelf');

	// A viewer: sees the Shelf, no edit controls, and the server refuses their writes.
	const viewer = await newUser(browser, 'Vera Viewer', 'viewer');
	await page.goto(`${projectUrl}/members`);
	await page.getByLabel('E-mail of their account').fill(viewer.email);
	await page.getByRole('button', { name: 'Add' }).click();
	await expect(page.getByTestId('member-list')).toContainText('Vera Viewer');
	await shot(page, 'members');

	await viewer.page.goto(projectUrl);
	await expect(viewer.page.getByTestId('shelf-list')).toContainText('Carbon-like ground');
	await expect(viewer.page.getByRole('link', { name: 'Add configuration' })).toHaveCount(0);
	const apiWrite = await viewer.page.request.post(`/api/v1/projects/${projectId}/shelf`, {
		data: { title: 'Sneaky', notation: '1s' }
	});
	expect(apiWrite.status()).toBe(403);
	expect((await apiWrite.json()).error.message).toMatch(/viewer/);
	const formWrite = await viewer.page.goto(`${projectUrl}/shelf/new`);
	expect(formWrite?.status()).toBe(403);
	await viewer.page.goto(entryUrl);
	await expect(viewer.page.getByText('Edit entry')).toHaveCount(0);

	// A stranger gets 404 for the page and the API.
	const stranger = await newUser(browser, 'Sam Stranger', 'stranger');
	const strangerPage = await stranger.page.goto(projectUrl);
	expect(strangerPage?.status()).toBe(404);
	const strangerApi = await stranger.page.request.get(`/api/v1/projects/${projectId}/shelf`);
	expect(strangerApi.status()).toBe(404);
	expect(await strangerApi.json()).toEqual({ error: { message: 'No such project' } });

	// Signed out, project pages send you to sign-in; signing in brings you back.
	await viewer.page.getByRole('button', { name: 'Sign out' }).click();
	await expect(viewer.page).toHaveURL(/\/signin$/);
	await viewer.page.goto(projectUrl);
	await expect(viewer.page).toHaveURL(/\/signin\?next=/);
	await viewer.page.getByLabel('E-mail').fill(viewer.email);
	await viewer.page.getByLabel('Password').fill(PASSWORD);
	await viewer.page.getByRole('button', { name: 'Sign in' }).click();
	await expect(viewer.page).toHaveURL(projectUrl);

	for (const u of [owner, viewer, stranger]) await u.context.close();
});

test('a wrong password gets the same message as an unknown e-mail', async ({ page }) => {
	await page.goto('/signin');
	await page.getByLabel('E-mail').fill('nobody-here@e2e.example');
	await page.getByLabel('Password').fill('whatever-password');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page.getByRole('alert')).toHaveText('E-mail or password is not right');
	await shot(page, 'signin-error');
});
