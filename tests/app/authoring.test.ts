// The authoring and review workflow in Chromium: the demo author writes an item, previews the engine's
// key, saves and submits it; the demo reviewer finds it in the queue and approves it; it is published.
import { describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import type { Page } from 'playwright-core';
import { APP_URL, demoAccount, signIn as signInHttp } from '../helpers/app';
import { browserPerFile, openPage, shootBoth } from '../helpers/browser';
import { DEMO_PASSWORD } from '../../src/lib/server/seed/demo';

const browser = browserPerFile();


async function signIn(page: Page, email: string) {
	await browser.context.clearCookies();
	await openPage(page, `${APP_URL}/signin`);
	await page.getByLabel('E-mail').fill(email);
	await page.getByLabel('Password').fill(DEMO_PASSWORD);
	await page.getByRole('button', { name: 'Sign in' }).click();
	await page.waitForURL((u) => !u.pathname.startsWith('/signin'));
}

const id = `browser-${randomBytes(3).toString('hex')}`;
// cooling-fan-relay.yaml with S1 open (cold): no coil current, no drop across the coil, so point B reads
// the battery's 12.6 V (docs/item-format.md's hand-worked example; common practice).
const source = `---
id: ${id}
area: diagrams-paths
skill: point-readings
kind: numeric
circuit: content/circuits/cooling-fan-relay.yaml
ask: { volts: B, state: cold }
---
With the engine cold, what does a meter read from point B to ground?

## Explanation

With the temperature switch open no current flows through the coil, so B sits at battery volts.
`;

describe('writing and reviewing an item (Chromium)', () => {
	it('the author writes, previews, saves and submits; the reviewer approves; the item is published', async () => {
		const page = await browser.context.newPage();
		await signIn(page, 'author@harrowcreek.example');
		await openPage(page, `${APP_URL}/author`);
		await page.getByRole('link', { name: 'New item' }).click();
		await page.waitForURL(`${APP_URL}/author/items/new`);
		await page.waitForSelector('.cm-content');
		const key = page.getByTestId('preview-key');
		// The template asks for point C with the fan running; its key is not 12.6 V.
		await expect.poll(() => key.textContent()).not.toContain('12.6 V');

		await page.locator('.cm-content').click();
		await page.keyboard.press('ControlOrMeta+a');
		await page.keyboard.press('Delete');
		await page.keyboard.insertText(source);
		await expect.poll(() => key.textContent(), { timeout: 15_000 }).toContain('12.6 V');
		await expect.poll(() => page.locator('.item-preview').textContent()).toContain(id);
		await shootBoth(page, 'item-editor');

		await page.getByRole('button', { name: 'Save draft' }).click();
		await page.waitForURL(`${APP_URL}/author/items/${id}?saved=1`);
		await expect.poll(() => page.getByTestId('item-status').textContent()).toBe('draft');
		await page.getByRole('button', { name: 'Submit for review' }).click();
		await page.waitForURL(`${APP_URL}/author/items/${id}?submitted=1`);
		await expect.poll(() => page.getByTestId('item-status').textContent()).toBe('in review');

		await signIn(page, 'reviewer@harrowcreek.example');
		await openPage(page, `${APP_URL}/review`);
		const queued = page.locator(`[data-item="${id}"]`);
		await expect.poll(() => queued.count()).toBe(1);
		await shootBoth(page, 'review-queue');
		await queued.getByRole('link', { name: id }).click();
		await page.waitForURL(`${APP_URL}/review/items/${id}`);
		await expect.poll(() => page.getByTestId('key-check').textContent()).toContain('it matches');
		await page.getByRole('button', { name: 'Approve and publish' }).click();
		await page.waitForURL(`${APP_URL}/review`);
		await expect.poll(() => page.locator(`[data-item="${id}"]`).count()).toBe(0);

		await openPage(page, `${APP_URL}/review/items/${id}`);
		await expect.poll(() => page.getByTestId('version-status').textContent()).toBe('published');
		await signIn(page, 'author@harrowcreek.example');
		await openPage(page, `${APP_URL}/author?status=published`);
		await expect.poll(() => page.locator(`[data-item="${id}"] [data-status]`).getAttribute('data-status')).toBe('published');
		await page.close();
	});

	it('uploads a .md file as a draft', async () => {
		const page = await browser.context.newPage();
		await signIn(page, 'author@harrowcreek.example');
		await openPage(page, `${APP_URL}/author/items/new`);
		const uploaded = `upload-${randomBytes(3).toString('hex')}`;
		await page.getByLabel('Or upload a .md item file').setInputFiles({ name: `${uploaded}.md`, mimeType: 'text/markdown', buffer: Buffer.from(source.replace(`id: ${id}`, `id: ${uploaded}`)) });
		await page.getByRole('button', { name: 'Upload as draft' }).click();
		await page.waitForURL(`${APP_URL}/author/items/${uploaded}?saved=1`);
		await expect.poll(() => page.getByTestId('item-status').textContent()).toBe('draft');

		await openPage(page, `${APP_URL}/author/items/new`);
		await page.getByLabel('Or upload a .md item file').setInputFiles({ name: 'notes.txt', mimeType: 'text/plain', buffer: Buffer.from('hello') });
		await page.getByRole('button', { name: 'Upload as draft' }).click();
		await expect.poll(() => page.getByRole('alert').first().textContent()).toContain('upload a .md file');
		await page.close();
	});
});

describe('POST /api/author/preview', () => {
	const post = async (body: string, cookie: string) => {
		const res = await fetch(`${APP_URL}/api/author/preview`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body });
		return { status: res.status, json: (await res.json()) as Record<string, any> };
	};

	it('answers the engine\'s key and tagged distractors, and errors with their lines', async () => {
		const cookie = await signInHttp(demoAccount('author').email);
		const ok = await post(JSON.stringify({ source }), cookie);
		expect(ok.status).toBe(200);
		expect(ok.json.ok).toBe(true);
		// 12.6 V at B with S1 open (docs/item-format.md's worked example; common practice).
		expect(ok.json.key).toContain('12.6 V');
		expect(ok.json.distractors.length).toBeGreaterThan(0);
		expect(ok.json.distractors.every((d: { tag: string }) => d.tag.length > 0)).toBe(true);
		expect(ok.json.svg).toContain('<svg');

		const bad = await post(JSON.stringify({ source: source.replace('{ volts: B, state: cold }', '{ volts: B, state: frozen }') }), cookie);
		expect(bad.status).toBe(200);
		expect(bad.json.ok).toBe(false);
		expect(bad.json.errors[0].line).toBe(7);
		expect(bad.json.errors[0].message).toContain('frozen');

		const notJson = await post('{source: oops', cookie);
		expect(notJson.status).toBe(400);
		expect(notJson.json.error.code).toBe('bad_json');
		expect(notJson.json.error.message).toContain('not JSON');
		const wrongShape = await post(JSON.stringify({ source: 42 }), cookie);
		expect(wrongShape.status).toBe(400);
		expect(wrongShape.json.error.fields.source).toBeTruthy();
	});
});
