// Browser test of WiringDiagram.svelte in Debian's Chromium: accessible names, roving keyboard focus,
// the announced selection, 24 px targets on a 360 px phone, live mode against the engine, and an
// axe-core scan (no serious or critical violation). The component is built with Vite into a static
// page under .tmp/ and served on loopback, so the test needs neither the app nor its database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdirSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { build } from 'vite';
import { svelte } from '@sveltejs/vite-plugin-svelte';
import { launchBrowser } from '../helpers/browser';
import { parseCircuit, solveCircuit } from '../../src/lib/circuit/index';
import { readLayoutHints } from '../../src/lib/diagram/index';
import { loadCircuits } from '../../src/lib/server/content/circuits';

const ROOT = path.resolve('.');
const WORK = path.join(ROOT, '.tmp', 'diagram-e2e');
const DIST = path.join(WORK, 'dist');
const SHOTS = path.join(ROOT, 'screenshots');
const AXE = path.join(ROOT, 'node_modules/axe-core/axe.min.js');
const abs = (p: string) => JSON.stringify(path.join(ROOT, p));
const raw = (p: string) => JSON.stringify(`${path.join(ROOT, p)}?raw`);

const ENTRY = `
import { mount } from 'svelte';
import WiringDiagram from ${abs('src/lib/components/WiringDiagram.svelte')};
import { readDiagramCircuit } from ${abs('src/lib/diagram/index.ts')};
import { tracePath, sharedPath } from ${abs('src/lib/circuit/index.ts')};
import fan from ${raw('content/circuits/cooling-fan-relay.yaml')};
import courtesy from ${raw('content/circuits/courtesy-lamps.yaml')};
import wiper from ${raw('content/circuits/wiper-park.yaml')};

const fanC = readDiagramCircuit(fan);
mount(WiringDiagram, { target: document.getElementById('select'), props: { circuit: fanC.diagram, mode: 'select', state: 'hot',
  onselect: (id) => { document.getElementById('picked').textContent = id ?? '(none)'; } } });
const court = readDiagramCircuit(courtesy);
const control = tracePath(court.circuit, { state: 'both-open', through: 'S1' });
const load = tracePath(court.circuit, { state: 'both-open', through: 'S2' });
const shared = sharedPath(control, load, court.circuit);
mount(WiringDiagram, { target: document.getElementById('overlay'), props: { circuit: court.diagram, mode: 'overlay', state: 'both-open',
  overlays: [ { name: 'driver door path', elements: control.elements }, { name: 'passenger door path', elements: load.elements }, { name: 'shared', elements: shared.elements } ] } });
import { benchCircuit } from ${abs('src/lib/diagram/bench-circuit.ts')};
const wide = readDiagramCircuit(benchCircuit());
mount(WiringDiagram, { target: document.getElementById('tap'), props: { circuit: wide.diagram, mode: 'select', state: 'all-on',
  onselect: (id) => { document.getElementById('tapped').textContent = id ?? '(none)'; } } });
const wip = readDiagramCircuit(wiper);
mount(WiringDiagram, { target: document.getElementById('live'), props: { circuit: wip.diagram, engine: wip.circuit, mode: 'live', state: 'off-mid-sweep' } });
`;

const HTML = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Wiring diagrams</title>
<style>body{margin:0;padding:8px;font-family:system-ui,sans-serif;background:#f6f3ec;color:#1f2933} main{display:grid;gap:24px;max-width:72rem;margin:0 auto} section{min-width:0}</style>
</head><body><main>
<h1>Wiring diagrams</h1>
<section><h2>Pick a part or wire</h2><div id="select"></div><p>Picked: <output id="picked">(none)</output></p></section>
<section><h2>Current paths</h2><div id="overlay"></div></section>
<section><h2>Bench</h2><div id="live"></div></section>
<section><h2>A wide circuit to tap</h2><div id="tap"></div><p>Tapped: <output id="tapped">(none)</output></p></section>
</main><script type="module" src="./entry.js"></script></body></html>`;

const GALLERY_ENTRY = `
import { mount } from 'svelte';
import CircuitGallery from ${abs('src/lib/components/CircuitGallery.svelte')};
import circuits from './gallery.json';
mount(CircuitGallery, { target: document.getElementById('gallery'), props: { circuits } });
`;

const GALLERY_HTML = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>Circuit gallery</title>
<style>body{margin:0;padding:8px;font-family:system-ui,sans-serif;background:#f6f3ec;color:#1f2933} main{max-width:72rem;margin:0 auto}</style>
</head><body><main><h1>Circuit gallery</h1><div id="gallery"></div></main><script type="module" src="./gallery-entry.js"></script></body></html>`;

let server: Server;
let base = '';
let context: BrowserContext;
let close: () => Promise<void>;
let page: Page;

beforeAll(async () => {
	rmSync(WORK, { recursive: true, force: true });
	mkdirSync(WORK, { recursive: true });
	mkdirSync(SHOTS, { recursive: true });
	writeFileSync(path.join(WORK, 'entry.js'), ENTRY);
	writeFileSync(path.join(WORK, 'index.html'), HTML);
	writeFileSync(path.join(WORK, 'gallery-entry.js'), GALLERY_ENTRY);
	writeFileSync(path.join(WORK, 'gallery.html'), GALLERY_HTML);
	writeFileSync(path.join(WORK, 'gallery.json'), JSON.stringify(await loadCircuits()));
	await build({
		root: WORK,
		configFile: false,
		logLevel: 'warn',
		plugins: [svelte({ configFile: false })],
		resolve: { alias: { $lib: path.join(ROOT, 'src/lib') } },
		build: {
			outDir: DIST,
			emptyOutDir: true,
			minify: false,
			rollupOptions: { input: { index: path.join(WORK, 'index.html'), gallery: path.join(WORK, 'gallery.html') } }
		}
	});
	server = createServer((req, res) => {
		const url = new URL(req.url ?? '/', 'http://127.0.0.1');
		const file = path.join(DIST, url.pathname === '/' ? 'index.html' : url.pathname);
		if (!file.startsWith(DIST) || !existsSync(file)) {
			res.writeHead(404).end('not found');
			return;
		}
		const type = file.endsWith('.js') ? 'text/javascript' : file.endsWith('.css') ? 'text/css' : 'text/html';
		res.writeHead(200, { 'content-type': type }).end(readFileSync(file));
	});
	await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
	const addr = server.address();
	base = `http://127.0.0.1:${typeof addr === 'object' && addr ? addr.port : 0}/`;
	({ context, close } = await launchBrowser());
	page = await context.newPage();
	const errors: string[] = [];
	page.on('pageerror', (e) => errors.push(e.message));
	await page.goto(base);
	await page.waitForSelector('#live svg [data-item]', { state: 'attached' });
	expect(errors).toEqual([]);
}, 180_000);

afterAll(async () => {
	await close?.();
	await new Promise((r) => server?.close(r));
});

async function focusedItem(): Promise<{ id: string | null; name: string | null }> {
	return page.evaluate(() => {
		const el = document.activeElement;
		return { id: el?.getAttribute('data-item') ?? null, name: el?.getAttribute('aria-label') ?? null };
	});
}

describe('WiringDiagram in Chromium', () => {
	it('names every part and wire the way a technician says it (wire ends from the circuit file)', async () => {
		const names = await page.$$eval('#select [data-item]', (els) => els.map((e) => [e.getAttribute('data-item'), e.getAttribute('aria-label')]));
		const byId = Object.fromEntries(names);
		// cooling-fan-relay.yaml, third wire: { from: K1.85, to: S1.1, color: GN/BK }
		expect(byId['W3']).toBe('wire W3, relay K1 pin 85 to switch S1 pin 1, colour GN/BK');
		// FAN_FEED: { from: K1.87, to: M1.1 }
		expect(byId['FAN_FEED']).toBe('wire FAN_FEED, relay K1 pin 87 to motor M1 pin 1, colour GN/WH');
		expect(byId['F1']).toBe('fuse F1, 10 A');
		expect(byId['S1']).toBe('switch S1, closed'); // state hot: { S1: closed }
		const circuit = parseCircuit(readLayoutHints(readFileSync('content/circuits/cooling-fan-relay.yaml', 'utf8')).text);
		for (const p of circuit.parts) expect(byId[p.id], p.id).toBeTruthy();
		for (const w of circuit.wires) expect(byId[w.id], w.id).toMatch(new RegExp(`^wire ${w.id}, `));
	});

	it('keeps one tab stop per diagram (roving tabindex)', async () => {
		for (const id of ['#select', '#overlay', '#live']) {
			const zeros = await page.$$eval(`${id} [data-item][tabindex="0"]`, (els) => els.length);
			expect(zeros, id).toBe(1);
		}
	});

	it('moves focus with Tab and the arrow keys, selects with Enter and announces the selection', async () => {
		await page.setViewportSize({ width: 1280, height: 900 });
		await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
		await page.focus('body');
		let f = await focusedItem();
		for (let i = 0; i < 10 && f.id === null; i++) {
			await page.keyboard.press('Tab');
			f = await focusedItem();
		}
		expect(f.id).toBe('F1'); // the first part in the file
		await page.keyboard.press('ArrowDown');
		const down = await focusedItem();
		expect(down.id).not.toBe('F1');
		const pos = async (id: string) =>
			page.$eval(`#select [data-item="${id}"]`, (e) => {
				const r = e.getBoundingClientRect();
				return r.y + r.height / 2;
			});
		expect(await pos(down.id!)).toBeGreaterThan(await pos('F1'));
		await page.keyboard.press('ArrowRight');
		const right = await focusedItem();
		expect(right.id).not.toBe(down.id);
		await page.keyboard.press('Enter');
		expect(await page.textContent('#picked')).toBe(right.id);
		const said = await page.$eval('#select [aria-live]', (e) => e.textContent);
		expect(said).toBe(`Selected: ${right.name}`);
		expect(await page.getAttribute(`#select [data-item="${right.id}"]`, 'aria-pressed')).toBe('true');
		await page.keyboard.press('Escape');
		expect(await page.textContent('#picked')).toBe('(none)');
		// Tab leaves the diagram in one step.
		await page.keyboard.press('Tab');
		const after = await page.evaluate(() => document.activeElement?.closest('#select svg') !== null);
		expect(after).toBe(false);
	});

	it('selects with a click too', async () => {
		await page.click('#select [data-item="M1"]');
		expect(await page.textContent('#picked')).toBe('M1');
	});

	it('gives every target at least 24 x 24 CSS px on a 360 px phone at the default zoom', async () => {
		await page.setViewportSize({ width: 360, height: 780 });
		await page.waitForTimeout(100);
		const small = await page.$$eval('[data-item] .wd-hit', (els) =>
			els
				.map((el) => {
					const r = el.getBoundingClientRect();
					const svg = (el as SVGGraphicsElement).ownerSVGElement!;
					const scale = svg.getBoundingClientRect().width / svg.viewBox.baseVal.width;
					let w = r.width;
					let h = r.height;
					if (el.tagName === 'polyline') {
						const sw = Number(el.getAttribute('stroke-width')) * scale;
						w += sw;
						h += sw;
					}
					return { id: el.parentElement?.getAttribute('data-item'), w, h };
				})
				.filter((t) => t.w < 24 || t.h < 24)
		);
		expect(small).toEqual([]);
		const fits = await page.$eval('#select svg', (s) => s.getBoundingClientRect().width <= 360);
		expect(fits).toBe(true);
		await page.setViewportSize({ width: 1280, height: 900 });
	});

	it('on a 360 px phone, a tap on a wire’s own line or a part’s body picks that wire or part, even where hit areas overlap', async () => {
		await page.setViewportSize({ width: 360, height: 780 });
		await page.waitForTimeout(100);
		/** Where to tap, on screen now: the middle of a wire's middle segment, or the centre of a part's body. */
		const spot = (id: string) =>
			page.$eval(
				'#tap svg',
				(svg, id) => {
					const g = svg.querySelector(`[data-item="${id}"]`) as SVGGElement;
					let x: number, y: number;
					if (g.classList.contains('wd-wire')) {
						const pts = (g.querySelector('polyline.sp-wire') as SVGPolylineElement).points;
						const i = Math.max(1, Math.floor(pts.numberOfItems / 2));
						x = (pts.getItem(i - 1).x + pts.getItem(i).x) / 2;
						y = (pts.getItem(i - 1).y + pts.getItem(i).y) / 2;
					} else {
						const body = g.querySelector('g') as SVGGElement;
						const r = body.getBBox();
						const t = body.transform.baseVal.consolidate()?.matrix;
						x = (t?.e ?? 0) + r.x + r.width / 2;
						y = (t?.f ?? 0) + r.y + r.height / 2;
					}
					const p = new DOMPoint(x, y).matrixTransform((svg as SVGSVGElement).getScreenCTM()!);
					// Which target's hit area is on top there (the one a plain hit test would pick).
					const top = document.elementFromPoint(p.x, p.y)?.closest('[data-item]')?.getAttribute('data-item') ?? null;
					return { x: p.x, y: p.y, top };
				},
				id
			);
		const ids = await page.$$eval('#tap [data-item].wd-wire, #tap [data-item].wd-part', (els) => els.map((e) => e.getAttribute('data-item')!));
		expect(ids.length).toBeGreaterThan(10);
		const wrong: string[] = [];
		const covered: string[] = [];
		for (const id of ids) {
			if ((await page.textContent('#tapped')) === id) await page.click('#tap [data-item="' + ids.find((x) => x !== id) + '"]');
			await page.$eval(`#tap [data-item="${id}"]`, (el) => el.scrollIntoView({ block: 'center' }));
			const at = await spot(id);
			if (at.top !== id) covered.push(`${id} under ${at.top}`);
			await page.mouse.click(at.x, at.y);
			const picked = await page.textContent('#tapped');
			if (picked !== id) wrong.push(`${id} picked ${picked}`);
		}
		console.log(`phone taps: ${ids.length} targets, ${covered.length} under another target's hit area: ${covered.join(', ')}`);
		// The wide circuit fitted to a phone has targets under their neighbours' hit areas: the case this checks.
		expect(covered.length).toBeGreaterThan(0);
		expect(wrong).toEqual([]);
		await page.setViewportSize({ width: 1280, height: 900 });
	});

	it('live mode: a switch flips and the meter shows what the engine computes', async () => {
		const text = readFileSync('content/circuits/wiper-park.yaml', 'utf8');
		const circuit = parseCircuit(text);
		const reading = async () => (await page.textContent('#live output[aria-label="Meter reading"]'))?.trim();
		// Red lead starts on the first test point (A: S1.B), black on GND; state off-mid-sweep.
		const before = solveCircuit(circuit, { state: 'off-mid-sweep' });
		if ('error' in before) throw new Error('unexpected dead short');
		expect(await reading()).toBe(`${before.points.A.volts.toFixed(2)} V`);
		await page.selectOption('#live select >> nth=0', 'C'); // red lead on C: M1.1
		expect(await reading()).toBe(`${before.points.C.volts.toFixed(2)} V`);
		// S1 off -> low gives the file's state "low" (S1: low, S2: closed).
		await page.click('#live [data-item="S1"]');
		const low = solveCircuit(circuit, { state: 'low' });
		if ('error' in low) throw new Error('unexpected dead short');
		expect(await reading()).toBe(`${low.points.C.volts.toFixed(2)} V`);
		expect(await page.$eval('#live [aria-live]', (e) => e.textContent)).toContain('Switch S1 to low');
		// A test lamp on C to GND: the engine's lamp verdict.
		await page.selectOption('#live select >> nth=2', 'C');
		const lamp = solveCircuit(circuit, { state: 'low', lamp: 'C' });
		expect(await page.textContent('#live output[aria-label="Test lamp"]')).toBe('error' in lamp ? 'dead short' : lamp.lamp);
	});

	it('passes axe-core with no serious or critical violation', async () => {
		await page.addScriptTag({ path: AXE });
		const violations = await page.evaluate(async () => {
			const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> } }).axe;
			const r = await axe.run(document, { resultTypes: ['violations'] });
			return r.violations.map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
		});
		expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
	});

	it('the gallery draws every circuit file in each of its states and passes axe-core', async () => {
		const gallery = await context.newPage();
		await gallery.goto(`${base}gallery.html`);
		await gallery.waitForSelector('#gallery svg [data-item]', { state: 'attached' });
		const circuits = await loadCircuits();
		const expected = circuits.reduce((n, c) => n + (c.ok ? c.states.length : 0), 0);
		expect(circuits.every((c) => c.ok)).toBe(true);
		expect(await gallery.$$eval('#gallery svg[data-circuit]', (els) => els.length)).toBe(expected);
		await gallery.addScriptTag({ path: AXE });
		const violations = await gallery.evaluate(async () => {
			const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[] }[] }[] }> } }).axe;
			const r = await axe.run(document, { resultTypes: ['violations'] });
			return r.violations.map((v) => ({ id: v.id, impact: v.impact, nodes: v.nodes.slice(0, 3).map((n) => n.target.join(' ')) }));
		});
		expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
		await gallery.fill('#gallery input[type="search"]', 'wiper');
		expect(await gallery.$$eval('#gallery section.gallery-circuit', (els) => els.length)).toBe(1);
		for (const [name, size] of [
			['desktop', { width: 1280, height: 900 }],
			['phone', { width: 360, height: 780 }]
		] as const) {
			await gallery.setViewportSize(size);
			await gallery.waitForTimeout(100);
			await gallery.screenshot({ path: path.join(SHOTS, `gallery-${name}.png`), fullPage: true });
		}
		await gallery.close();
	});

	it('saves desktop and phone screenshots', async () => {
		for (const [name, size] of [
			['desktop', { width: 1280, height: 900 }],
			['phone', { width: 360, height: 780 }]
		] as const) {
			await page.setViewportSize(size);
			await page.waitForTimeout(100);
			await page.screenshot({ path: path.join(SHOTS, `diagram-${name}.png`), fullPage: true });
			expect(existsSync(path.join(SHOTS, `diagram-${name}.png`))).toBe(true);
		}
	});
});

// The real /gallery route in the built app: runs when the app test project has started the app
// (TEST_APP_PORT, see tests/helpers/app-global-setup.ts); the static page above needs no app.
describe.runIf(Boolean(process.env.TEST_APP_PORT))('the /gallery route in the built app', () => {
	it('sends an anonymous visitor to sign in and refuses a learner', async () => {
		const { request, signIn, demoAccount } = await import('../helpers/app');
		const anon = await request('/gallery');
		expect(anon.status).toBe(303);
		expect(anon.location).toMatch(/^\/signin\?next=%2Fgallery/);
		const learner = await request('/gallery', { cookie: await signIn(demoAccount('learner').email) });
		expect(learner.status).toBe(403);
	});

	it('shows an author every circuit in each state, passing axe-core', async () => {
		const { APP_URL, demoAccount } = await import('../helpers/app');
		const { DEMO_PASSWORD } = await import('../../src/lib/server/seed/demo');
		const { openPage } = await import('../helpers/browser');
		const p = await context.newPage();
		await openPage(p, `${APP_URL}/signin?next=%2Fgallery`);
		await p.getByLabel('E-mail').fill(demoAccount('author').email);
		await p.getByLabel('Password').fill(DEMO_PASSWORD);
		await p.getByRole('button', { name: 'Sign in' }).click();
		await p.waitForURL(`${APP_URL}/gallery`);
		await p.waitForSelector('html[data-ready="true"]', { state: 'attached' });
		const circuits = await loadCircuits();
		const expected = circuits.reduce((n, c) => n + (c.ok ? c.states.length : 0), 0);
		expect(await p.$$eval('svg[data-circuit]', (els) => els.length)).toBe(expected);
		await p.addScriptTag({ path: AXE });
		const violations = await p.evaluate(async () => {
			const axe = (window as unknown as { axe: { run: (ctx: Document, o: object) => Promise<{ violations: { id: string; impact: string }[] }> } }).axe;
			const r = await axe.run(document, { resultTypes: ['violations'] });
			return r.violations.map((v) => ({ id: v.id, impact: v.impact }));
		});
		expect(violations.filter((v) => v.impact === 'serious' || v.impact === 'critical')).toEqual([]);
		for (const [name, size] of [
			['desktop', { width: 1280, height: 900 }],
			['phone', { width: 360, height: 780 }]
		] as const) {
			await p.setViewportSize(size);
			await p.screenshot({ path: path.join(SHOTS, `gallery-route-${name}.png`), fullPage: false });
		}
		await p.close();
	});
});
