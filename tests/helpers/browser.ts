// Debian's Chromium through playwright-core, with the flags this machine and CI need.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import path from 'node:path';

export const CHROMIUM = '/usr/bin/chromium';

export async function launchBrowser(): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
	const base = process.env.TMPDIR ?? path.resolve('.tmp');
	const userDataDir = await mkdtemp(path.join(base, 'chromium-'));
	const context = await chromium.launchPersistentContext(userDataDir, {
		executablePath: CHROMIUM,
		headless: true,
		args: [
			'--headless',
			'--no-sandbox',
			'--disable-gpu',
			'--disable-quic',
			'--no-first-run',
			'--disable-background-networking',
			'--disable-component-update',
			'--disable-sync'
		],
		viewport: { width: 1280, height: 800 },
		timezoneId: 'America/Denver'
	});
	return {
		context,
		close: async () => {
			await context.close();
			await rm(userDataDir, { recursive: true, force: true });
		}
	};
}

/** Opens a page and waits until the app has hydrated (the root layout sets html[data-ready]). */
export async function openPage(page: Page, url: string) {
	const response = await page.goto(url);
	await page.waitForSelector('html[data-ready="true"]', { state: 'attached' });
	return response;
}
