/**
 * The demo bank: the build over all of content/ plus every family has no errors; every key and every
 * tagged distractor is re-derived here through the engine's public entry on a fresh parse (not the
 * build's caches); the bank is large, distinct, balanced and deterministic.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import {
	diagnose,
	parseCircuit,
	parseObservations,
	sharedPath,
	solveCircuit,
	tracePath,
	type Circuit,
	type SolveOptions,
	type SolveResult
} from '../circuit';
import { AREAS } from './blueprint';
import { buildBank, itemSignature, type BuildResult } from './bank';
import { FAMILIES } from './families';
import { FORMS } from './families/forms';
import { stableJson } from './hash';
import { KINDS, type BuiltItem, type ScalarAsk } from './types';

function walk(dir: string, ext: string): string[] {
	const out: string[] = [];
	for (const n of readdirSync(dir)) {
		const p = join(dir, n);
		if (statSync(p).isDirectory()) out.push(...walk(p, ext));
		else if (n.endsWith(ext)) out.push(p);
	}
	return out;
}

export function contentFiles(): { files: Record<string, string>; circuits: Record<string, string> } {
	const files: Record<string, string> = {};
	for (const p of walk('content/items', '.md')) files[p] = readFileSync(p, 'utf8');
	const circuits: Record<string, string> = {};
	for (const p of walk('content/circuits', '.yaml')) circuits[p] = readFileSync(p, 'utf8');
	return { files, circuits };
}

// an independent parse per circuit text: the engine's own caches hang off these objects, not the build's
const parsed = new Map<string, Circuit>();
function circuitOf(text: string): Circuit {
	let c = parsed.get(text);
	if (!c) {
		c = parseCircuit(text.replace(/^layout:[\s\S]*?(?=^\S|(?![\s\S]))/m, ''));
		parsed.set(text, c);
	}
	return c;
}

function solved(c: Circuit, o: SolveOptions): SolveResult {
	const r = solveCircuit(c, o);
	if ('error' in r) throw new Error(`unexpected dead short for ${JSON.stringify(o)}`);
	return r;
}

/** The value of a scalar ask, straight from a solve. */
function valueOf(c: Circuit, ask: ScalarAsk, r: SolveResult): number | string {
	switch (ask.type) {
		case 'volts':
			return r.points[ask.point].volts;
		case 'reads':
			return r.points[ask.point].reads;
		case 'status':
			return r.parts[ask.part].status ?? 'none';
		case 'amps':
			return r.parts[ask.part].amps;
		case 'watts': {
			const p = c.parts.find((x) => x.id === ask.part)!;
			return Math.abs(r.nodes[`${p.id}.${p.pins[0]}`] - r.nodes[`${p.id}.${p.pins[1]}`]) * r.parts[ask.part].amps;
		}
		case 'drop': {
			const v = (n: string) => (c.points.some((p) => p.label === n) ? r.points[n].volts : r.nodes[n]);
			return v(ask.from) - v(ask.to);
		}
	}
}

const near = (a: unknown, b: unknown, tol = 0.0015) => (typeof a === 'number' && typeof b === 'number' ? Math.abs(a - b) <= tol : a === b);
const sameSet = (a: string[], b: string[]) => [...a].sort().join(',') === [...b].sort().join(',');

/** Re-derives the key of one item through the engine; returns what differs, or null. */
function rederiveKey(it: BuiltItem): string | null {
	const c = circuitOf(it.circuitText);
	const ask = it.ask;
	const key = it.key;
	switch (ask.type) {
		case 'path':
		case 'shared': {
			const o = { state: ask.state, fault: ask.fault };
			const els =
				ask.type === 'path'
					? tracePath(c, { ...o, through: ask.through }).elements
					: sharedPath(tracePath(c, { ...o, through: ask.through[0] }), tracePath(c, { ...o, through: ask.through[1] }), c).elements;
			return key.kind === 'select-diagram' && sameSet(key.elements, els) ? null : `path ${els} vs key ${JSON.stringify(key)}`;
		}
		case 'opens': {
			const d = diagnose(c, parseObservations(ask.complaint));
			const wires = d.candidates.filter((x) => x.startsWith('open:') && c.wires.some((w) => `open:${w.id}` === x)).map((x) => x.slice(5));
			return key.kind === 'select-diagram' && sameSet(key.elements, wires) ? null : `opens ${wires} vs key ${JSON.stringify(key)}`;
		}
		case 'candidates': {
			const d = diagnose(c, parseObservations(ask.complaint));
			if (it.question.kind !== 'choose-all' || key.kind !== 'choose-all') return 'kind mismatch';
			const want = it.question.options.map((o) => o.id).filter((o) => d.candidates.includes(o));
			return sameSet(want, key.choices) ? null : `candidates ${want} vs key ${key.choices}`;
		}
		case 'next-test': {
			const d = diagnose(c, parseObservations(ask.complaint));
			return key.kind === 'next-test' && d.next_test && d.next_test.state === key.state && d.next_test.point === key.point
				? null
				: `next test ${JSON.stringify(d.next_test)} vs key ${JSON.stringify(key)}`;
		}
		case 'works': {
			const r = solved(c, { state: ask.state, fault: ask.fault });
			const m = Object.fromEntries(ask.loads.map((l) => [l, r.parts[l].status]));
			return key.kind === 'predict-works' && stableJson(m) === stableJson(key.loads) ? null : `works ${JSON.stringify(m)} vs key ${JSON.stringify(key)}`;
		}
		case 'claims': {
			if (key.kind !== 'claim-check') return 'kind mismatch';
			for (let i = 0; i < ask.claims.length; i++) {
				const cl = ask.claims[i];
				const v = valueOf(c, cl.ask, solved(c, { state: cl.ask.state, fault: cl.ask.fault }));
				const holds = typeof v === 'number' ? Math.abs(v - Number(cl.is)) <= 0.1 + 1e-9 || (cl.ask.type !== 'volts' && cl.ask.type !== 'drop' && Math.abs(v - Number(cl.is)) <= Math.max(0.0001, Math.abs(v) * 0.02)) : v === cl.is;
				if (holds !== key.verdicts[i]) return `claim ${i + 1}: engine value ${v}, claimed ${cl.is}, key says ${key.verdicts[i]}`;
			}
			return null;
		}
		default: {
			const v = valueOf(c, ask, solved(c, { state: ask.state, fault: ask.fault }));
			if (key.kind === 'numeric') return near(v, key.value) ? null : `value ${v} vs key ${key.value}`;
			if (key.kind === 'choose-one') return near(v, key.value) ? null : `value ${v} vs key ${key.value}`;
			return 'kind mismatch';
		}
	}
}

/** Re-derives every distractor that came from a solve, and checks its tag against the what-if used. */
function rederiveDistractors(it: BuiltItem): string[] {
	const c = circuitOf(it.circuitText);
	const ask = it.ask;
	const bad: string[] = [];
	const labels = new Set<string>();
	for (const d of it.distractors) {
		if (labels.has(d.label)) bad.push(`duplicate distractor ${d.label}`);
		labels.add(d.label);
		if (!d.via) continue;
		const v = d.via;
		const w = v.whatIf ?? {};
		const askWhere = 'state' in ask ? { state: ask.state, fault: ask.fault } : null;
		const tagOk: Record<string, boolean> = {
			'fault-ignored': !!askWhere?.fault && v.fault === null,
			'path-without-fault': !!askWhere?.fault && v.fault === null,
			'relay-still-energized': !!w.relays && Object.values(w.relays).every((s) => s === 'energized'),
			'relay-assumed-released': !!w.relays && Object.values(w.relays).every((s) => s === 'released'),
			'fuse-assumed-intact': w.noFuseOpens === true,
			'far-side-of-open': w.farSideOfOpen === true && !!v.fault?.startsWith('open:'),
			'meter-read-as-lamp': w.lampReadings === true,
			'other-switch-position': v.state !== askWhere?.state,
			'measured-to-ground': ask.type === 'drop'
		};
		if (!tagOk[d.tag]) bad.push(`tag ${d.tag} does not fit ${JSON.stringify(v)}`);
		const o = { state: v.state, fault: v.fault, whatIf: v.whatIf };
		if (ask.type === 'path' || ask.type === 'shared') {
			const els =
				ask.type === 'path'
					? tracePath(c, { ...o, through: ask.through }).elements
					: sharedPath(tracePath(c, { ...o, through: ask.through[0] }), tracePath(c, { ...o, through: ask.through[1] }), c).elements;
			if (!sameSet(els, d.value as string[])) bad.push(`${d.tag}: path ${els} vs ${d.value}`);
		} else if (ask.type === 'works') {
			const r = solved(c, o);
			const m = Object.fromEntries(ask.loads.map((l) => [l, r.parts[l].status]));
			if (stableJson(m) !== stableJson(d.value)) bad.push(`${d.tag}: works ${JSON.stringify(m)} vs ${JSON.stringify(d.value)}`);
		} else if (ask.type === 'drop' && d.tag === 'measured-to-ground') {
			const r = solved(c, o);
			const from = c.points.some((p) => p.label === ask.from) ? r.points[ask.from].volts : r.nodes[ask.from];
			if (!near(from, d.value)) bad.push(`measured-to-ground ${from} vs ${d.value}`);
		} else if (ask.type !== 'opens' && ask.type !== 'candidates' && ask.type !== 'next-test' && ask.type !== 'claims') {
			const val = valueOf(c, ask, solved(c, o));
			if (!near(val, d.value)) bad.push(`${d.tag}: engine ${val} vs distractor ${d.value}`);
		}
		if (stableJson(d.value) === stableJson('value' in it.key ? it.key.value : null)) bad.push(`distractor ${d.label} equals the key`);
	}
	if (ask.type === 'candidates' && it.key.kind === 'choose-all') {
		const full = diagnose(c, parseObservations(ask.complaint)).candidates;
		for (const d of it.distractors) {
			if (full.includes(d.value as string)) bad.push(`distractor ${d.value} explains the whole complaint`);
			if (d.tag === 'explains-part-of-complaint') {
				// a fault that reproduces the observations of at least one state, or one observation, of the complaint
				const pieces = ask.complaint.split(';').map((s) => s.trim());
				const chunks =
					pieces.length > 1 ? pieces : pieces[0].slice(pieces[0].indexOf(':') + 1).split(',').map((e) => `${pieces[0].slice(0, pieces[0].indexOf(':'))}: ${e.trim()}`);
				if (!chunks.some((p) => diagnose(c, parseObservations(p)).candidates.includes(d.value as string))) bad.push(`${d.value} explains no part of the complaint`);
			}
		}
	}
	return bad;
}

describe('the demo bank', () => {
	let bank: BuildResult;
	beforeAll(() => {
		bank = buildBank(contentFiles());
	}, 300_000);

	it('builds all of content/ and every family with zero errors', () => {
		expect(bank.errors).toEqual([]);
		expect(bank.stats.families).toBe(FAMILIES.length);
		expect(FAMILIES.length).toBeGreaterThanOrEqual(10);
		expect(bank.items.filter((i) => i.family === null).length).toBe(Object.keys(contentFiles().files).length);
	});

	it('every key re-derives through the engine on a fresh parse', () => {
		const bad = bank.items.map((it) => [it.id, rederiveKey(it)] as const).filter(([, b]) => b !== null);
		expect(bad).toEqual([]);
	}, 300_000);

	it('every tagged distractor re-derives through the engine, fits its tag, and differs from the key and the others', () => {
		const bad = bank.items.map((it) => [it.id, rederiveDistractors(it)] as const).filter(([, b]) => b.length > 0);
		expect(bad).toEqual([]);
		expect(bank.items.some((i) => i.distractors.some((d) => d.tag === 'relay-still-energized'))).toBe(true);
		expect(bank.items.some((i) => i.distractors.some((d) => d.tag === 'fuse-assumed-intact'))).toBe(true);
		expect(bank.items.some((i) => i.distractors.some((d) => d.tag === 'far-side-of-open'))).toBe(true);
		expect(bank.items.some((i) => i.distractors.some((d) => d.tag === 'meter-read-as-lamp'))).toBe(true);
	}, 300_000);

	it('holds at least 2,000 distinct items, every kind at least 100, every area at least 5 %', () => {
		const n = bank.items.length;
		expect(n).toBeGreaterThanOrEqual(2000);
		expect(new Set(bank.items.map((i) => itemSignature(i))).size).toBe(n);
		expect(new Set(bank.items.map((i) => i.id)).size).toBe(n);
		const byCircuitAskKey = new Set(bank.items.map((i) => i.circuitText + stableJson(i.ask) + stableJson(i.key)));
		expect(byCircuitAskKey.size).toBe(n);
		for (const k of KINDS) expect(bank.stats.kinds[k], k).toBeGreaterThanOrEqual(100);
		for (const a of AREAS) expect(bank.stats.areas[a.id] / n, a.id).toBeGreaterThanOrEqual(0.05);
	});

	it('within each question form, variants give at least 5 distinct keys', () => {
		for (const f of FORMS) {
			const keys = new Set(bank.items.filter((i) => i.id.includes(`-${f.id}-`)).map((i) => stableJson(i.key)));
			expect(keys.size, f.id).toBeGreaterThanOrEqual(5);
		}
	});

	it('no item shows its key in the learner payload', () => {
		for (const it of bank.items.slice(0, 500)) {
			const q = stableJson(it.question);
			for (const field of ['"key"', '"value"', '"choice"', '"choices"', '"elements"', '"verdicts"', '"expectedLeft"', '"candidates"']) expect(q, it.id).not.toContain(field);
		}
	});

	it('items on batteries and airbag circuits carry their cautions; others none', () => {
		const battery = bank.items.filter((i) => i.area === 'battery-starting' || i.area === 'charging');
		expect(battery.length).toBeGreaterThan(0);
		// reference-values.md, "Safety cautions": CCOHS, OSH Answers, "Battery charging"
		for (const it of battery) expect(it.cautions.map((c) => c.id)).toEqual(expect.arrayContaining(['hydrogen', 'jewellery', 'ground-first']));
		// reference-values.md, "Safety cautions": airbag circuits are never probed with a test lamp or ordinary meter
		const airbag = bank.items.filter((i) => i.tags.includes('airbag'));
		expect(airbag.length).toBeGreaterThan(0);
		for (const it of airbag) expect(it.cautions.map((c) => c.id)).toContain('airbag');
		for (const it of bank.items.filter((i) => i.area === 'lighting-signalling' && i.tags.length === 0)) expect(it.cautions).toEqual([]);
	});

	it('is deterministic: the same seed gives the same ids, versions and keys; another seed gives other variants', () => {
		const fams = FAMILIES.slice(0, 3);
		const a = buildBank({ files: {}, circuits: {}, families: fams, variantsPerFamily: 2, seed: 'repeat' });
		const b = buildBank({ files: {}, circuits: {}, families: fams, variantsPerFamily: 2, seed: 'repeat' });
		const c = buildBank({ files: {}, circuits: {}, families: fams, variantsPerFamily: 2, seed: 'another' });
		expect(a.items.map((i) => [i.id, i.version, stableJson(i.key)])).toEqual(b.items.map((i) => [i.id, i.version, stableJson(i.key)]));
		const ids = new Set(a.items.map((i) => i.id));
		expect(c.items.filter((i) => ids.has(i.id)).length).toBeLessThan(c.items.length / 2);
	}, 120_000);
});
