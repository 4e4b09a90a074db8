/**
 * Properties of the engine's answers, computed independently of its matrix solve:
 *  1. Kirchhoff's current law at every node of every settled solve (golden circuits, each state, no
 *     fault and every standard fault): each resistive element's current computed here as ΔV / R (a
 *     conducting diode as (ΔV - drop) / R) from the unrounded node volts; ideal elements' and sources'
 *     currents as reported. The sum at each node is within 1e-9 of the largest current (plus the
 *     floating-point resolution of the solve's ΔV / R values, a few ulps of the volts over each R:
 *     about 1e-11 A for a 1 mohm fuse at 12 V, which matters only when meters alone draw current).
 *  2. Removing a part that carries no current, with the wires that end on its pins, changes no
 *     remaining node's volts (superposition: a branch with zero current contributes nothing).
 *  3. For every fault in the standard list of every golden circuit (all have states), the diagnosis of what
 *     that fault produces (every part's status and every point's reading class, in every state)
 *     contains that fault.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parse, stringify } from 'yaml';
import {
	diagnose,
	formatFault,
	parseCircuit,
	solveCircuit,
	solveDetailed,
	standardFaults,
	type Fault,
	type Observation,
	type SolveResult
} from './index';

/** KCL residual allowed, relative to the largest element current of the solve. */
const KCL_REL_TOL = 1e-9;
/** Reported volts are rounded to 1 mV; a removal may move a value across a rounding step. */
const REMOVAL_TOL_V = 0.001;
/** Default diode drop (spec parts table). */
const DIODE_DROP_V = 0.7;

type CircuitDoc = {
	supply: unknown;
	parts: Record<string, Record<string, unknown>>;
	wires: (string | { from: string; to: string; [k: string]: unknown })[];
	points?: Record<string, string>;
	states?: Record<string, Record<string, unknown>>;
	[k: string]: unknown;
};

const GOLDEN_DIR = fileURLToPath(new URL('./golden/', import.meta.url));
const golden = readdirSync(GOLDEN_DIR)
	.filter((f) => f.endsWith('.yaml'))
	.sort()
	.map((file) => {
		const data = parse(readFileSync(join(GOLDEN_DIR, file), 'utf8')) as { circuit: string };
		return { file, text: data.circuit, doc: parse(data.circuit) as CircuitDoc };
	});

function statesOf(doc: CircuitDoc): (string | null)[] {
	const names = Object.keys(doc.states ?? {});
	return names.length > 0 ? names : [null];
}

/** Node of a part pin in the file's naming (splice and ground parts are their own node). */
function pinsOf(id: string, part: Record<string, unknown>, wires: CircuitDoc['wires']): Set<string> {
	const pins = new Set<string>();
	if (part.type === 'splice' || part.type === 'ground') pins.add(id);
	for (const w of wires) for (const end of wireEnds(w)) if (end.startsWith(`${id}.`)) pins.add(end);
	return pins;
}
function wireEnds(w: CircuitDoc['wires'][number]): [string, string] {
	if (typeof w === 'string') {
		const [a, b] = w.trim().split(/\s+/);
		return [a, b];
	}
	return [w.from, w.to];
}

describe("Kirchhoff's current law at every node", () => {
	for (const g of golden) {
		it(`${g.file}: each state, no fault and every standard fault`, () => {
			const c = parseCircuit(g.text);
			const drops = new Map<string, number>();
			for (const [id, p] of Object.entries(g.doc.parts)) {
				if (p.type === 'diode') drops.set(id, typeof p.drop === 'number' ? p.drop : DIODE_DROP_V);
			}
			const faults: (Fault | null)[] = [null, ...standardFaults(c)];
			let solves = 0;
			for (const state of statesOf(g.doc)) {
				for (const fault of faults) {
					const d = solveDetailed(c, { state, fault });
					if ('error' in d.result) continue; // dead short: nothing settled
					const where = `${g.file} state ${state} fault ${fault ? formatFault(fault) : 'none'}`;
					const sum = new Map<string, number>();
					// ΔV / R cannot resolve less than a few ulps of the node volts over R: with µA of meter
					// current through a 1 mohm fuse, 4 ulp(12 V) / 1 mohm is 1e-11 A, above 1e-9 of µA.
					const floor = new Map<string, number>();
					let largest = 0;
					for (const e of d.elements) {
						let amps = e.amps;
						if (e.ohms !== null && e.kind === 'source') {
							const v = Math.max(Math.abs(d.volts[e.from] ?? 0), Math.abs(d.volts[e.to] ?? 0), 1);
							floor.set(e.from, (floor.get(e.from) ?? 0) + (4 * Number.EPSILON * v) / e.ohms);
						}
						if (e.ohms !== null && e.kind !== 'source') {
							const va = d.volts[e.from];
							const vb = d.volts[e.to];
							expect(va, `${where}: volts of ${e.from}`).toBeTypeOf('number');
							expect(vb, `${where}: volts of ${e.to}`).toBeTypeOf('number');
							// a diode written as one element a -> k carries its drop inside; one expanded into a
							// resistance and a drop source has a plain resistance here
							const spansDiode = e.from === `${e.id}.a` && e.to === `${e.id}.k`;
							const drop = spansDiode ? (drops.get(e.id) ?? 0) : 0;
							amps = (va - vb - drop) / e.ohms;
							const res = (4 * Number.EPSILON * Math.max(Math.abs(va), Math.abs(vb), 1)) / e.ohms;
							floor.set(e.from, (floor.get(e.from) ?? 0) + res);
							floor.set(e.to, (floor.get(e.to) ?? 0) + res);
						}
						largest = Math.max(largest, Math.abs(amps));
						sum.set(e.from, (sum.get(e.from) ?? 0) - amps);
						sum.set(e.to, (sum.get(e.to) ?? 0) + amps);
					}
					expect(largest, `${where}: something conducts`).toBeGreaterThan(0);
					const floorAll = [...floor.values()].reduce((a, b) => a + b, 0) / 2;
					for (const [node, s] of sum) {
						// ideal elements' reported currents carry their neighbours' rounding along, so the floor
						// is that of the whole solve, not of the node alone
						expect(Math.abs(s), `${where}: KCL at ${node}, residual ${s} A, largest ${largest} A`).toBeLessThanOrEqual(
							KCL_REL_TOL * largest + floorAll
						);
					}
					solves++;
				}
			}
			expect(solves).toBeGreaterThan(0);
		});
	}
});

/** The circuit text with part `id` removed, with every wire ending on its pins, its points and state settings. */
function withoutPart(doc: CircuitDoc, id: string): string {
	const pins = pinsOf(id, doc.parts[id], doc.wires);
	const next: CircuitDoc = structuredClone(doc);
	delete next.parts[id];
	next.wires = doc.wires.filter((w) => !wireEnds(w).some((e) => pins.has(e)));
	if (next.points) for (const [k, v] of Object.entries(next.points)) if (pins.has(v)) delete next.points[k];
	if (next.states) for (const s of Object.values(next.states)) delete s[id];
	return stringify(next);
}

const removals = new Map<string, number>();
describe('removing a part that carries no current changes no other node', () => {
	for (const g of golden) {
		it(`${g.file}: every idle part, each state`, () => {
			const c = parseCircuit(g.text);
			let removed = 0;
			for (const state of statesOf(g.doc)) {
				const d = solveDetailed(c, { state });
				if ('error' in d.result) continue;
				const before = (d.result as SolveResult).nodes;
				for (const [id, part] of Object.entries(g.doc.parts)) {
					if (part.type === 'splice' || part.type === 'ground' || part.type === 'connector') continue;
					// the part's own elements (a relay's coil and contact, ...) all idle or absent (open)
					const own = d.elements.filter((e) => e.kind !== 'meter' && (e.id === id || e.id.startsWith(`${id}.`)));
					if (own.some((e) => Math.abs(e.amps) > 1e-12)) continue;
					// wires ending on the part must be idle too (else the part was not idle)
					let text: string;
					try {
						text = withoutPart(g.doc, id);
						parseCircuit(text);
					} catch {
						continue; // the smaller file is not valid (a pin or splice left unwired): nothing to compare
					}
					const after = solveCircuit(parseCircuit(text), { state });
					if ('error' in after) throw new Error(`${g.file}: removing idle ${id} made a dead short`);
					for (const [node, v] of Object.entries(after.nodes)) {
						if (!(node in before)) continue;
						expect(Math.abs(v - before[node]), `${g.file} state ${state}: removing idle ${id} moved ${node} from ${before[node]} to ${v}`).toBeLessThanOrEqual(
							REMOVAL_TOL_V + 1e-9
						);
					}
					removed++;
				}
			}
			// not every file has an idle part whose removal leaves a valid file; the total is checked below
			removals.set(g.file, removed);
		});
	}
	it('removed at least 10 idle parts across the golden circuits', () => {
		const total = [...removals.values()].reduce((a, b) => a + b, 0);
		expect(total).toBeGreaterThanOrEqual(10);
	});
});

describe('the diagnosis of what a fault produces contains that fault', () => {
	it('every golden circuit names at least one state (observations are per state)', () => {
		for (const g of golden) expect(Object.keys(g.doc.states ?? {}).length, g.file).toBeGreaterThan(0);
	});
	for (const g of golden.filter((x) => Object.keys(x.doc.states ?? {}).length > 0)) {
		it(`${g.file}: every standard fault`, () => {
			const c = parseCircuit(g.text);
			const states = Object.keys(g.doc.states ?? {});
			let checked = 0;
			for (const f of standardFaults(c)) {
				const obs: Observation[] = [];
				let deadShort = false;
				for (const state of states) {
					const r = solveCircuit(c, { state, fault: f });
					if ('error' in r) {
						deadShort = true;
						break;
					}
					const parts: Record<string, string> = {};
					for (const [id, p] of Object.entries(r.parts)) if (p.status !== null) parts[id] = p.status;
					const points: Observation['points'] = {};
					for (const [label, p] of Object.entries(r.points)) points[label] = p.reads;
					obs.push({ state, parts, points });
				}
				if (deadShort) continue; // a dead short reproduces no observation (spec)
				const d = diagnose(c, obs);
				expect(d.candidates, `${g.file}: diagnosis of what ${formatFault(f)} produces`).toContain(formatFault(f));
				checked++;
			}
			expect(checked).toBeGreaterThan(0);
		});
	}
});
