// Browser test of /progress in Debian's Chromium, signed in as the demo learner: one chart per measure
// (accuracy and minutes are two charts, not one with two y-axes), every axis titled with what it shows and
// its unit (read from each chart's accessible name), no sideways scrolling at 360 px, screenshots at
// 1280 and 360 px.
import { describe, expect, it } from 'vitest';
import { APP_URL, demoAccount } from '../helpers/app';
import { browserPerFile, openPage, SHOTS } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../src/lib/server/seed/demo';

const browser = browserPerFile();

// What each chart's axes must say: a quantity and its unit (common practice: a chart axis is labelled with
// the quantity and the unit it is measured in).
const EXPECTED: Record<string, string[]> = {
	'Ability per content area over time': ['x: Learning day (month-day)', 'y: Ability, logits'],
	'Reviews due on each of the next 14 days': ['x: Learning day (month-day)', 'y: Reviews due, count'],
	'Accuracy per day, percent right': ['x: Learning day (month-day)', 'y: Accuracy, % right'],
	'Minutes spent answering per day': ['x: Learning day (month-day)', 'y: Minutes']
};

describe('the progress page', () => {
	it('titles every axis with its unit and reads at 1280 and 360 px', async () => {
		const page = await browser.context.newPage();
		await page.setViewportSize({ width: 1280, height: 800 });
		await openPage(page, `${APP_URL}/signin`);
		await page.getByLabel('E-mail').fill(demoAccount('learner').email);
		await page.getByLabel('Password').fill(DEMO_PASSWORD);
		await page.getByRole('button', { name: /sign in/i }).click();
		await page.waitForURL(/\/(home|learn)/);
		for (const width of [1280, 360]) {
			await page.setViewportSize({ width, height: 800 });
			await openPage(page, `${APP_URL}/progress`);
			const canvases = page.locator('canvas');
			await expect.poll(() => canvases.count()).toBe(4);
			const labels = await canvases.evaluateAll((cs) => cs.map((c) => c.getAttribute('aria-label') ?? ''));
			for (const [name, axes] of Object.entries(EXPECTED)) {
				const label = labels.find((l) => l.startsWith(name));
				expect(label, `a chart named "${name}"`).toBeDefined();
				for (const a of axes) expect(label).toContain(a);
				// One y-axis per chart.
				expect(label!.match(/\by1?:/g)).toHaveLength(1);
			}
			const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
			expect(over, 'the page scrolls sideways').toBeLessThanOrEqual(1);
			// Chart.js draws after mount; give it a frame before the picture.
			await page.waitForTimeout(300);
			await page.screenshot({ path: `${SHOTS}/progress-${width === 360 ? 'phone' : 'desktop'}.png`, fullPage: true });
		}
	}, 60_000);
});
