import { type Page } from '@playwright/test';
import { expect, newUser, shot, test } from './helpers';
import { INVENTED_3D2_OBSERVED } from './fixtures/invented-3d2';

/*
 * Parameter sets and fit reports on a Shelf entry, in the browser, on the invented 3d² ion of
 * tests/fixtures/invented-3d2.ts (its five levels from Racah's B = 800, C = 3200 cm⁻¹, ζ = 0; sources
 * there). A fit of E_av, F² and F⁴ to them has 5 − 3 = 2 degrees of freedom and an rms of 0 (the data are exact).
 */
const OBSERVED = INVENTED_3D2_OBSERVED;

async function solverReady(page: Page) {
	await page.getByTestId('open-solver').click();
	await expect(page.locator('[data-testid="energy-levels"] tbody tr')).toHaveCount(9);
}

test('an editor saves parameters with a 3d2 entry, fits its five annotated levels, sees rms and residuals, exports; a viewer only looks', async ({
	browser
}) => {
	const viewer = await newUser(browser, 'Vic Viewer', 'params-viewer');
	const { page } = await newUser(browser, 'Edda Editor', 'params-editor');
	await page.getByLabel('Name').fill('Invented ions');
	await page.getByRole('button', { name: 'Create project' }).click();
	await expect(page.getByRole('heading', { name: 'Invented ions' })).toBeVisible();
	const projectId = page.url().split('/').pop()!;
	const added = await page.request.post(`/api/v1/projects/${projectId}/members`, { data: { email: viewer.email, role: 'viewer' } });
	expect(added.ok()).toBe(true);
	const created = await page.request.post(`/api/v1/projects/${projectId}/shelf`, { data: { title: 'Invented 3d2 ion', notation: '3d2' } });
	const entryId = (await created.json()).entry.id;
	for (const [levelKey, energy] of OBSERVED) {
		const put = await page.request.put(`/api/v1/projects/${projectId}/shelf/${entryId}/annotations`, {
			data: { levelKey, observedEnergy: String(energy), uncertainty: '1', status: 'proposed', comment: 'invented' }
		});
		expect(put.ok()).toBe(true);
	}
	const entryUrl = `/projects/${projectId}/shelf/${entryId}`;
	await page.goto(entryUrl);
	const panel = page.getByTestId('entry-energy');
	await expect(panel).toContainText('5 annotated energies to fit');
	await expect(page.getByTestId('no-parameter-sets')).toBeVisible();

	// The solver for the entry's configuration; spin–orbit off, as in the invented data.
	await solverReady(page);
	await page.getByTestId('param-zeta(3d)').fill('0');
	await page.getByTestId('params-name').fill('start, ζ = 0');
	await page.getByTestId('params-save').click();
	await expect(page.getByTestId('params-saved')).toContainText('Saved as “start, ζ = 0” (version 1)');
	await expect(page.getByTestId('parameter-set')).toHaveCount(1);

	// The fit's list starts from the entry's notes; ζ stays fixed.
	await expect(page.getByTestId('fit-observed')).toHaveValue(/^2 0 1 3F\n/);
	await page.getByRole('checkbox', { name: 'zeta(3d)' }).uncheck();
	await page.getByTestId('fit-run').click();
	await expect(page.getByTestId('fit-saved')).toContainText('fitted to its annotated energies');
	const live = page.locator('section[aria-label="Fit to observed levels"]');
	await expect(live.getByTestId('fit-rms')).toHaveText('0.00');
	await expect(live.getByTestId('fit-residual')).toHaveCount(5);
	await expect(live.getByRole('table', { name: 'Fitted parameters' })).toContainText('61600.0');
	const saved = page.getByTestId('saved-fit');
	await expect(saved).toHaveCount(1);
	await expect(saved).toContainText('5 levels, the annotated energies');
	await expect(saved).toContainText('2 degrees of freedom');
	await shot(page, 'entry-energy-panel');
	await saved.scrollIntoViewIfNeeded();
	await shot(page, 'entry-fit-report');

	// Exports of the saved report.
	const [download] = await Promise.all([page.waitForEvent('download'), saved.getByRole('link', { name: 'CSV' }).click()]);
	expect(download.suggestedFilename()).toMatch(/^fit_levels_3d2_\d{4}_\d\d_\d\d\.csv$/);
	const tex = await page.request.get(`${await saved.getByRole('link', { name: 'LaTeX' }).getAttribute('href')}`);
	expect(await tex.text()).toContain('$F^{2}(3d,3d)$ & $61600.00$');
	const json = await (await page.request.get(`${await saved.getByRole('link', { name: 'JSON' }).getAttribute('href')}`)).json();
	expect(json).toMatchObject({ configuration: '3d2', fitted_by: 'Edda Editor', degrees_of_freedom: 2 });

	// The viewer sees the set and the report, opens the set, but has no save or fit controls.
	const v = viewer.page;
	await v.goto(entryUrl);
	await expect(v.getByTestId('parameter-set')).toContainText('start, ζ = 0');
	await expect(v.getByTestId('saved-fit')).toContainText('rms 0.00 cm⁻¹');
	await v.getByTestId('open-set').click();
	await expect(v.locator('[data-testid="energy-levels"] tbody tr')).toHaveCount(9);
	await expect(v.getByTestId('energy-preset')).toHaveValue(/^saved:/);
	await expect(v.getByTestId('param-zeta(3d)')).toHaveValue('0');
	await expect(v.getByTestId('params-save')).toHaveCount(0);
	await expect(v.getByTestId('fit-run')).toHaveCount(0);
	const refused = await v.request.post(`/api/v1/projects/${projectId}/shelf/${entryId}/fits`, { data: { parameters: {}, vary: ['Eav'] } });
	expect(refused.status()).toBe(403);
	await shot(v, 'entry-energy-viewer');
});

test('a long computation shows its progress and a Cancel that aborts the request', async ({ page }) => {
	// The answer is held back, so the computation is "long" however fast this machine is.
	let asked = 0;
	await page.route('**/api/v1/energies', async (route) => {
		asked++;
		await new Promise((resolve) => setTimeout(resolve, 5000));
		await route.continue().catch(() => {});
	});
	const aborted = page.waitForEvent('requestfailed', (r) => r.url().endsWith('/api/v1/energies'));
	await page.goto('/builder?config=4f7');
	await page.getByRole('tab', { name: 'Energy solver' }).click();
	const progress = page.getByTestId('energy-progress');
	await expect(progress).toContainText('Computing the levels of 4f7');
	await expect(progress).toContainText(/· \d+ s/);
	await shot(page, 'energy-progress');
	await page.getByTestId('energy-progress-cancel').click();
	expect((await aborted).failure()?.errorText).toMatch(/ABORTED|cancel/i);
	await expect(progress).toHaveCount(0);
	await expect(page.getByTestId('energy-cancelled')).toBeVisible();
	expect(asked).toBe(1);
});
