// The learner's day in Chromium at phone width (360 px): placement and a daily set with feedback and a
// highlighted diagram, the answer history and the progress page; a short mock exam; a bench fault.
// Each flow signs up a fresh learner, so runs never depend on each other.
import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { APP_URL } from '../helpers/app';
import { browserPerFile, openPage, DESKTOP, PHONE, SHOTS } from '../helpers/browser';

const browser = browserPerFile();

async function shoot(page: Page, name: string, desktop = false) {
	await page.screenshot({ path: `${SHOTS}/learner-${name}-phone.png`, fullPage: true });
	if (desktop) {
		await page.setViewportSize(DESKTOP);
		await page.screenshot({ path: `${SHOTS}/learner-${name}-desktop.png`, fullPage: true });
		await page.setViewportSize(PHONE);
	}
}

/** No horizontal scrolling at 360 px, except inside the diagram's own pan area. */
async function expectNoSideScroll(page: Page) {
	const over = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
	expect(over, 'the page scrolls sideways').toBeLessThanOrEqual(1);
}

async function signUp(page: Page, label: string) {
	await page.setViewportSize(PHONE);
	await openPage(page, `${APP_URL}/signup`);
	await page.getByLabel('Your name').fill('Ilse Marwood');
	await page.getByLabel('E-mail').fill(`${label}-${randomBytes(3).toString('hex')}@harrowcreek.example`);
	await page.getByLabel('Password').fill('a long learner password');
	await page.getByRole('button', { name: 'Create account' }).click();
	await page.waitForURL(`${APP_URL}/home`);
}

/** Gives some complete answer with the controls of the item's kind (right or wrong; the server decides). */
async function answerShownItem(page: Page) {
	const fieldset = page.locator('fieldset.answer');
	await fieldset.waitFor();
	const kind = await fieldset.getAttribute('data-kind');
	if (kind === 'numeric') await fieldset.locator('input').fill('12');
	else if (kind === 'choose-one' || kind === 'choose-all') await fieldset.locator('label.option').first().click();
	else if (kind === 'select-diagram') await page.locator('svg [data-item]').first().dispatchEvent('click');
	else if (kind === 'predict-works') {
		const groups = fieldset.locator('[role="radiogroup"]');
		for (let i = 0; i < (await groups.count()); i++) await groups.nth(i).locator('label.option').first().click();
	} else if (kind === 'claim-check') {
		const groups = fieldset.locator('[role="radiogroup"]');
		for (let i = 0; i < (await groups.count()); i++) await groups.nth(i).locator('label.option').first().click();
	} else if (kind === 'next-test') {
		const point = fieldset.locator('select[name="point"]');
		const first = await point.locator('option:not([disabled])').first().getAttribute('value');
		await point.selectOption(first!);
	}
	const submit = page.getByTestId('submit-answer');
	await expect.poll(() => submit.isEnabled()).toBe(true);
	// The answer button sits within a thumb's reach: in the bottom part of a phone screen.
	const box = await submit.boundingBox();
	expect(box!.y + box!.height).toBeGreaterThan(PHONE.height * 0.6);
	expect(box!.height).toBeGreaterThanOrEqual(44);
	await submit.click();
	return kind;
}

describe('the learner’s day at 360 px', () => {
	it('places a new learner, runs a daily set with feedback, and shows the history and progress', async () => {
		const page = await browser.context.newPage();
		await signUp(page, 'placement');
		await expect.poll(() => page.getByTestId('today').textContent()).toContain('placement set of 12');
		await shoot(page, 'home', true);
		await page.getByTestId('start-set').click();
		await page.waitForURL(`${APP_URL}/learn`);
		const kinds: string[] = [];
		for (let i = 0; i < 12; i++) {
			await page.locator('fieldset.answer').waitFor();
			if (i === 0) {
				await expectNoSideScroll(page);
				await shoot(page, 'placement-item', true);
			}
			kinds.push((await answerShownItem(page))!);
			const feedback = page.getByTestId('feedback');
			await feedback.waitFor();
			if (i === 0) {
				// The feedback draws the diagram in overlay mode with the path or fault highlighted.
				expect(await feedback.locator('svg').count()).toBeGreaterThan(0);
				await shoot(page, 'feedback', true);
			}
			expect(await feedback.getByText('Expected:').count()).toBe(1);
			const next = page.getByTestId('next-item');
			if (i === 11) expect(await next.textContent()).toContain('Start my daily set');
			await next.click();
		}
		// The placement covers several kinds of item.
		expect(new Set(kinds).size).toBeGreaterThan(1);
		// Now the daily set: right after placement nothing is due yet, so it is new skills, nearest the success band.
		await expect.poll(async () => (await page.locator('fieldset.answer').count()) + (await page.getByTestId('set-done').count())).toBeGreaterThan(0);
		expect(await page.locator('h1').textContent()).toContain('Today’s set');
		let daily = 0;
		while ((await page.locator('fieldset.answer').count()) > 0 && daily < 3) {
			if (daily === 0) await shoot(page, 'daily-item');
			await answerShownItem(page);
			await page.getByTestId('feedback').waitFor();
			daily++;
			await page.getByTestId('next-item').click();
			await expect.poll(async () => (await page.locator('fieldset.answer').count()) + (await page.getByTestId('set-done').count())).toBeGreaterThan(0);
		}

		expect(daily).toBeGreaterThan(0);

		await openPage(page, `${APP_URL}/learn/history`);
		const rows = page.getByTestId('history').locator('li');
		expect(await rows.count()).toBe(12 + daily);
		await expectNoSideScroll(page);
		await shoot(page, 'history', true);

		await openPage(page, `${APP_URL}/learn/settings`);
		const exam = new Date(Date.now() + 40 * 86_400_000).toISOString().slice(0, 10);
		await page.getByLabel('Exam date').fill(exam);
		await page.getByRole('button', { name: 'Save' }).click();
		await expect.poll(() => page.getByRole('status').textContent()).toContain('saved');
		await shoot(page, 'settings');

		await openPage(page, `${APP_URL}/progress`);
		await page.locator('canvas').first().waitFor();
		const summary = await page.getByTestId('progress-summary').textContent();
		expect(summary).toMatch(/Streak\s*1 day/);
		expect(summary).toMatch(/Days to the exam\s*(39|40)/);
		// Ability, reviews due, accuracy and minutes: one chart each.
		await expect.poll(() => page.locator('canvas').count()).toBe(4);
		// Chart.js sizes each canvas when it has drawn it.
		await expect.poll(() => page.evaluate(() => [...document.querySelectorAll('canvas')].every((c) => c.style.display === 'block'))).toBe(true);
		await expectNoSideScroll(page);
		await shoot(page, 'progress', true);
	}, 240_000);

	it('runs a short mock exam with no feedback until the report', async () => {
		const page = await browser.context.newPage();
		await signUp(page, 'exam');
		await openPage(page, `${APP_URL}/exam`);
		await page.getByLabel('Questions').fill('5');
		await page.getByLabel('Minutes').fill('5');
		await shoot(page, 'exam-start', true);
		await page.getByTestId('start-exam').click();
		await page.getByTestId('exam-clock').waitFor();
		for (let i = 0; i < 5; i++) {
			await expect.poll(() => page.getByTestId('exam-position').textContent()).toContain(`Question ${i + 1} of 5`);
			if (i === 0) {
				expect(await page.getByTestId('exam-clock').textContent()).toMatch(/^[45]:\d\d$/);
				await shoot(page, 'exam-item');
			}
			await answerShownItem(page);
			// No feedback during the exam.
			expect(await page.getByTestId('feedback').count()).toBe(0);
		}
		await page.waitForURL(/\/exam\/\d+$/);
		const report = page.getByTestId('exam-report');
		await report.waitFor();
		expect(await report.textContent()).toMatch(/\d \/ 5/);
		expect(await page.getByTestId('readiness').textContent()).toContain('our own cut score');
		await expectNoSideScroll(page);
		await shoot(page, 'exam-report', true);
	}, 120_000);
});

describe('the bench at 360 px', () => {
	it('hides a fault, takes readings from the server and names the fault', async () => {
		const page = await browser.context.newPage();
		await signUp(page, 'bench');
		await openPage(page, `${APP_URL}/bench`);
		await shoot(page, 'bench-list', true);
		// The bank's circuits come one per circuit source: a family's many variants are one entry, not a wall of equal titles.
		const titles = await page.getByTestId('bench-bank-list').getByTestId('bench-title').allTextContents();
		expect(titles.length).toBeGreaterThan(5);
		expect(new Set(titles).size).toBe(titles.length);
		await openPage(page, `${APP_URL}/bench/horn-relay`);
		await page.locator('svg').first().waitFor();
		await expectNoSideScroll(page);
		await shoot(page, 'bench-free', true);
		await page.getByTestId('hide-fault').click();
		await page.waitForURL(/\/bench\/challenge\/[\w-]+$/);
		// The page never carries the hidden fault's identity beyond the list of candidates.
		const html = await page.content();
		expect(html).not.toMatch(/"fault":"/);
		await page.getByTestId('complaint').waitFor();
		for (let i = 0; i < 2; i++) {
			await page.getByTestId('take-reading').click();
			await expect.poll(() => page.getByTestId('readings').locator('li').count()).toBe(i + 1);
		}
		expect(await page.getByTestId('readings').textContent()).toMatch(/-?\d+\.\d\d V|Dead short/);
		const guess = page.getByTestId('fault-guess');
		const firstFault = await guess.locator('option:not([disabled])').first().getAttribute('value');
		await guess.selectOption(firstFault!);
		await page.getByTestId('name-fault').click();
		const verdict = page.getByTestId('verdict');
		await verdict.waitFor();
		expect(await verdict.textContent()).toMatch(/You took 2 readings; the engine's next-best-test strategy needs \d+/);
		await expectNoSideScroll(page);
		await shoot(page, 'bench-challenge', true);
	}, 120_000);
});
