/**
 * Faults: reading and writing them, the spec's standard fault list, and applying one to a circuit.
 * `applyFault` is pure: it returns a new circuit and never changes the one given.
 */
import { FaultError } from './errors';
import { FUSE_TYPES, LOAD_TYPES, elementWith, makeElement, type Circuit, type NetElement, type Part } from './model';
import { HIGH_RESISTANCE_DEFAULT_OHMS, SHORT_OHMS } from './tables';

/** The fault kinds of the spec. */
export type FaultKind =
	| 'open'
	| 'shorted'
	| 'stuck-closed'
	| 'short-to-ground'
	| 'short-to-power'
	| 'short-between'
	| 'high-resistance';

/** One fault. `target` is a wire, part, `K1.coil`, `K1.87`, `K1.87a`, cavity `C1.3`, or `W3,W7` for short-between. `ohms` only for high-resistance (default 1 Ω). */
export type Fault = { kind: FaultKind; target: string; ohms?: number };

const KINDS: readonly FaultKind[] = ['open', 'shorted', 'stuck-closed', 'short-to-ground', 'short-to-power', 'short-between', 'high-resistance'];

/**
 * Reads `KIND:TARGET[:OHMS]`, e.g. `open:W3`, `high-resistance:G2:2.5`, `short-between:W3,W7`.
 * Checks only the form (the target is checked against a circuit by `applyFault`).
 * @throws FaultError naming what is wrong.
 */
export function parseFault(text: string): Fault {
	const t = text.trim();
	const parts = t.split(':');
	if (parts.length < 2 || parts.length > 3 || !parts[1])
		throw new FaultError(t, `fault "${t}" must be KIND:TARGET or high-resistance:TARGET:OHMS, e.g. open:W3`);
	const kind = parts[0] as FaultKind;
	if (!KINDS.includes(kind)) throw new FaultError(t, `unknown fault kind "${parts[0]}"; use one of ${KINDS.join(', ')}`);
	const target = parts[1];
	if (kind === 'short-between') {
		const ws = target.split(',');
		if (ws.length !== 2 || !ws[0] || !ws[1] || ws[0] === ws[1])
			throw new FaultError(t, `short-between needs two different wires, e.g. short-between:W3,W7`);
	} else if (target.includes(',')) throw new FaultError(t, `fault ${kind} takes one target, not "${target}"`);
	if (parts.length === 3) {
		if (kind !== 'high-resistance') throw new FaultError(t, `only high-resistance takes ohms; write ${kind}:${target}`);
		const ohms = Number(parts[2]);
		if (!parts[2] || !Number.isFinite(ohms) || ohms <= 0) throw new FaultError(t, `fault ohms "${parts[2]}" must be a number above 0`);
		return { kind, target, ohms };
	}
	return { kind, target };
}

/** Writes a fault as candidates are written: `KIND:TARGET`, without ohms. */
export function formatFault(f: Fault): string {
	return `${f.kind}:${f.target}`;
}

/** Writes a fault with its ohms when they were given (`high-resistance:G2:2.5`), as results echo it. */
export function describeFault(f: Fault): string {
	return f.ohms !== undefined ? `${f.kind}:${f.target}:${f.ohms}` : formatFault(f);
}

function isTwoPin(p: Part): boolean {
	return (
		FUSE_TYPES.has(p.type) ||
		(p.type === 'switch' && !p.positions) ||
		LOAD_TYPES.has(p.type) ||
		p.type === 'resistor' ||
		p.type === 'diode' ||
		p.type === 'supply'
	);
}

/**
 * The spec's standard fault list, in order: for each wire `open`, `short-to-ground`,
 * `high-resistance` (1 Ω); then for each part `open` (two-pin parts and grounds), `shorted` (loads,
 * resistors), for a relay `open` on coil, 87, 87a, `shorted` coil, `stuck-closed`; for a single-throw
 * switch `stuck-closed`; for a connector `open` then `high-resistance` on each cavity in turn.
 */
export function standardFaults(c: Circuit): Fault[] {
	const out: Fault[] = [];
	for (const w of c.wires) {
		out.push({ kind: 'open', target: w.id }, { kind: 'short-to-ground', target: w.id });
		out.push({ kind: 'high-resistance', target: w.id, ohms: HIGH_RESISTANCE_DEFAULT_OHMS });
	}
	for (const p of c.parts) {
		if (isTwoPin(p) || p.type === 'ground') out.push({ kind: 'open', target: p.id });
		if (LOAD_TYPES.has(p.type) || p.type === 'resistor') out.push({ kind: 'shorted', target: p.id });
		if (p.type === 'relay') {
			out.push({ kind: 'open', target: `${p.id}.coil` }, { kind: 'open', target: `${p.id}.87` }, { kind: 'open', target: `${p.id}.87a` });
			out.push({ kind: 'shorted', target: `${p.id}.coil` }, { kind: 'stuck-closed', target: p.id });
		}
		if (p.type === 'switch' && !p.positions) out.push({ kind: 'stuck-closed', target: p.id });
		if (p.type === 'connector')
			for (let n = 1; n <= (p.cavities ?? 0); n++)
				out.push({ kind: 'open', target: `${p.id}.${n}` }, { kind: 'high-resistance', target: `${p.id}.${n}`, ohms: HIGH_RESISTANCE_DEFAULT_OHMS });
	}
	return out;
}

/** Accepts a fault object or its text form. @throws FaultError for unreadable text. */
export function toFault(f: Fault | string): Fault {
	return typeof f === 'string' ? parseFault(f) : f;
}

/**
 * Applies one fault to a circuit and returns the faulted circuit (the input is unchanged). Faults on
 * a wire act at its midpoint: the wire is split into halves `W3#1` (from its first node to `W3#mid`)
 * and `W3#2`, each with half its resistance, and the fault element (`fault`, 0.01 Ω for shorts) sits
 * at the midpoint (a high resistance sits between `W3#mid1` and `W3#mid2`).
 * @throws FaultError when the target does not exist or the kind does not fit it.
 */
export function applyFault(c: Circuit, fault: Fault | string): Circuit {
	const f = toFault(fault);
	const text = describeFault(f);
	let byFault = faultCache.get(c);
	if (!byFault) faultCache.set(c, (byFault = new Map()));
	const hit = byFault.get(text);
	if (hit) return hit;
	const out = buildFaulted(c, f, text);
	if (byFault.size > 1024) byFault.clear();
	byFault.set(text, out);
	return out;
}

/**
 * The same faulted circuit as `applyFault`, built without caching it: for a diagnosis, which uses
 * each of its ~200 faulted circuits once and keeps nothing of them.
 * @throws FaultError as `applyFault`.
 */
export function faultedCircuit(c: Circuit, fault: Fault | string): Circuit {
	const f = toFault(fault);
	const text = describeFault(f);
	return faultCache.get(c)?.get(text) ?? buildFaulted(c, f, text);
}

/** Faulted circuits by circuit and fault text; circuits are never changed, so a repeat returns the same object. */
const faultCache = new WeakMap<Circuit, Map<string, Circuit>>();

type FaultCtx = { c: Circuit; f: Fault; text: string; nodeNames: string[]; elements: NetElement[] };

function findWire(c: Circuit, id: string): Circuit['wires'][number] | undefined {
	for (const w of c.wires) if (w.id === id) return w;
	return undefined;
}

function findPart(c: Circuit, id: string): Circuit['parts'][number] | undefined {
	for (const p of c.parts) if (p.id === id) return p;
	return undefined;
}

function failWith(text: string, msg: string): never {
	throw new FaultError(text, msg);
}

function faultElement(a: number, b: number, ohms: number): NetElement {
	return makeElement('fault', null, 'fault', 'resistor', a, b, ohms, 0, -1);
}

/** Splits wire `id` at its midpoint; returns [first-half end node, second-half start node]. */
function splitWire(x: FaultCtx, id: string, series: boolean): [number, number] {
	ownArrays(x);
	const i = x.elements.findIndex((e) => e.kind === 'wire' && e.id === id);
	const e = x.elements[i];
	const m1 = x.nodeNames.length;
	x.nodeNames.push(series ? `${id}#mid1` : `${id}#mid`);
	let m2 = m1;
	if (series) {
		m2 = x.nodeNames.length;
		x.nodeNames.push(`${id}#mid2`);
	}
	const half = e.ohms / 2;
	const role = e.ohms > 0 ? 'resistor' : 'ideal';
	const h1 = elementWith(e, { id: `${id}#1`, b: m1, ohms: half, role });
	const h2 = elementWith(e, { id: `${id}#2`, a: m2, ohms: half, role });
	x.elements.splice(i, 1, h1, h2);
	return [m1, m2];
}

/** Copies the circuit's node names and elements before the first change in place (they are shared until then). */
function ownArrays(x: FaultCtx): void {
	if (x.nodeNames === x.c.nodeNames) x.nodeNames = x.nodeNames.slice();
	if (x.elements === x.c.elements) x.elements = x.elements.slice();
}

function needWire(x: FaultCtx, id: string): void {
	if (!findWire(x.c, id)) failWith(x.text, `fault ${x.f.kind} needs a wire; "${id}" is not a wire of this circuit`);
}

function buildFaulted(c: Circuit, f: Fault, text: string): Circuit {
	if (c.fault) throw new FaultError(text, `circuit already has fault ${c.fault}; faults apply one at a time`);
	// copy on write: unchanged elements, and the arrays themselves until a change in place, are shared
	// with the circuit given (circuits are never changed)
	const x: FaultCtx = { c, f, text, nodeNames: c.nodeNames, elements: c.elements };
	let deadCoils = c.deadCoils;
	let openedParts = c.openedParts;
	const dot = f.target.indexOf('.');
	const pid = dot >= 0 ? f.target.slice(0, dot) : f.target;
	const sub = dot >= 0 ? f.target.slice(dot + 1) : '';
	const p = findPart(c, pid);
	const cavity = p && p.type === 'connector' && dot >= 0 ? Number(sub) : NaN;
	const cavityOk = Number.isInteger(cavity) && cavity >= 1 && cavity <= (p?.cavities ?? 0) && String(cavity) === sub;
	switch (f.kind) {
		case 'open': {
			if (findWire(c, f.target)) x.elements = x.elements.filter((e) => !(e.kind === 'wire' && e.id === f.target));
			else if (p && dot < 0 && (isTwoPin(p) || p.type === 'ground')) {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.filter((e) => e.part !== pi || e.kind === 'fault');
				openedParts = [...openedParts, p.id];
			} else if (p && p.type === 'connector' && dot >= 0) {
				if (!cavityOk) failWith(text, `${p.id} has no cavity "${sub}"; its cavities are 1 to ${p.cavities}`);
				x.elements = x.elements.filter((e) => e.id !== f.target);
			} else if (p && p.type === 'relay' && (sub === 'coil' || sub === '87' || sub === '87a')) {
				const pi = c.parts.indexOf(p);
				const role = sub === 'coil' ? 'coil' : sub === '87' ? 'no' : 'nc';
				x.elements = x.elements.filter((e) => !(e.part === pi && e.role === role));
				if (sub === 'coil') deadCoils = [...deadCoils, p.id];
			} else if (p && p.type === 'relay') failWith(text, `open on a relay names K1.coil, K1.87 or K1.87a; "${f.target}" is none of them`);
			else if (p) failWith(text, `open does not apply to ${f.target} (a ${p.type}); it applies to wires, two-pin parts, grounds, cavities and relay coil or contacts`);
			else failWith(text, `unknown fault target "${f.target}"; name a wire, a part, K1.coil, K1.87, K1.87a or a cavity like C1.3`);
			break;
		}
		case 'shorted': {
			if (p && dot < 0 && (LOAD_TYPES.has(p.type) || p.type === 'resistor')) {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.map((e) => (e.part === pi && e.role === 'resistor' ? elementWith(e, { ohms: SHORT_OHMS }) : e));
			} else if (p && p.type === 'relay' && sub === 'coil') {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.map((e) => (e.part === pi && e.role === 'coil' ? elementWith(e, { ohms: SHORT_OHMS, dead: true }) : e));
			} else if (p || findWire(c, f.target)) failWith(text, `shorted applies to a load, a resistor or a relay coil (K1.coil), not ${f.target}`);
			else failWith(text, `unknown fault target "${f.target}"; name a load, a resistor or a relay coil such as K1.coil`);
			break;
		}
		case 'stuck-closed': {
			if (p && dot < 0 && p.type === 'switch' && !p.positions) {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.map((e) => (e.part === pi && e.role === 'switch' ? elementWith(e, { stuck: true }) : e));
			} else if (p && dot < 0 && p.type === 'relay') {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.filter((e) => !(e.part === pi && e.role === 'nc'));
				x.elements = x.elements.map((e) => (e.part === pi && e.role === 'no' ? elementWith(e, { stuck: true }) : e));
			} else if (p || findWire(c, f.target)) failWith(text, `stuck-closed applies to a single-throw switch or a relay, not ${f.target}`);
			else failWith(text, `unknown fault target "${f.target}"; name a single-throw switch or a relay`);
			break;
		}
		case 'short-to-ground':
		case 'short-to-power': {
			needWire(x, f.target);
			const [m] = splitWire(x, f.target, false);
			x.elements.push(faultElement(m, f.kind === 'short-to-ground' ? 1 : 0, SHORT_OHMS));
			break;
		}
		case 'short-between': {
			const [w1, w2] = f.target.split(',');
			if (!w1 || !w2 || w1 === w2) failWith(text, `short-between needs two different wires, e.g. short-between:W3,W7`);
			needWire(x, w1);
			needWire(x, w2);
			const [m1] = splitWire(x, w1, false);
			const [m2] = splitWire(x, w2, false);
			x.elements.push(faultElement(m1, m2, SHORT_OHMS));
			break;
		}
		case 'high-resistance': {
			const ohms = f.ohms ?? HIGH_RESISTANCE_DEFAULT_OHMS;
			if (!(ohms > 0)) failWith(text, `high-resistance ohms must be above 0`);
			if (findWire(c, f.target)) {
				const [m1, m2] = splitWire(x, f.target, true);
				x.elements.push(faultElement(m1, m2, ohms));
			} else if (p && dot < 0 && p.type === 'ground') {
				const pi = c.parts.indexOf(p);
				x.elements = x.elements.map((e) => (e.part === pi ? elementWith(e, { ohms: e.ohms + ohms, role: 'resistor' }) : e));
			} else if (p && p.type === 'connector' && dot >= 0) {
				if (!cavityOk) failWith(text, `${p.id} has no cavity "${sub}"; its cavities are 1 to ${p.cavities}`);
				x.elements = x.elements.map((e) => (e.id === f.target ? elementWith(e, { ohms, role: 'resistor' }) : e));
			} else if (p) failWith(text, `high-resistance applies to a wire, a ground or a connector cavity, not ${f.target}`);
			else failWith(text, `unknown fault target "${f.target}"; name a wire, a ground or a cavity like C1.3`);
			break;
		}
	}
	return { ...c, nodeNames: x.nodeNames, elements: x.elements, fault: text, deadCoils, openedParts };
}
