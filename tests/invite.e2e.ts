import { type Page } from '@playwright/test';
import {
	addEntry,
	caughtMailTo,
	createProject,
	expect,
	linkPath,
	newUser,
	PASSWORD,
	shot,
	test,
	uniqueEmail,
	waitForHydration
} from './helpers';

/**
 * Invitations and mail through the local SMTP catcher, in the built app: an owner invites a
 * colleague, the mail arrives in the catcher (read from its store, tests/helpers.ts), the colleague
 * opens the link as a new account and sees the project read-only; resend and revoke end earlier
 * links; a password reset goes through the catcher too. The activity log shows each step.
 * Expected outcomes are the product's rules (common practice, no source).
 */

async function projectWithEntry(page: Page, name: string) {
	const { projectUrl, projectId } = await createProject(page, name);
	const { entryUrl } = await addEntry(page, projectUrl, { title: 'Nitrogen-like ground', notation: '1s2 2s2 2p3' });
	return { projectUrl, projectId, entryUrl };
}

async function invite(page: Page, projectUrl: string, email: string, role: 'viewer' | 'editor' | 'owner') {
	await page.goto(`${projectUrl}/members`);
	await page.getByLabel('E-mail of their account, or the address to invite').fill(email);
	await page.locator('form[action="?/add"] select[name=role]').selectOption(role);
	await page.getByRole('button', { name: 'Add or invite' }).click();
	await expect(page.getByTestId('member-added')).toContainText(`an invitation to join was mailed to ${email}`);
}

test('an owner invites a colleague as viewer; the colleague signs up from the mailed link and reads the project only', async ({
	browser
}) => {
	const owner = await newUser(browser, 'Olga Owner', 'invite-owner');
	const { page } = owner;
	const { projectUrl, projectId, entryUrl } = await projectWithEntry(page, 'Invited nebula');

	const colleague = uniqueEmail('colleague');
	await invite(page, projectUrl, colleague, 'viewer');
	const pending = page.getByTestId('invitation-list').getByTestId('invitation');
	await expect(pending).toHaveCount(1);
	await expect(pending).toContainText(colleague);
	await expect(pending).toHaveAttribute('data-state', 'pending');
	await shot(page, 'invite-pending');

	// The mail as the catcher received it over SMTP.
	const mail = await caughtMailTo(colleague);
	expect(mail.sender).toBe('no-reply@termwright.localhost');
	expect(mail.subject).toBe('Olga Owner invites you to “Invited nebula” on Termwright');
	expect(mail.body).toContain('as a viewer');
	const link = linkPath(mail, 'invite');

	// A new browser, nobody signed in: the page offers an account for the invited address (fixed).
	const context = await browser.newContext();
	const guest = waitForHydration(await context.newPage());
	await guest.goto(link);
	await expect(guest.getByTestId('invitation-offer')).toContainText(
		`Olga Owner invites ${colleague} to the project “Invited nebula” as viewer`
	);
	const address = guest.getByLabel('E-mail');
	await expect(address).toHaveValue(colleague);
	await expect(address).toHaveAttribute('readonly', '');
	await shot(guest, 'invite-accept');
	await guest.getByLabel('Name').fill('Cora Colleague');
	await guest.getByLabel(/Password/).fill(PASSWORD);
	await guest.getByRole('button', { name: 'Create account and join' }).click();
	await expect(guest).toHaveURL(new RegExp(`/projects/${projectId}$`));

	// Read-only: the Shelf shows, no edit controls, and writes are refused with 403.
	await expect(guest.getByTestId('shelf-list')).toContainText('Nitrogen-like ground');
	await expect(guest.getByRole('link', { name: 'Add configuration' })).toHaveCount(0);
	await guest.goto(entryUrl);
	await expect(guest.getByTestId('entry-title')).toHaveText('Nitrogen-like ground');
	await expect(guest.getByText('Edit entry')).toHaveCount(0);
	const write = await guest.request.post(`/api/v1/projects/${projectId}/shelf`, { data: { title: 'Not mine', notation: '1s' } });
	expect(write.status()).toBe(403);
	expect((await write.json()).error.message).toMatch(/Your role here is viewer/);
	expect((await guest.goto(`${projectUrl}/shelf/new`))?.status()).toBe(403);
	await shot(guest, 'invite-joined-read-only');

	// The link worked once.
	await guest.goto(link);
	await expect(guest.getByTestId('invitation-refused')).toContainText('already been used');

	// The owner: the colleague is a member, nothing is pending, the log shows invited and joined.
	await page.goto(`${projectUrl}/members`);
	await expect(page.getByTestId('member-list')).toContainText('Cora Colleague');
	await expect(page.getByText('No open invitations.')).toBeVisible();
	await page.goto(`${projectUrl}/activity`);
	const log = page.getByRole('table', { name: 'Activity log' }).locator('tbody tr');
	await expect(log.nth(0)).toContainText('joined as viewer by invitation');
	await expect(log.nth(0)).toContainText('Cora Colleague');
	await expect(log.nth(1)).toContainText(`invited ${colleague} as viewer`);
	await expect(log.nth(1)).toContainText('Olga Owner');
	await shot(page, 'invite-activity');
	await context.close();
	await owner.context.close();
});

test('resend replaces the link, revoke ends it, and another account is told whose invitation it is', async ({ browser }) => {
	const owner = await newUser(browser, 'Otto Owner', 'invite-owner2');
	const { page } = owner;
	const { projectUrl } = await projectWithEntry(page, 'Resent nebula');
	const first = uniqueEmail('resent');
	await invite(page, projectUrl, first, 'editor');
	const oldLink = linkPath(await caughtMailTo(first), 'invite');
	await page.getByRole('button', { name: `Resend the invitation to ${first}` }).click();
	await expect(page.getByRole('status').filter({ hasText: 'A new link went to' })).toContainText(first);
	const newLink = linkPath(await caughtMailTo(first), 'invite');
	expect(newLink).not.toBe(oldLink);

	// Someone signed in with another address opens the new link.
	const other = await newUser(browser, 'Ulla Unrelated', 'invite-other');
	await other.page.goto(newLink);
	await expect(other.page.getByTestId('invitation-other-account')).toContainText(
		`This invitation is for ${first}, but you are signed in as ${other.email}`
	);
	await expect(other.page.getByRole('button', { name: /Join/ })).toHaveCount(0);
	await shot(other.page, 'invite-other-account');
	// The old link is gone; revoking ends the new one.
	await other.page.goto(oldLink);
	await expect(other.page.getByRole('alert')).toContainText('This invitation link is unknown');
	await page.getByRole('button', { name: `Revoke the invitation to ${first}` }).click();
	await expect(page.getByText('No open invitations.')).toBeVisible();
	await other.page.goto(newLink);
	await expect(other.page.getByTestId('invitation-refused')).toContainText('withdrawn');

	await page.goto(`${projectUrl}/activity`);
	const log = page.getByRole('table', { name: 'Activity log' }).locator('tbody tr');
	await expect(log.nth(0)).toContainText(`revoked the invitation to ${first} (editor)`);
	await expect(log.nth(1)).toContainText(`sent the invitation to ${first} again`);
	await expect(log.nth(2)).toContainText(`invited ${first} as editor`);
	await other.context.close();
	await owner.context.close();
});

test('a password reset goes through the catcher: the mailed link sets a new password', async ({ browser }) => {
	const { context, page, email } = await newUser(browser, 'Fritz Forgetful', 'invite-reset');
	await page.getByRole('button', { name: 'Sign out', exact: true }).click();
	await page.goto('/forgot');
	await page.getByLabel('E-mail').fill(email);
	await page.getByRole('button', { name: 'Send reset link' }).click();
	await expect(page.getByRole('status')).toContainText('If an account uses this e-mail');
	const mail = await caughtMailTo(email);
	expect(mail.subject).toBe('Reset your Termwright password');
	expect(mail.sender).toBe('no-reply@termwright.localhost');
	await page.goto(linkPath(mail, 'reset'));
	await page.getByLabel(/New password/).fill('reset-through-smtp');
	await page.getByRole('button', { name: 'Set password and sign in' }).click();
	await expect(page).toHaveURL(/\/account\?ended=reset/);
	await page.getByRole('button', { name: 'Sign out', exact: true }).click();
	await page.goto('/signin');
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill('reset-through-smtp');
	await page.getByRole('button', { name: 'Sign in' }).click();
	await expect(page).toHaveURL(/\/projects$/);
	await context.close();
});
