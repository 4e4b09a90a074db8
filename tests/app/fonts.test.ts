import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { APP_URL } from '../helpers/app';
import { launchBrowser, openPage } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../src/lib/server/seed/demo';

let context: BrowserContext;
let close: () => Promise<void>;
beforeAll(async () => ({ context, close } = await launchBrowser()));
afterAll(async () => close?.());

describe('the built app serves everything itself', () => {
	it('loads its fonts from 127.0.0.1 and requests nothing elsewhere', async () => {
		const requests: string[] = [];
		const fonts: { url: string; status: number }[] = [];
		context.on('request', (r) => requests.push(r.url()));
		context.on('response', (r) => {
			if (r.url().endsWith('.woff2')) fonts.push({ url: r.url(), status: r.status() });
		});

		const page = await context.newPage();
		await openPage(page, APP_URL);
		await page.evaluate(() => document.fonts.ready);
		await openPage(page, `${APP_URL}/signin`);
		await page.getByLabel('E-mail').fill('learner@harrowcreek.example');
		await page.getByLabel('Password').fill(DEMO_PASSWORD);
		await page.getByRole('button', { name: 'Sign in' }).click();
		await page.waitForURL(`${APP_URL}/home`);
		await page.evaluate(() => document.fonts.ready);

		const families = await page.evaluate(() =>
			[...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.family.replaceAll('"', ''))
		);
		expect(families).toEqual(expect.arrayContaining(['Source Sans 3', 'Merriweather', 'JetBrains Mono']));
		expect(fonts.length).toBeGreaterThan(0);
		for (const f of fonts) {
			expect(new URL(f.url).hostname).toBe('127.0.0.1');
			expect(f.status).toBe(200);
		}
		const elsewhere = requests.filter((u) => !u.startsWith(`${APP_URL}/`) && !u.startsWith('data:'));
		expect(elsewhere).toEqual([]);
		await page.close();
	});
});
