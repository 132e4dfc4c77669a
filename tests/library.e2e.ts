import { type Page } from '@playwright/test';
import { expect, newUser, shot, test } from './helpers';

/**
 * The Shelf as a library: filters (kept in the URL), "N of M", the empty result, tags edited in
 * place, copying an entry with its note to a second project, and a viewer without edit controls.
 * Parities follow (−1)^Σl (Condon & Shortley 1935; Cowan 1981 sec. 4.1); a subshell is open when it
 * is neither empty nor full (Pauli principle). The product rules are common practice, no source.
 */

const ENTRIES = [
	// 2p²: Σl = 2, even; open 2p.
	{ title: 'Carbon-like ground', species: 'C I', notation: '1s2 2s2 2p2', tags: ['nebula'] },
	// 2p³: Σl = 3, odd; open 2p.
	{ title: 'Nitrogen ground', species: 'N I', notation: '1s2 2s2 2p3', tags: ['nebula', 'odd ones'] },
	// 3d⁶4s: Σl = 12, even; open 3d, 4s.
	{ title: 'Iron ion', species: 'Fe II', notation: '[Ar] 3d6 4s', tags: ['iron group'] },
	// 3d⁵4s4p: Σl = 11, odd; open 3d, 4s, 4p.
	{ title: 'Iron ion, odd', species: 'Fe II', notation: '[Ar] 3d5 4s 4p', tags: ['iron group', 'odd ones'] },
	// 2p⁵3p: Σl = 6, even; open 2p, 3p.
	{ title: 'Neon excited', species: 'Ne I', notation: '1s2 2s2 2p5 3p', tags: ['coupling'] }
];

async function createProject(page: Page, name: string): Promise<string> {
	await page.goto('/projects');
	await page.getByLabel('Name').fill(name);
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name })).toBeVisible();
	return page.url().split('/').pop()!;
}

const rows = (page: Page) => page.getByTestId('shelf-list').locator('tbody tr');
const titles = (page: Page) => rows(page).locator('td:first-child a');

test('filter the Shelf, keep the filters in the URL, edit tags in place, copy an entry to a second project', async ({ browser }) => {
	const owner = await newUser(browser, 'Lena Librarian', 'library-owner');
	const { page } = owner;
	const projectId = await createProject(page, 'Library A');
	const ids: Record<string, string> = {};
	for (const e of ENTRIES) {
		const res = await page.request.post(`/api/v1/projects/${projectId}/shelf`, { data: e });
		expect(res.status()).toBe(201);
		ids[e.title] = (await res.json()).entry.id;
	}
	await page.goto(`/projects/${projectId}`);
	await expect(page.getByTestId('shelf-matching')).toContainText('5 of 5 entries');

	// Text: matches titles (and tags, notes, species, configuration).
	await page.getByLabel('Filter the Shelf').fill('iron');
	await expect(page.getByTestId('shelf-matching')).toContainText('2 of 5 entries');
	// Newest change first: entries saved in the same millisecond may come in either order.
	expect((await titles(page).allTextContents()).sort()).toEqual(['Iron ion', 'Iron ion, odd']);
	// Species and parity narrow it further.
	await page.getByLabel('Species', { exact: true }).selectOption('Fe II');
	await page.getByLabel('Parity', { exact: true }).selectOption('odd');
	await expect(titles(page)).toHaveText(['Iron ion, odd']);
	await expect(page.getByTestId('shelf-matching')).toContainText('1 of 5 entries');
	await expect(page).toHaveURL(/\?q=iron&species=Fe\+II&parity=odd$/);
	await shot(page, 'library-filtered-1280');
	await page.setViewportSize({ width: 768, height: 900 });
	await shot(page, 'library-filtered-768');
	await page.setViewportSize({ width: 1280, height: 800 });

	// A reload (or the shared link) shows the same list with the same filters.
	await page.reload();
	await expect(page.getByLabel('Filter the Shelf')).toHaveValue('iron');
	await expect(page.getByLabel('Species', { exact: true })).toHaveValue('Fe II');
	await expect(page.getByLabel('Parity', { exact: true })).toHaveValue('odd');
	await expect(titles(page)).toHaveText(['Iron ion, odd']);
	await expect(page.getByTestId('shelf-matching')).toContainText('1 of 5 entries');

	// The /shelf address is a link to the same list with the same filters.
	await page.goto(`/projects/${projectId}/shelf?species=Fe+II&parity=even`);
	await expect(page).toHaveURL(new RegExp(`/projects/${projectId}\\?species=Fe\\+II&parity=even$`));
	await expect(titles(page)).toHaveText(['Iron ion']);

	await page.getByRole('button', { name: 'Clear filters' }).click();
	await expect(page.getByTestId('shelf-matching')).toContainText('5 of 5 entries');
	await expect(page).toHaveURL(new RegExp(`/projects/${projectId}$`));

	// Tag (from the tags in use) and open subshells; title sort.
	await page.getByLabel('Sort', { exact: true }).selectOption('title');
	await page.getByLabel('Tag', { exact: true }).selectOption('nebula');
	await expect(titles(page)).toHaveText(['Carbon-like ground', 'Nitrogen ground']);
	await page.getByLabel('Tag', { exact: true }).selectOption('');
	await page.getByLabel('Open subshells').fill('3d');
	await expect(titles(page)).toHaveText(['Iron ion', 'Iron ion, odd']);
	await page.getByLabel('Open subshells').fill('4p');
	await expect(titles(page)).toHaveText(['Iron ion, odd']);
	await page.getByLabel('Open subshells').fill('2p');
	await expect(titles(page)).toHaveText(['Carbon-like ground', 'Neon excited', 'Nitrogen ground']);
	// A subshell that cannot exist gets the server's words.
	await page.getByLabel('Open subshells').fill('2d');
	await expect(page.getByRole('alert')).toContainText('there is no 2d subshell');

	// Nothing matches: the page says which filters hide everything and offers to clear them.
	await page.getByLabel('Open subshells').fill('2p');
	await page.getByLabel('Filter the Shelf').fill('zzz');
	await expect(page.getByTestId('shelf-empty')).toContainText('No entry of the 5 on the Shelf has text “zzz” and open 2p.');
	await page.getByRole('button', { name: 'Drop text “zzz”' }).click();
	await expect(titles(page)).toHaveCount(3);
	await page.getByLabel('Filter the Shelf').fill('zzz');
	await expect(page.getByTestId('shelf-empty')).toBeVisible();
	await page.getByRole('button', { name: 'Clear all filters' }).click();
	await expect(page.getByTestId('shelf-matching')).toContainText('5 of 5 entries');

	// Tags edited in place, in the list; kept after a reload and offered as a filter.
	const carbon = page.locator(`tr[data-entry="${ids['Carbon-like ground']}"]`);
	await carbon.getByRole('button', { name: 'Edit the tags of Carbon-like ground' }).click();
	await page.getByLabel('Tags of Carbon-like ground (comma separated)').fill('nebula, forbidden lines');
	await carbon.getByRole('button', { name: 'Save tags' }).click();
	await expect(carbon.getByTestId('tag')).toHaveText(['nebula', 'forbidden lines']);
	await page.reload();
	await expect(page.locator(`tr[data-entry="${ids['Carbon-like ground']}"]`).getByTestId('tag')).toHaveText(['nebula', 'forbidden lines']);
	await page.getByLabel('Tag', { exact: true }).selectOption('forbidden lines');
	await expect(titles(page)).toHaveText(['Carbon-like ground']);

	// A stale version (someone saved in between) is refused with a clear message; what was typed stays.
	await page.getByRole('button', { name: 'Edit the tags of Carbon-like ground' }).click();
	const version = (await (await page.request.get(`/api/v1/projects/${projectId}/shelf/${ids['Carbon-like ground']}`)).json()).entry.version;
	await page.request.patch(`/api/v1/projects/${projectId}/shelf/${ids['Carbon-like ground']}`, { data: { tags: ['theirs'], version } });
	await page.getByLabel('Tags of Carbon-like ground (comma separated)').fill('mine');
	await page.getByRole('button', { name: 'Save tags' }).click();
	await expect(page.getByTestId('tags-error')).toContainText('was changed by Lena Librarian since you opened it');
	await expect(page.getByTestId('tags-error')).toContainText('the tags are now: theirs');
	await expect(page.getByLabel('Tags of Carbon-like ground (comma separated)')).toHaveValue('mine');

	// Copy an entry with its level note to a second project.
	const second = await createProject(page, 'Library B');
	const entryId = ids['Carbon-like ground'];
	const put = await page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
		data: { levelKey: '3P#1|2', observedEnergy: '43.4', uncertainty: '0.1', comment: 'invented test value' }
	});
	expect(put.status()).toBe(200);
	await page.goto(`/projects/${projectId}/shelf/${entryId}`);
	const chooser = page.getByTestId('entry-transfer');
	await expect(chooser.getByLabel('Project to copy or move to').locator('option')).toHaveText(['Library B (owner)']);
	await shot(page, 'library-copy-chooser');
	await chooser.getByRole('button', { name: 'Copy there' }).click();
	await expect(chooser.getByRole('status')).toContainText('Copied with 1 note to Library B');
	await chooser.getByRole('link', { name: 'Library B' }).click();
	await expect(page).toHaveURL(new RegExp(`/projects/${second}/shelf/`));
	await expect(page.getByTestId('entry-title')).toHaveText('Carbon-like ground');
	await expect(page.locator('tr[data-level="3P#1|2"]')).toContainText('invented test value');
	await expect(page.locator('tr[data-level="3P#1|2"]')).toContainText('proposed');
	await page.goto(`/projects/${second}`);
	await expect(titles(page)).toHaveText(['Carbon-like ground']);
	await page.goto(`/projects/${second}/activity`);
	await expect(page.locator('main')).toContainText('here from the project “Library A”');

	// Duplicate in the project (the copy opens), then move the duplicate to the second project.
	await page.goto(`/projects/${projectId}/shelf/${entryId}`);
	await page.getByRole('button', { name: 'Duplicate here' }).click();
	await expect(page.getByTestId('entry-title')).toHaveText('Carbon-like ground (copy)');
	await expect(page.locator('tr[data-level="3P#1|2"]')).toContainText('invented test value');
	page.once('dialog', (d) => d.accept());
	await page.getByRole('button', { name: 'Move there' }).click();
	await expect(page).toHaveURL(new RegExp(`/projects/${second}/shelf/`));
	await expect(page.getByTestId('entry-title')).toHaveText('Carbon-like ground (copy)');
	await page.goto(`/projects/${second}?sort=title`);
	await expect(titles(page)).toHaveText(['Carbon-like ground', 'Carbon-like ground (copy)']);
	await page.goto(`/projects/${projectId}`);
	await expect(page.getByTestId('shelf-matching')).toContainText('5 of 5 entries');

	// A viewer sees the tags but no control to change them, nor to duplicate, copy or move.
	const viewer = await newUser(browser, 'Vera Viewer', 'library-viewer');
	await page.goto(`/projects/${projectId}/members`);
	await page.getByLabel('E-mail of their account').fill(viewer.email);
	await page.getByRole('button', { name: 'Add' }).click();
	await expect(page.getByTestId('member-list')).toContainText('Vera Viewer');
	await viewer.page.goto(`/projects/${projectId}?tag=nebula`);
	await expect(titles(viewer.page)).toHaveCount(1);
	await expect(viewer.page.getByTestId('tag').first()).toBeVisible();
	await expect(viewer.page.getByRole('button', { name: /Edit the tags/ })).toHaveCount(0);
	await viewer.page.goto(`/projects/${projectId}/shelf/${entryId}`);
	await expect(viewer.page.getByTestId('entry-tags')).toContainText('theirs');
	await expect(viewer.page.getByRole('button', { name: /Edit the tags|Duplicate|Copy there|Move there/ })).toHaveCount(0);
	await expect(viewer.page.getByTestId('entry-transfer')).toHaveCount(0);
	await viewer.context.close();
	await owner.context.close();
});
