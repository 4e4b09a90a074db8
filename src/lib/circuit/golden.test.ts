/**
 * Golden circuit cases: one table-driven test over every `golden/*.yaml` file.
 *
 * File format (also in golden/README.md):
 *   title:   test name
 *   circuit: the circuit file, inline (spec: /work/shared/spec/circuit-format.md)
 *   notes:   optional shared working
 *   ngspice: optional { NAME: netlist } for values whose `why` says "ngspice"
 *   cases:   list of
 *     name, state?, fault? ("KIND:TARGET[:OHMS]"), lamp? ("A" or "A:B+"),
 *     expect?: {
 *       points?: { LABEL: { volts?, reads?, why, tol_volts? } },
 *       nodes?:  { NODE:  { volts, why, tol_volts? } },
 *       parts?:  { ID:    { status?, amps?, why, tol_amps? } },
 *       lamp?:   { status, why },
 *       dead_short?: { elements, why },          (compared as a set)
 *       paths?:  [ { through, elements, why } ],  (in order)
 *       shared?: [ { a, b, elements, why } ],     (in order)
 *     },
 *     diagnosis?: [ { observe, candidates, next_test?, why } ]
 * Every expectation carries its derivation in `why` (a hand calculation, a named textbook example, or
 * "ngspice" with the netlist in the file). Tolerances: volts ±1 mV, amps ±0.1 mA, expected_left ±1e-3,
 * unless the entry names its own.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parse } from 'yaml';
import {
	diagnose,
	parseCircuit,
	parseObservations,
	sharedPath,
	solveCircuit,
	tracePath,
	type SolveResult
} from './index';

/** Default tolerances (golden/README.md). */
const VOLTS_TOL_V = 0.001;
const AMPS_TOL_A = 0.0001;
const EXPECTED_LEFT_TOL = 0.001;
/** Slack for binary floating point on top of a tolerance. */
const FLOAT_SLACK = 1e-9;

type PointExp = { volts?: number; reads?: string; why: string; tol_volts?: number };
type NodeExp = { volts: number; why: string; tol_volts?: number };
type PartExp = { status?: string | null; amps?: number; why: string; tol_amps?: number };
type GoldenCase = {
	name: string;
	state?: string;
	fault?: string;
	lamp?: string;
	expect?: {
		points?: Record<string, PointExp>;
		nodes?: Record<string, NodeExp>;
		parts?: Record<string, PartExp>;
		lamp?: { status: string; why: string };
		dead_short?: { elements: string[]; why: string };
		paths?: { through: string; elements: string[]; why: string }[];
		shared?: { a: string; b: string; elements: string[]; why: string }[];
	};
	diagnosis?: {
		observe: string;
		candidates: string[];
		next_test?: {
			state: string;
			point: string;
			expected_left: number;
			outcomes: Record<string, string[]>;
		} | null;
		why: string;
	}[];
};
type GoldenFile = { title: string; circuit: string; notes?: string; ngspice?: Record<string, string>; cases: GoldenCase[] };

const GOLDEN_DIR = fileURLToPath(new URL('./golden/', import.meta.url));

/** Every golden file, parsed (YAML 1.2 core schema: `on`/`off` stay strings). */
function loadGoldenFiles(): { file: string; data: GoldenFile }[] {
	return readdirSync(GOLDEN_DIR)
		.filter((f) => f.endsWith('.yaml'))
		.sort()
		.map((file) => ({ file, data: parse(readFileSync(join(GOLDEN_DIR, file), 'utf8')) as GoldenFile }));
}

/** Every `why` that an expectation must carry, with where it sits (for the completeness check). */
function missingWhys(g: GoldenFile): string[] {
	const missing: string[] = [];
	const need = (w: unknown, where: string) => {
		if (typeof w !== 'string' || w.trim().length < 3) missing.push(where);
	};
	for (const c of g.cases) {
		const e = c.expect ?? {};
		for (const [k, v] of Object.entries(e.points ?? {})) need(v.why, `${c.name} points.${k}`);
		for (const [k, v] of Object.entries(e.nodes ?? {})) need(v.why, `${c.name} nodes.${k}`);
		for (const [k, v] of Object.entries(e.parts ?? {})) need(v.why, `${c.name} parts.${k}`);
		if (e.lamp) need(e.lamp.why, `${c.name} lamp`);
		if (e.dead_short) need(e.dead_short.why, `${c.name} dead_short`);
		(e.paths ?? []).forEach((p, i) => need(p.why, `${c.name} paths[${i}]`));
		(e.shared ?? []).forEach((p, i) => need(p.why, `${c.name} shared[${i}]`));
		(c.diagnosis ?? []).forEach((d, i) => need(d.why, `${c.name} diagnosis[${i}]`));
	}
	return missing;
}

function near(actual: number | undefined, expected: number, tol: number, what: string): void {
	expect(actual, `${what}: missing`).toBeTypeOf('number');
	const diff = Math.abs((actual as number) - expected);
	expect(diff, `${what}: engine ${actual}, expected ${expected} ± ${tol}`).toBeLessThanOrEqual(tol + FLOAT_SLACK);
}

function checkSolve(res: SolveResult, e: NonNullable<GoldenCase['expect']>, where: string): void {
	for (const [label, p] of Object.entries(e.points ?? {})) {
		const got = res.points[label];
		expect(got, `${where}: point ${label} missing from the result`).toBeDefined();
		if (p.volts !== undefined) near(got.volts, p.volts, p.tol_volts ?? VOLTS_TOL_V, `${where}: point ${label} volts (${p.why})`);
		if (p.reads !== undefined) expect(got.reads, `${where}: point ${label} reads (${p.why})`).toBe(p.reads);
	}
	for (const [node, n] of Object.entries(e.nodes ?? {})) {
		near(res.nodes[node], n.volts, n.tol_volts ?? VOLTS_TOL_V, `${where}: node ${node} volts (${n.why})`);
	}
	for (const [id, p] of Object.entries(e.parts ?? {})) {
		const got = res.parts[id];
		expect(got, `${where}: part ${id} missing from the result`).toBeDefined();
		if (p.status !== undefined) expect(got.status, `${where}: part ${id} status (${p.why})`).toBe(p.status);
		if (p.amps !== undefined) near(got.amps, p.amps, p.tol_amps ?? AMPS_TOL_A, `${where}: part ${id} amps (${p.why})`);
	}
	if (e.lamp) expect(res.lamp, `${where}: test lamp (${e.lamp.why})`).toBe(e.lamp.status);
}

const files = loadGoldenFiles();

describe('golden circuit files', () => {
	it('has at least 12 files and 80 cases, every expectation with its derivation', () => {
		expect(files.length).toBeGreaterThanOrEqual(12);
		const total = files.reduce((n, f) => n + f.data.cases.length, 0);
		expect(total).toBeGreaterThanOrEqual(80);
		for (const f of files) expect(missingWhys(f.data), `${f.file}: expectations without a why`).toEqual([]);
	});
});

for (const { file, data } of files) {
	describe(`${file}: ${data.title}`, () => {
		let parsed: ReturnType<typeof parseCircuit> | undefined;
		it('its circuit is a valid circuit file', () => {
			parsed = parseCircuit(data.circuit);
			expect(parsed).toBeDefined();
		});
		for (const c of data.cases) {
			it(c.name, () => {
				const where = `${file} / ${c.name}`;
				const circuit = (parsed ??= parseCircuit(data.circuit));
				const opts = { state: c.state ?? null, fault: c.fault ?? null, lamp: c.lamp ?? null };
				let checks = 0;
				const e = c.expect;
				if (e) {
					const res = solveCircuit(circuit, opts);
					if (e.dead_short) {
						expect('error' in res ? res.error : 'solved', `${where}: ${e.dead_short.why}`).toBe('dead-short');
						if ('error' in res) {
							expect([...res.elements].sort(), `${where}: dead-short elements`).toEqual([...e.dead_short.elements].sort());
						}
						checks++;
					} else {
						expect('error' in res ? `dead-short ${(res as { elements: string[] }).elements}` : 'solved', where).toBe('solved');
						checkSolve(res as SolveResult, e, where);
						checks++;
					}
					for (const p of e.paths ?? []) {
						const got = tracePath(circuit, { ...opts, through: p.through });
						expect(got.elements, `${where}: path through ${p.through} (${p.why})`).toEqual(p.elements);
						checks++;
					}
					for (const s of e.shared ?? []) {
						const pa = tracePath(circuit, { ...opts, through: s.a });
						const pb = tracePath(circuit, { ...opts, through: s.b });
						expect(sharedPath(pa, pb, circuit).elements, `${where}: shared path ${s.a} & ${s.b} (${s.why})`).toEqual(s.elements);
						checks++;
					}
				}
				for (const d of c.diagnosis ?? []) {
					const got = diagnose(circuit, parseObservations(d.observe));
					expect(got.candidates, `${where}: candidates for "${d.observe}" (${d.why})`).toEqual(d.candidates);
					if (d.next_test === null) expect(got.next_test, `${where}: next test`).toBeNull();
					else if (d.next_test) {
						expect(got.next_test, `${where}: next test`).not.toBeNull();
						const nt = got.next_test!;
						expect({ state: nt.state, point: nt.point }, `${where}: next test`).toEqual({
							state: d.next_test.state,
							point: d.next_test.point
						});
						near(nt.expected_left, d.next_test.expected_left, EXPECTED_LEFT_TOL, `${where}: expected_left`);
						expect(nt.outcomes, `${where}: next test outcomes`).toEqual(d.next_test.outcomes);
					}
					checks++;
				}
				expect(checks, `${where}: a case must check something`).toBeGreaterThan(0);
			});
		}
	});
}
