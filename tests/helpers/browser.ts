// Debian's Chromium through playwright-core, with the flags this machine and CI need.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtemp, rm } from 'node:fs/promises';
import { mkdirSync } from 'node:fs';
import { afterAll, beforeAll } from 'vitest';
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

/** Where the browser tests save their screenshots, and the two widths every screen is looked at. */
export const SHOTS = 'screenshots';
export const PHONE = { width: 360, height: 780 };
export const DESKTOP = { width: 1280, height: 800 };

/**
 * One Chromium context for a test file: registers the file's beforeAll (launch, and the screenshot
 * folder) and afterAll (close). Read `.context` inside tests and hooks.
 */
export function browserPerFile(): { readonly context: BrowserContext } {
	const holder: { context: BrowserContext } = { context: undefined as unknown as BrowserContext };
	let close: (() => Promise<void>) | undefined;
	beforeAll(async () => {
		mkdirSync(SHOTS, { recursive: true });
		({ context: holder.context, close } = await launchBrowser());
	});
	afterAll(async () => close?.());
	return holder;
}

/** Full-page screenshots `SHOTS/<name>-desktop.png` and `-phone.png`; the page is left at desktop width. */
export async function shootBoth(page: Page, name: string): Promise<void> {
	for (const [label, size] of [['desktop', DESKTOP], ['phone', PHONE]] as const) {
		await page.setViewportSize(size);
		await page.screenshot({ path: `${SHOTS}/${name}-${label}.png`, fullPage: true });
	}
	await page.setViewportSize(DESKTOP);
}
