import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { APP_URL } from '../helpers/app';
import { browserPerFile, openPage, DESKTOP, PHONE, SHOTS, shootBoth, launchBrowser } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../src/lib/server/seed/demo';

const browser = browserPerFile();


async function signInWithForm(page: Page, email: string, password: string) {
	await openPage(page, `${APP_URL}/signin`);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(password);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL(`${APP_URL}/home`);
}

const newEmail = `newcomer-${randomBytes(3).toString('hex')}@harrowcreek.example`;
const newPassword = 'voltage drop under load';

describe('in the browser (Chromium)', () => {
	it('signs up, lands on the learner home, is refused the site-admin page, signs out', async () => {
		const page = await browser.context.newPage();
		await openPage(page, APP_URL);
		await expect.poll(() => page.getByRole('link', { name: 'Create an account' }).first().isVisible()).toBe(true);
		await shootBoth(page, 'landing');

		await openPage(page, `${APP_URL}/signup`);
		await page.getByLabel('E-mail').fill('petra@');
		await page.getByLabel('Password').fill('short');
		await page.getByRole('button', { name: 'Create account' }).click();
		await expect.poll(() => page.getByRole('alert').textContent()).toContain('Your account was not created yet');
		expect(await page.locator('#field-name-error').textContent()).toContain('Enter your name');
		expect(await page.locator('#field-email-error').textContent()).toContain('name@example.org');
		expect(await page.locator('#field-password-error').textContent()).toContain('at least 12');
		expect(await page.getByLabel('E-mail').inputValue()).toBe('petra@');
		await shootBoth(page, 'signup-errors');

		await page.getByLabel('Your name').fill('Petra Lindqvist-Moore');
		await page.getByLabel('E-mail').fill(newEmail);
		await page.getByLabel('Password').fill(newPassword);
		// The hidden time-zone field is filled from the browser's Intl (the context runs in America/Denver).
		await expect.poll(() => page.locator('input[name=timeZone]').inputValue()).toBe('America/Denver');
		await page.getByRole('button', { name: 'Create account' }).click();
		await page.waitForURL(`${APP_URL}/home`);
		await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Welcome, Petra');
		expect(await page.getByText('America/Denver').count()).toBeGreaterThan(0);
		expect(await page.getByRole('link', { name: 'People and roles' }).count()).toBe(0);
		await shootBoth(page, 'home');

		// On a phone the navigation folds into a menu.
		await page.setViewportSize(PHONE);
		expect(await page.getByRole('navigation', { name: 'Main' }).first().isVisible()).toBe(false);
		await page.getByText('Menu', { exact: true }).click();
		await expect.poll(() => page.locator('details nav').getByRole('link', { name: 'Profile' }).isVisible()).toBe(true);
		await page.screenshot({ path: `${SHOTS}/menu-phone.png` });
		await page.setViewportSize(DESKTOP);

		await openPage(page, `${APP_URL}/profile`);
		expect(await page.getByLabel('Time zone').inputValue()).toBe('America/Denver');
		await page.getByLabel('Time zone').selectOption('Europe/Berlin');
		await page.getByRole('button', { name: 'Save' }).click();
		await expect.poll(() => page.getByRole('status').textContent()).toContain('Your profile is saved.');
		expect(await page.getByLabel('Time zone').inputValue()).toBe('Europe/Berlin');
		await shootBoth(page, 'profile');

		const refused = await openPage(page, `${APP_URL}/admin/users`);
		expect(refused?.status()).toBe(403);
		expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Not for your account');
		await shootBoth(page, 'refused');

		await openPage(page, `${APP_URL}/home`);
		await page.getByRole('navigation', { name: 'Main' }).getByRole('button', { name: 'Sign out' }).first().click();
		await page.waitForURL(`${APP_URL}/`);
		const afterSignOut = await openPage(page, `${APP_URL}/home`);
		expect(new URL(page.url()).pathname).toBe('/signin');
		expect(afterSignOut?.status()).toBe(200);
		await shootBoth(page, 'signin');
		await page.close();
	});

	it('shows a wrong password message on the sign-in form and keeps the e-mail', async () => {
		const page = await browser.context.newPage();
		await openPage(page, `${APP_URL}/signin`);
		await page.getByLabel('E-mail').fill(newEmail);
		await page.getByLabel('Password').fill('not my password at all');
		await page.getByRole('button', { name: 'Sign in' }).click();
		await expect.poll(() => page.getByRole('alert').textContent()).toContain('do not match an account');
		expect(await page.getByLabel('E-mail').inputValue()).toBe(newEmail);
		expect(await page.getByLabel('Password').inputValue()).toBe('');
		await page.close();
	});

	it('lets a site admin grant the author role', async () => {
		const page = await browser.context.newPage();
		await signInWithForm(page, 'siteadmin@harrowcreek.example', DEMO_PASSWORD);
		await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'People and roles' }).first().click();
		await page.waitForURL(`${APP_URL}/admin/users`);
		await page.getByLabel('Search').fill(newEmail);
		await page.getByRole('button', { name: 'Search' }).click();
		await page.waitForURL((url) => url.searchParams.get('q') === newEmail);
		const row = page.locator(`li[data-email="${newEmail}"]`);
		await expect.poll(() => row.count()).toBe(1);
		await row.getByRole('combobox').selectOption('author');
		await row.getByRole('button', { name: 'Grant' }).click();
		await expect.poll(() => row.getByRole('list', { name: /Roles of/ }).textContent()).toContain('Author');
		await shootBoth(page, 'people-and-roles');

		// The new author sees it too, after signing in.
		const second = await launchBrowser();
		const p2 = await second.context.newPage();
		await signInWithForm(p2, newEmail, newPassword);
		expect(await p2.getByRole('list', { name: 'Your roles' }).textContent()).toContain('Author');
		await second.close();
		await page.close();
	});
});
