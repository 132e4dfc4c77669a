import { readFileSync, writeFileSync } from 'node:fs';
import { addEntry, createProject, expect, newUser, shot, test } from './helpers';

test('an owner downloads a project backup and restores it as a new project; a damaged file is refused', async ({ browser }, info) => {
	const { page } = await newUser(browser, 'Bea Backup', 'backup-owner');
	const { projectUrl } = await createProject(page, 'Archive me');
	await addEntry(page, projectUrl, { title: 'N II ground', notation: '1s2 2s2 2p2' });

	await page.goto(projectUrl);
	const download = page.waitForEvent('download');
	await page.getByRole('link', { name: 'Download backup' }).click();
	const file = await (await download).path();
	const backup = JSON.parse(readFileSync(file!, 'utf8'));
	expect(backup).toMatchObject({ format: 'termwright-project', version: 2, project: { name: 'Archive me' } });
	expect(backup.entries.map((e: { title: string }) => e.title)).toEqual(['N II ground']);

	// A damaged copy (cut short) is refused with a message; nothing is created.
	const damaged = info.outputPath('damaged.json');
	writeFileSync(damaged, readFileSync(file!, 'utf8').slice(0, 200));
	await page.getByLabel('Restore a backup file as a new project').setInputFiles(damaged);
	await page.getByRole('button', { name: 'Restore as new project' }).click();
	await expect(page.getByRole('alert')).toContainText('not valid JSON');

	// The good file restores as a second project with the entry and the log.
	await page.getByLabel('Restore a backup file as a new project').setInputFiles(file!);
	await page.getByRole('button', { name: 'Restore as new project' }).click();
	const status = page.getByRole('status').filter({ hasText: 'Restored' });
	await expect(status).toContainText('1 Shelf entries');
	await shot(page, 'backup-restored');
	await status.getByRole('link', { name: 'Archive me' }).click();
	await expect(page).not.toHaveURL(projectUrl);
	await expect(page.getByText('N II ground')).toBeVisible();
	await page.getByRole('link', { name: 'Activity' }).click();
	await expect(page.getByRole('table', { name: 'Activity log' })).toContainText('restored the project from a backup');

	// Without JavaScript the form still works (progressive enhancement), from the Projects page.
	const plain = await browser.newContext({ javaScriptEnabled: false, storageState: await page.context().storageState() });
	const p2 = await plain.newPage();
	await p2.goto('/projects');
	await p2.getByLabel('Restore a backup file as a new project').setInputFiles(file!);
	await p2.getByRole('button', { name: 'Restore as new project' }).click();
	await expect(p2.getByRole('status').filter({ hasText: 'Restored' })).toContainText('Archive me');
});
