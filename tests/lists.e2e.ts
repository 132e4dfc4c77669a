import { expect, newUser, shot, test } from './helpers';
import { DEMO_LEVEL_UPLOAD, DEMO_LINE_UPLOAD } from '../src/lib/lines/demo';

/**
 * Saved lists and the project Line matcher: an editor's bad level file is refused with its row, column and
 * reason and nothing is saved; the invented demo level and line lists are previewed and saved; the matcher runs
 * on them, an identification is accepted in place, and the identified and unobserved tables are exported.
 * A viewer sees the same verdicts read-only. The demo lists are invented (src/lib/lines/demo.ts).
 */
const csv = (name: string, text: string) => ({ name, mimeType: 'text/csv', buffer: Buffer.from(text) });

test('upload (bad file refused, nothing saved) → preview → save → match → accept → export; a viewer reads only', async ({ browser }) => {
	const { context, page } = await newUser(browser, 'Lena Lists', 'lists');
	const viewer = await newUser(browser, 'Vik Viewer', 'listviewer');
	await page.getByLabel('Name').fill('Invented ion');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Invented ion' })).toBeVisible();
	const projectId = page.url().split('/').pop()!;
	const added = await page.request.post(`/api/v1/projects/${projectId}/members`, { data: { email: viewer.email, role: 'viewer' } });
	expect(added.status()).toBeLessThan(300);

	await page.getByRole('link', { name: 'Lists', exact: true }).click();
	await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/lists$`));

	// A bad file: row 3 has no number for the energy, row 4 an impossible J. Preview lists both; nothing is saved.
	const bad = 'energy,J,parity\n0,0,even\n118.9,1,even\nabc,2,even\n44269.8,5/3,odd';
	await page.getByLabel('CSV file', { exact: true }).setInputFiles(csv('bad-levels.csv', bad));
	await page.getByRole('button', { name: 'Preview', exact: true }).click();
	const problems = page.getByTestId('upload-problems');
	await expect(problems).toContainText('energy "abc" must be a number of cm⁻¹');
	await expect(problems.locator('tr').nth(1)).toContainText('3');
	await expect(problems).toContainText('J "5/3" must be 0, 1, 2, … or a half-integer');
	await expect(page.getByTestId('upload-preview')).toContainText('2 problems — nothing can be saved');
	await expect(page.getByTestId('save-list')).toHaveCount(0);
	await shot(page, 'lists-upload-refused');
	// Saving the bad file directly is refused the same way.
	await page.getByLabel('CSV file', { exact: true }).setInputFiles(csv('bad-levels.csv', bad));
	await page.getByRole('button', { name: 'Save without preview' }).click();
	await expect(page.getByTestId('file-error')).toContainText('Nothing was saved: the level file has 2 problems');
	expect((await (await page.request.get(`/api/v1/projects/${projectId}/level-lists`)).json()).levelLists).toEqual([]);
	await expect(page.getByTestId('levels-lists')).toContainText('No level list yet');

	// The demo level list: preview shows the first rows as they will be saved, then Save.
	await page.getByLabel('Name').first().fill('Demo levels');
	await page.getByLabel('CSV file', { exact: true }).setInputFiles(csv('demo-levels.csv', DEMO_LEVEL_UPLOAD));
	await page.getByRole('button', { name: 'Preview', exact: true }).click();
	const first = page.getByTestId('upload-first-rows');
	await expect(page.getByTestId('upload-preview')).toContainText('12 levels read, no problem');
	await expect(first.locator('tbody tr').nth(6)).toContainText('44310.35');
	await expect(first.locator('tbody tr').nth(6)).toContainText('3P°');
	await shot(page, 'lists-upload-preview');
	await page.getByTestId('save-list').click();
	await expect(page.getByTestId('list-saved')).toContainText('Saved the level list “Demo levels” (12 levels)');
	await expect(page.getByTestId('levels-lists')).toContainText('Demo levels');

	await page.getByLabel('lines', { exact: true }).check();
	await page.getByLabel('Name').first().fill('Demo lines');
	await page.getByLabel('CSV file', { exact: true }).setInputFiles(csv('demo-lines.csv', DEMO_LINE_UPLOAD));
	await page.getByRole('button', { name: 'Preview', exact: true }).click();
	await expect(page.getByTestId('upload-preview')).toContainText('21 lines read, no problem');
	await page.getByTestId('save-list').click();
	await expect(page.getByTestId('list-saved')).toContainText('Saved the line list “Demo lines” (21 lines)');
	await shot(page, 'lists-saved');

	// The project matcher on the two saved lists.
	await page.getByRole('link', { name: 'Open the Line matcher' }).click();
	await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/matcher$`));
	await page.getByLabel('Level list').selectOption({ label: 'Demo levels (12)' });
	await page.getByLabel('Line list').selectOption({ label: 'Demo lines (21)' });
	await page.getByRole('button', { name: 'Match', exact: true }).click();
	await expect(page.getByTestId('matcher-summary')).toContainText('of 21 lines have candidates');
	const line1 = page.locator('tr[data-line="1"]').first();
	await expect(line1).toContainText('2256.111');
	await line1.getByLabel(/^Note on/).fill('clean line on the invented plate');
	await line1.getByRole('button', { name: /^Accept/ }).click();
	await expect(page.locator('tr[data-line="1"] [data-verdict="accepted"]')).toHaveCount(1);
	await expect(page.locator('tr[data-line="1"] [data-verdict="accepted"]')).toContainText('Lena Lists — clean line on the invented plate');
	await expect(page.getByTestId('matcher-summary')).toContainText('1 identified');
	// The accepted line is drawn between its two levels in the Grotrian picture.
	await expect(page.getByRole('img', { name: /Grotrian diagram: 12 levels in 6 term columns, 1 lines drawn / })).toBeVisible();
	await shot(page, 'lists-project-matcher');

	// Exports: the identified line with its levels, and the predicted lines nobody observed.
	const identified = await page.request.get((await page.getByTestId('export-identified-csv').getAttribute('href'))!);
	expect(identified.status()).toBe(200);
	const rows = (await identified.text()).trim().split(/\r?\n/);
	expect(rows[0]).toMatch(/^line,wavelength,unit,medium/);
	expect(rows).toHaveLength(2);
	expect(rows[1]).toMatch(/^1,2256\.111,A,air,/);
	expect(rows[1]).toContain('clean line on the invented plate');
	const unobserved = await page.request.get((await page.getByTestId('export-unobserved-csv').getAttribute('href'))!);
	expect(unobserved.status()).toBe(200);
	expect(await unobserved.text()).toMatch(/^lower,upper,type,ritz_wavenumber_cm-1/);

	// A tolerance too tight for that pair: the verdict is still shown under its line, marked as outside these settings.
	await page.getByLabel('Tolerance').selectOption('cm-1');
	await page.getByLabel('Fixed value').fill('0.001');
	await page.getByRole('button', { name: 'Match', exact: true }).click();
	await expect(page.locator('tr[data-line="1"][data-outside="true"]')).toContainText('clean line on the invented plate');
	await page.goBack();
	await expect(page.locator('tr[data-line="1"] [data-verdict="accepted"]')).toHaveCount(1);

	// The viewer: the same verdict, no buttons, no upload form; the API refuses a verdict.
	const v = viewer.page;
	await v.goto(page.url());
	await expect(v.locator('tr[data-line="1"] [data-verdict="accepted"]')).toContainText('clean line on the invented plate');
	await expect(v.getByRole('button', { name: /^Accept/ })).toHaveCount(0);
	await expect(v.getByText('Your role here is viewer')).toBeVisible();
	await v.goto(`/projects/${projectId}/lists`);
	await expect(v.getByTestId('lines-lists')).toContainText('Demo lines');
	await expect(v.getByLabel('CSV file', { exact: true })).toHaveCount(0);
	const refused = await v.request.put(`/api/v1/projects/${projectId}/identifications`, {
		data: { lineId: 1, upperLevelId: 1, lowerLevelId: 2, type: 'E1', status: 'rejected' }
	});
	expect(refused.status()).toBe(403);
	await context.close();
	await viewer.context.close();
});
