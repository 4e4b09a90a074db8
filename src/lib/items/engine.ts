/**
 * The item bank's view of the circuit engine: cached parses and solves, scalar answers for an ask,
 * what-if distractors, paths and diagnoses. Everything here goes through the engine's public entry.
 */
import {
	diagnose,
	explainSolve,
	parseCircuit,
	parseObservations,
	sharedPath,
	solveCircuit,
	tracePath,
	type Circuit,
	type Diagnosis,
	type Reads,
	type SolveResult,
	type WhatIf
} from '../circuit';
import { hashText } from './hash';
import type { ScalarAsk, Value, Where } from './types';

/** An expected problem with an item: `key` names the front-matter key it comes from, `fix` what to do. */
export class ItemError extends Error {
	key: string;
	fix: string;
	constructor(key: string, message: string, fix: string) {
		super(message);
		this.name = 'ItemError';
		this.key = key;
		this.fix = fix;
	}
}

/** Load part types (status on, weak or off). */
export const LOAD_TYPES = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);

/** One parsed circuit with its caches: solves by state, fault and what-if; diagnoses by complaint. */
export type CircuitCtx = {
	circuit: Circuit;
	text: string;
	/** Hash of the circuit text, computed once. */
	hash: string;
	solves: Map<string, SolveResult | null>;
	paths: Map<string, string[] | null>;
	diagnoses: Map<string, Diagnosis>;
	notes: Map<string, string[]>;
};

/** Circuit contexts by circuit text, so every item on one circuit shares one parse and its solves. */
export type CircuitCache = Map<string, CircuitCtx>;

/**
 * Parses circuit text once per cache. A top-level `layout:` map (the diagram's drawing hints) is
 * blanked before the engine reads the text, keeping line numbers.
 * @throws CircuitFileError from the engine.
 */
export function circuitCtx(cache: CircuitCache, text: string): CircuitCtx {
	let ctx = cache.get(text);
	if (!ctx) {
		const clean = /^layout:/m.test(text) ? blankLayout(text) : text;
		ctx = { circuit: parseCircuit(clean), text, hash: hashText(text), solves: new Map(), paths: new Map(), diagnoses: new Map(), notes: new Map() };
		cache.set(text, ctx);
	}
	return ctx;
}

function blankLayout(text: string): string {
	const lines = text.split('\n');
	let inLayout = false;
	return lines
		.map((l) => {
			if (/^layout:/.test(l)) inLayout = true;
			else if (inLayout && /^\S/.test(l)) inLayout = false;
			return inLayout ? '' : l;
		})
		.join('\n');
}

/** A settled solve (null for a dead short), cached. @throws the engine's FaultError, SolveOptionError. */
export function solveCached(ctx: CircuitCtx, where: Where, whatIf?: WhatIf): SolveResult | null {
	const k = `${where.state}|${where.fault}|${whatIf ? JSON.stringify(whatIf) : ''}`;
	if (ctx.solves.has(k)) return ctx.solves.get(k)!;
	const r = solveCircuit(ctx.circuit, { state: where.state, fault: where.fault, whatIf });
	const out = 'error' in r ? null : r;
	ctx.solves.set(k, out);
	return out;
}

/** The current path through an element (null for a dead short), cached. */
export function pathCached(ctx: CircuitCtx, through: string, where: Where, whatIf?: WhatIf): string[] | null {
	const k = `${through}|${where.state}|${where.fault}|${whatIf ? JSON.stringify(whatIf) : ''}`;
	if (ctx.paths.has(k)) return ctx.paths.get(k)!;
	let out: string[] | null;
	try {
		out = tracePath(ctx.circuit, { through, state: where.state, fault: where.fault, whatIf }).elements;
	} catch (e) {
		if ((e as Error).name !== 'DeadShortError') throw e;
		out = null;
	}
	ctx.paths.set(k, out);
	return out;
}

/** The shared part of two paths, or null when either is a dead short. */
export function sharedCached(ctx: CircuitCtx, a: string, b: string, where: Where, whatIf?: WhatIf): string[] | null {
	const pa = pathCached(ctx, a, where, whatIf);
	const pb = pathCached(ctx, b, where, whatIf);
	if (!pa || !pb) return null;
	return sharedPath({ elements: pa }, { elements: pb }, ctx.circuit).elements;
}

/** The engine's diagnosis of a complaint, cached. @throws ObservationError. */
export function diagnoseCached(ctx: CircuitCtx, complaint: string): Diagnosis {
	let d = ctx.diagnoses.get(complaint);
	if (!d) {
		d = diagnose(ctx.circuit, parseObservations(complaint));
		ctx.diagnoses.set(complaint, d);
	}
	return d;
}

/** Every element a learner can select on the diagram, in the engine's path order. */
export function selectableElements(c: Circuit): string[] {
	const out: string[] = [];
	for (const p of c.parts) {
		if (p.type === 'relay') out.push(`${p.id}.coil`, `${p.id}.contact`);
		else if (p.type === 'connector') for (let n = 1; n <= (p.cavities ?? 0); n++) out.push(`${p.id}.${n}`);
		else if (p.type !== 'splice') out.push(p.id);
	}
	for (const w of c.wires) out.push(w.id);
	return out;
}

/** Unit of a numeric ask. */
export function unitOf(ask: ScalarAsk): 'V' | 'A' | 'W' | null {
	if (ask.type === 'volts' || ask.type === 'drop') return 'V';
	if (ask.type === 'amps') return 'A';
	if (ask.type === 'watts') return 'W';
	return null;
}

/** The value of a scalar ask in a solve: volts and drops in V (1 mV), amps in A (0.1 mA), watts in W (1 mW). */
export function scalarOf(ctx: CircuitCtx, ask: ScalarAsk, r: SolveResult): Value {
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
			const p = ctx.circuit.parts.find((x) => x.id === ask.part)!;
			const dv = Math.abs(r.nodes[`${p.id}.${p.pins[0]}`] - r.nodes[`${p.id}.${p.pins[1]}`]);
			return Math.round(dv * r.parts[ask.part].amps * 1000) / 1000;
		}
		case 'drop':
			return Math.round((nodeVolts(ctx, r, ask.from) - nodeVolts(ctx, r, ask.to)) * 1000) / 1000;
	}
}

function nodeVolts(ctx: CircuitCtx, r: SolveResult, name: string): number {
	const pt = ctx.circuit.points.find((p) => p.label === name);
	return pt ? r.points[name].volts : r.nodes[name];
}

/** The reading class that goes with a volts ask (null for other asks). */
export function readsOf(ask: ScalarAsk, r: SolveResult): Reads | null {
	return ask.type === 'volts' ? r.points[ask.point].reads : null;
}

/**
 * Checks that the names of a scalar ask exist in the circuit.
 * @throws ItemError naming the missing point, part, state or node.
 */
export function checkScalarAsk(ctx: CircuitCtx, ask: ScalarAsk, key = 'ask'): void {
	const c = ctx.circuit;
	checkWhere(ctx, ask, key);
	const points = c.points.map((p) => p.label);
	if (ask.type === 'volts' || ask.type === 'reads') {
		if (!points.includes(ask.point))
			throw new ItemError(key, `point "${ask.point}" is not a labelled point of the circuit`, `use one of ${points.join(', ') || '(none: add points: to the circuit)'}`);
	} else if (ask.type === 'drop') {
		for (const n of [ask.from, ask.to])
			if (!points.includes(n) && !c.nodeNames.slice(0, c.fileNodeCount).includes(n))
				throw new ItemError(key, `"${n}" is neither a labelled point nor a node of the circuit`, `name a point (${points.join(', ')}) or a node such as B+, GND or M1.2`);
	} else {
		const p = c.parts.find((x) => x.id === ask.part);
		if (!p) throw new ItemError(key, `part "${ask.part}" is not in the circuit`, `use one of ${c.parts.map((x) => x.id).join(', ')}`);
		if (ask.type === 'watts' && !LOAD_TYPES.has(p.type))
			throw new ItemError(key, `watts asks need a load; ${p.id} is a ${p.type}`, 'ask watts of a lamp, motor, horn, heater or solenoid');
		if (ask.type === 'status' && ['resistor', 'supply', 'connector', 'splice', 'ground'].includes(p.type))
			throw new ItemError(key, `${p.id} is a ${p.type}, which has no status`, 'ask the status of a load, relay, fuse, switch or diode');
	}
}

/** @throws ItemError for an unknown state. */
export function checkWhere(ctx: CircuitCtx, w: Where, key = 'ask'): void {
	const states = ctx.circuit.states.map((s) => s.name);
	if (w.state !== null && !states.includes(w.state))
		throw new ItemError(key, `state "${w.state}" is not a state of the circuit`, `use one of ${states.join(', ') || '(none: add states: to the circuit)'}`);
}

/** The value of a scalar ask, solved; throws ItemError on a dead short. */
export function evalScalar(ctx: CircuitCtx, ask: ScalarAsk, whatIf?: WhatIf): { value: Value; reads: Reads | null; result: SolveResult } {
	const r = solveCached(ctx, ask, whatIf);
	if (!r) throw new ItemError('ask', `the fault ${ask.fault} makes a dead short in state ${ask.state}, so there is no reading to ask about`, 'choose another fault or state');
	return { value: scalarOf(ctx, ask, r), reads: readsOf(ask, r), result: r };
}

/** One what-if variant of an ask: the mistake it models and how to compute it. */
export type Variant = { tag: string; where: Where; whatIf?: WhatIf };

/**
 * The mistakes worth modelling for an ask in a state with a fault, in a fixed order: the fault
 * ignored; each relay held in the other state; no fuse opening; the far side of an open; a test lamp
 * in place of the meter (point asks); each other state of the circuit.
 */
export function variantsFor(ctx: CircuitCtx, where: Where, keyResult: SolveResult, pointAsk: boolean): Variant[] {
	const c = ctx.circuit;
	const out: Variant[] = [];
	if (where.fault) out.push({ tag: 'fault-ignored', where: { state: where.state, fault: null } });
	for (const p of c.parts) {
		if (p.type !== 'relay') continue;
		const st = keyResult.parts[p.id].status;
		if (st === 'released') out.push({ tag: 'relay-still-energized', where, whatIf: { relays: { [p.id]: 'energized' } } });
		else if (st === 'energized') out.push({ tag: 'relay-assumed-released', where, whatIf: { relays: { [p.id]: 'released' } } });
	}
	const fuseOpenedByFault = where.fault?.startsWith('open:') ? where.fault.slice(5) : null;
	if (c.parts.some((p) => ['fuse', 'fusible-link', 'breaker'].includes(p.type) && p.id !== fuseOpenedByFault && ['blown', 'tripped'].includes(keyResult.parts[p.id].status ?? '')))
		out.push({ tag: 'fuse-assumed-intact', where, whatIf: { noFuseOpens: true } });
	if (pointAsk && where.fault?.startsWith('open:')) out.push({ tag: 'far-side-of-open', where, whatIf: { farSideOfOpen: true } });
	if (pointAsk) out.push({ tag: 'meter-read-as-lamp', where, whatIf: { lampReadings: true } });
	for (const s of c.states) if (s.name !== where.state) out.push({ tag: 'other-switch-position', where: { state: s.name, fault: where.fault } });
	return out;
}

/** The engine's sentences on relays, fuses and (optionally) one point, for feedback. */
export function engineNotes(ctx: CircuitCtx, where: Where, point?: string): string[] {
	const k = `${where.state}|${where.fault}|${point ?? ''}`;
	let out = ctx.notes.get(k);
	if (!out) ctx.notes.set(k, (out = notesOf(ctx, where, point)));
	return out;
}

function notesOf(ctx: CircuitCtx, where: Where, point?: string): string[] {
	const e = explainSolve(ctx.circuit, { state: where.state, fault: where.fault });
	if ('error' in e) return [e.text];
	const out: string[] = [];
	for (const r of e.relays) out.push(r.text);
	for (const f of e.fuses) if (f.opened) out.push(f.text);
	if (point) {
		const p = e.points.find((x) => x.point === point);
		if (p) out.push(p.text);
	}
	return out;
}
