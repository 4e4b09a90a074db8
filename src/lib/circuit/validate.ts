/**
 * Validation of a circuit file and construction of the engine's model. Every problem is collected in
 * one pass, each with its 1-based line and a key naming where it is (`parts.K1.pull_in`, `wires.W3`).
 */
import type { Problem } from './errors';
import { readYaml, type Located } from './parse';
import {
	FUSE_TYPES,
	LOAD_TYPES,
	makeElement,
	PART_TYPES,
	type Circuit,
	type CircuitState,
	type NetElement,
	type Part,
	type PartType,
	type SwitchPosition,
	type Wire
} from './model';
import {
	AWG_OHM_PER_1000FT,
	DIODE_DEFAULTS,
	FUSE_OHMS,
	IEC_60228_CLASS5_MOHM_PER_M,
	METRES_PER_FOOT,
	RELAY_DEFAULTS
} from './tables';


const ALLOWED_KEYS: Record<PartType, readonly string[]> = {
	fuse: ['type', 'amps'],
	'fusible-link': ['type', 'amps'],
	breaker: ['type', 'amps'],
	relay: ['type', 'coil_ohms', 'pull_in', 'drop_out'],
	switch: ['type', 'normally', 'positions'],
	lamp: ['type', 'ohms', 'watts', 'amps'],
	motor: ['type', 'ohms', 'watts', 'amps'],
	horn: ['type', 'ohms', 'watts', 'amps'],
	heater: ['type', 'ohms', 'watts', 'amps'],
	solenoid: ['type', 'ohms', 'watts', 'amps'],
	resistor: ['type', 'ohms'],
	diode: ['type', 'drop', 'ohms'],
	supply: ['type', 'volts'],
	connector: ['type', 'cavities'],
	splice: ['type'],
	ground: ['type', 'ohms']
};

const WIRE_KEYS = ['from', 'to', 'id', 'color', 'ohms', 'gauge_mm2', 'gauge_awg', 'length_m'];
const TOP_KEYS = ['id', 'title', 'supply', 'parts', 'wires', 'points', 'states'];
const BAD_ID = /[.,:\s]/;

/** Pin names of a part type (a positioned switch's pins come from its positions). */
function pinsOf(type: PartType, cavities: number): string[] {
	switch (type) {
		case 'relay':
			return ['30', '85', '86', '87', '87a'];
		case 'diode':
			return ['a', 'k'];
		case 'supply':
			return ['+', '-'];
		case 'connector': {
			const pins: string[] = [];
			for (let n = 1; n <= cavities; n++) pins.push(`${n}a`, `${n}b`);
			return pins;
		}
		case 'splice':
		case 'ground':
			return [];
		default:
			return ['1', '2'];
	}
}

type Ctx = { problems: Problem[] };

function add(ctx: Ctx, line: number, key: string, message: string): void {
	ctx.problems.push({ line, key, message });
}

function num(ctx: Ctx, v: Located, key: string, what: string, min: number, strict: boolean): number | undefined {
	if (v.kind !== 'scalar' || typeof v.value !== 'number' || !Number.isFinite(v.value)) {
		add(ctx, v.line, key, `${what} must be a number`);
		return undefined;
	}
	if (strict ? v.value <= min : v.value < min) {
		add(ctx, v.line, key, `${what} must be ${strict ? 'greater than' : 'at least'} ${min}, got ${v.value}`);
		return undefined;
	}
	return v.value;
}

function str(v: Located): string | undefined {
	if (v.kind !== 'scalar' || v.value === null) return undefined;
	return typeof v.value === 'string' ? v.value : String(v.value);
}

/**
 * Validates circuit file text and builds the model. Returns every problem found (sorted by line, then
 * in the order found) and the circuit when there are none. Never throws.
 */
export function buildCircuit(text: string): { circuit: Circuit | null; problems: Problem[] } {
	const ctx: Ctx = { problems: [] };
	const { root, problems: yamlProblems } = readYaml(text);
	ctx.problems.push(...yamlProblems);
	if (!root || root.kind !== 'map') {
		if (yamlProblems.length === 0)
			add(ctx, root ? root.line : 1, 'file', 'a circuit file must be a map with supply, parts and wires');
		return { circuit: null, problems: sortProblems(ctx.problems) };
	}
	const top = new Map(root.entries.map((e) => [e.key, e]));
	for (const e of root.entries)
		if (!TOP_KEYS.includes(e.key))
			add(ctx, e.keyLine, e.key, `unknown key "${e.key}"; a circuit file has ${TOP_KEYS.join(', ')}`);

	const idEntry = top.get('id');
	const titleEntry = top.get('title');
	const circuitId = idEntry ? (str(idEntry.value) ?? null) : null;
	const title = titleEntry ? (str(titleEntry.value) ?? null) : null;

	// supply
	let supplyVolts = NaN;
	let supplyOhms = 0;
	const supplyEntry = top.get('supply');
	if (!supplyEntry) add(ctx, 1, 'supply', 'supply is missing; give the battery volts, e.g. "supply: 12.6"');
	else if (supplyEntry.value.kind === 'map') {
		for (const e of supplyEntry.value.entries) {
			if (e.key === 'volts') supplyVolts = num(ctx, e.value, 'supply.volts', 'supply volts', 0, true) ?? NaN;
			else if (e.key === 'ohms') supplyOhms = num(ctx, e.value, 'supply.ohms', 'battery internal ohms', 0, false) ?? 0;
			else add(ctx, e.keyLine, `supply.${e.key}`, `unknown key "${e.key}"; supply takes volts and ohms`);
		}
		if (!supplyEntry.value.entries.some((e) => e.key === 'volts'))
			add(ctx, supplyEntry.keyLine, 'supply.volts', 'supply volts are missing; write { volts: 12.6, ohms: 0.01 }');
	} else supplyVolts = num(ctx, supplyEntry.value, 'supply', 'supply volts', 0, true) ?? NaN;

	// parts
	const parts: Part[] = [];
	const partById = new Map<string, Part>();
	const idLines = new Map<string, number>();
	const claimId = (id: string, line: number, key: string) => {
		if (id === 'B+' || id === 'GND') add(ctx, line, key, `"${id}" is a reserved node name; choose another id`);
		else if (BAD_ID.test(id)) add(ctx, line, key, `id "${id}" contains one of . , : or a space; use letters, digits, - or _`);
		const prev = idLines.get(id);
		if (prev !== undefined) add(ctx, line, key, `id "${id}" is already used on line ${prev}; ids must be unique across parts, wires and points`);
		else idLines.set(id, line);
	};
	const partsEntry = top.get('parts');
	if (!partsEntry) add(ctx, 1, 'parts', 'parts are missing; list the parts under "parts:"');
	else if (partsEntry.value.kind !== 'map') add(ctx, partsEntry.keyLine, 'parts', 'parts must be a map of part id to { type: ... }');
	else {
		for (const e of partsEntry.value.entries) {
			const key = `parts.${e.key}`;
			claimId(e.key, e.keyLine, key);
			const part = readPart(ctx, e.key, e.keyLine, e.value, supplyVolts);
			if (part && !partById.has(part.id)) {
				parts.push(part);
				partById.set(part.id, part);
			}
		}
	}

	// node names
	const nodeNames: string[] = ['B+', 'GND'];
	for (const p of parts) {
		if (p.type === 'splice' || p.type === 'ground') nodeNames.push(p.id);
		else for (const pin of p.pins) nodeNames.push(`${p.id}.${pin}`);
	}
	const nodeIdx = new Map(nodeNames.map((n, i) => [n, i]));
	const resolve = (name: string, line: number, key: string): number => {
		const i = nodeIdx.get(name);
		if (i !== undefined) return i;
		const dot = name.indexOf('.');
		if (dot >= 0) {
			const pid = name.slice(0, dot);
			const pin = name.slice(dot + 1);
			const p = partById.get(pid);
			if (!p) add(ctx, line, key, `unknown part "${pid}" in "${name}"; add it under parts or fix the name`);
			else if (p.type === 'splice' || p.type === 'ground')
				add(ctx, line, key, `${pid} is a ${p.type}; name it as "${pid}" without a pin`);
			else add(ctx, line, key, `unknown pin "${pin}" on ${pid} (a ${p.type}); its pins are ${p.pins.join(', ')}`);
		} else {
			const p = partById.get(name);
			if (p) add(ctx, line, key, `${name} is a ${p.type}; name one of its pins (${p.pins.map((x) => `${name}.${x}`).join(', ')})`);
			else add(ctx, line, key, `unknown node "${name}"; use B+, GND, PART.PIN or a splice or ground id`);
		}
		return -1;
	};

	// wires
	const wires: Wire[] = [];
	const wireEnds: [number, number][] = [];
	const wiresEntry = top.get('wires');
	if (!wiresEntry) add(ctx, 1, 'wires', 'wires are missing; list them under "wires:" as "NODE NODE"');
	else if (wiresEntry.value.kind !== 'list') add(ctx, wiresEntry.keyLine, 'wires', 'wires must be a list of "NODE NODE" or { from, to }');
	else {
		wiresEntry.value.items.forEach((item, i) => {
			const w = readWire(ctx, item, i + 1);
			if (!w) return;
			claimId(w.id, w.line, `wires.${w.id}`);
			const a = resolve(w.from, w.line, `wires.${w.id}`);
			const b = resolve(w.to, w.line, `wires.${w.id}`);
			wires.push(w);
			wireEnds.push([a, b]);
		});
	}

	// points
	const points: { label: string; node: string }[] = [];
	const pointsEntry = top.get('points');
	if (pointsEntry) {
		if (pointsEntry.value.kind !== 'map') add(ctx, pointsEntry.keyLine, 'points', 'points must be a map of label to node');
		else
			for (const e of pointsEntry.value.entries) {
				const key = `points.${e.key}`;
				claimId(e.key, e.keyLine, key);
				const node = str(e.value);
				if (node === undefined || e.value.kind !== 'scalar') {
					add(ctx, e.keyLine, key, `point ${e.key} must name one node, e.g. "${e.key}: K1.85"`);
					continue;
				}
				if (resolve(node, e.value.line, key) >= 0) points.push({ label: e.key, node });
			}
	}

	// states
	const states: CircuitState[] = [];
	const statesEntry = top.get('states');
	if (statesEntry) {
		if (statesEntry.value.kind !== 'map') add(ctx, statesEntry.keyLine, 'states', 'states must be a map of state name to settings');
		else
			for (const e of statesEntry.value.entries) {
				const st = readState(ctx, e.key, e.keyLine, e.value, partById);
				if (st) states.push(st);
			}
	}

	// every pin wired
	const wiredCount = new Int32Array(nodeNames.length);
	for (const [a, b] of wireEnds) {
		if (a >= 0) wiredCount[a]++;
		if (b >= 0) wiredCount[b]++;
	}
	for (const p of parts) {
		if (p.type === 'splice' || p.type === 'ground') {
			if (wiredCount[nodeIdx.get(p.id)!] === 0)
				add(ctx, p.line, `parts.${p.id}`, `${p.type} ${p.id} is not wired; wire it or remove it`);
			continue;
		}
		if (p.type === 'connector') {
			for (let n = 1; n <= (p.cavities ?? 0); n++) {
				const wa = wiredCount[nodeIdx.get(`${p.id}.${n}a`)!] > 0;
				const wb = wiredCount[nodeIdx.get(`${p.id}.${n}b`)!] > 0;
				if (wa !== wb)
					add(ctx, p.line, `parts.${p.id}`, `pin ${p.id}.${n}${wa ? 'b' : 'a'} is not wired; a cavity is wired on both sides or neither`);
			}
			continue;
		}
		for (const pin of p.pins) {
			if (p.type === 'relay' && (pin === '87' || pin === '87a')) continue;
			if (wiredCount[nodeIdx.get(`${p.id}.${pin}`)!] === 0)
				add(ctx, p.line, `parts.${p.id}`, `pin ${p.id}.${pin} is not wired; add a wire to it`);
		}
	}

	// ideal wires closing a loop among themselves
	const parent = Array.from({ length: nodeNames.length }, (_, i) => i);
	const find = (x: number): number => {
		while (parent[x] !== x) x = parent[x] = parent[parent[x]];
		return x;
	};
	wires.forEach((w, i) => {
		const [a, b] = wireEnds[i];
		if (w.ohms !== 0 || a < 0 || b < 0) return;
		const ra = find(a);
		const rb = find(b);
		if (ra === rb)
			add(ctx, w.line, `wires.${w.id}`, `ideal wire ${w.id} (${w.from} to ${w.to}) closes a loop of ideal wires; remove it or give it ohms or a size`);
		else parent[ra] = rb;
	});

	if (ctx.problems.length > 0 || !Number.isFinite(supplyVolts)) {
		if (ctx.problems.length === 0) add(ctx, 1, 'supply', 'supply volts are missing');
		return { circuit: null, problems: sortProblems(ctx.problems) };
	}
	const circuit = assemble(circuitId, title, { volts: supplyVolts, ohms: supplyOhms }, parts, wires, points, states, nodeNames, wireEnds);
	return { circuit, problems: [] };
}

function sortProblems(ps: Problem[]): Problem[] {
	return ps.map((p, i) => ({ p, i })).sort((x, y) => x.p.line - y.p.line || x.i - y.i).map((x) => x.p);
}

function readPart(ctx: Ctx, id: string, line: number, v: Located, supplyVolts: number): Part | null {
	const key = `parts.${id}`;
	if (v.kind !== 'map') {
		add(ctx, line, key, `part ${id} must be a map such as { type: fuse, amps: 10 }`);
		return null;
	}
	const typeEntry = v.entries.find((e) => e.key === 'type');
	const type = typeEntry ? str(typeEntry.value) : undefined;
	if (!typeEntry || type === undefined) {
		add(ctx, line, key, `part ${id} has no type; give one of ${PART_TYPES.join(', ')}`);
		return null;
	}
	if (!(PART_TYPES as readonly string[]).includes(type)) {
		add(ctx, typeEntry.value.line, `${key}.type`, `unknown part type "${type}"; use one of ${PART_TYPES.join(', ')}`);
		return null;
	}
	const t = type as PartType;
	const allowed = ALLOWED_KEYS[t];
	const get = (k: string) => v.entries.find((e) => e.key === k);
	for (const e of v.entries)
		if (!allowed.includes(e.key))
			add(ctx, e.keyLine, `${key}.${e.key}`, `unknown key "${e.key}" on ${id} (a ${t}); allowed: ${allowed.join(', ')}`);
	const part: Part = { id, type: t, line, pins: [] };
	const numKey = (k: string, what: string, min: number, strict: boolean, required: boolean): number | undefined => {
		const e = get(k);
		if (!e) {
			if (required) add(ctx, line, `${key}.${k}`, `${id} needs ${k} (${what})`);
			return undefined;
		}
		return num(ctx, e.value, `${key}.${k}`, `${id} ${k}`, min, strict);
	};
	if (FUSE_TYPES.has(t)) {
		part.rating = numKey('amps', 'its rating in A', 0, true, true);
		part.ohms = FUSE_OHMS;
	} else if (t === 'relay') {
		part.ohms = numKey('coil_ohms', 'coil resistance in ohms', 0, true, false) ?? RELAY_DEFAULTS.coil_ohms;
		part.pullIn = numKey('pull_in', 'pull-in volts', 0, true, false) ?? RELAY_DEFAULTS.pull_in;
		part.dropOut = numKey('drop_out', 'drop-out volts', 0, false, false) ?? RELAY_DEFAULTS.drop_out;
		if (part.dropOut > part.pullIn)
			add(ctx, line, `${key}.drop_out`, `${id} drop_out (${part.dropOut} V) is above pull_in (${part.pullIn} V); drop_out must not exceed pull_in`);
	} else if (t === 'switch') {
		const pos = get('positions');
		const norm = get('normally');
		if (pos) {
			if (norm) add(ctx, norm.keyLine, `${key}.normally`, `${id} has positions, so it has no "normally"; the first position is its rest`);
			part.positions = readPositions(ctx, id, pos.value, key);
			const pins: string[] = [];
			for (const p of part.positions) for (const pr of p.pairs) for (const pin of pr) if (!pins.includes(pin)) pins.push(pin);
			part.pins = pins;
		} else {
			part.normally = 'open';
			if (norm) {
				const s = str(norm.value);
				if (s === 'open' || s === 'closed') part.normally = s;
				else add(ctx, norm.value.line, `${key}.normally`, `${id} normally must be open or closed, got "${s}"`);
			}
		}
	} else if (LOAD_TYPES.has(t)) {
		const given = v.entries.map((e) => e.key).filter((k) => k === 'ohms' || k === 'watts' || k === 'amps');
		if (given.length !== 1) {
			add(
				ctx,
				given.length ? get(given[1])!.keyLine : line,
				key,
				given.length
					? `${id} has ${given.join(' and ')}; a load takes exactly one of ohms, watts, amps`
					: `${id} needs exactly one of ohms, watts, amps`
			);
		} else {
			const k = given[0];
			const val = numKey(k, '', 0, true, true);
			if (val !== undefined) part.ohms = k === 'ohms' ? val : k === 'watts' ? (supplyVolts * supplyVolts) / val : supplyVolts / val;
		}
	} else if (t === 'resistor') {
		part.ohms = numKey('ohms', 'its resistance in ohms', 0, true, true);
	} else if (t === 'diode') {
		part.drop = numKey('drop', 'forward drop in V', 0, false, false) ?? DIODE_DEFAULTS.drop;
		part.ohms = numKey('ohms', 'on-resistance in ohms', 0, true, false) ?? DIODE_DEFAULTS.ohms;
	} else if (t === 'supply') {
		const e = get('volts');
		if (!e) add(ctx, line, `${key}.volts`, `${id} needs volts`);
		else if (e.value.kind !== 'scalar' || typeof e.value.value !== 'number' || !Number.isFinite(e.value.value))
			add(ctx, e.value.line, `${key}.volts`, `${id} volts must be a number`);
		else part.volts = e.value.value;
	} else if (t === 'connector') {
		const c = numKey('cavities', 'how many cavities', 1, false, true);
		if (c !== undefined && !Number.isInteger(c)) add(ctx, get('cavities')!.value.line, `${key}.cavities`, `${id} cavities must be a whole number`);
		else part.cavities = c;
	} else if (t === 'ground') {
		part.ohms = numKey('ohms', 'bond resistance in ohms', 0, false, false) ?? 0;
	}
	if (t !== 'switch' || !part.positions) part.pins = pinsOf(t, part.cavities ?? 0);
	return part;
}

function readPositions(ctx: Ctx, id: string, v: Located, key: string): SwitchPosition[] {
	const out: SwitchPosition[] = [];
	if (v.kind !== 'map' || v.entries.length === 0) {
		add(ctx, v.line, `${key}.positions`, `${id} positions must be a map like { off: [], on: ["1-2"] }`);
		return out;
	}
	for (const e of v.entries) {
		const pairs: [string, string][] = [];
		if (e.value.kind !== 'list') {
			add(ctx, e.keyLine, `${key}.positions.${e.key}`, `position ${e.key} must list pin pairs, e.g. ["B-L"] or []`);
			continue;
		}
		for (const it of e.value.items) {
			const s = str(it);
			const m = s ? s.split('-') : [];
			if (m.length !== 2 || !m[0] || !m[1] || m[0] === m[1] || BAD_ID.test(m[0]) || BAD_ID.test(m[1]))
				add(ctx, it.line, `${key}.positions.${e.key}`, `"${s}" is not a pin pair; write two different pin names joined by -, e.g. "B-L"`);
			else pairs.push([m[0], m[1]]);
		}
		out.push({ name: e.key, pairs });
	}
	return out;
}

function readWire(ctx: Ctx, item: Located, position: number): Wire | null {
	const fallbackId = `W${position}`;
	if (item.kind === 'scalar') {
		const s = str(item) ?? '';
		const ends = s.trim().split(/\s+/).filter(Boolean);
		if (ends.length !== 2) {
			add(ctx, item.line, `wires.${fallbackId}`, `wire "${s}" must name exactly two nodes separated by a space`);
			return null;
		}
		return { id: fallbackId, from: ends[0], to: ends[1], ohms: 0, line: item.line };
	}
	if (item.kind !== 'map') {
		add(ctx, item.line, `wires.${fallbackId}`, 'a wire is "NODE NODE" or { from, to, ... }');
		return null;
	}
	const get = (k: string) => item.entries.find((e) => e.key === k);
	const idE = get('id');
	const id = idE ? (str(idE.value) ?? fallbackId) : fallbackId;
	const key = `wires.${id}`;
	let bad = false;
	for (const e of item.entries)
		if (!WIRE_KEYS.includes(e.key)) add(ctx, e.keyLine, `${key}.${e.key}`, `unknown key "${e.key}" on wire ${id}; allowed: ${WIRE_KEYS.join(', ')}`);
	const from = get('from');
	const to = get('to');
	const fromS = from ? str(from.value) : undefined;
	const toS = to ? str(to.value) : undefined;
	if (!fromS || !toS) {
		add(ctx, item.line, key, `wire ${id} needs both from and to`);
		bad = true;
	}
	const ohmsE = get('ohms');
	const mm2 = get('gauge_mm2');
	const awg = get('gauge_awg');
	const len = get('length_m');
	let ohms = 0;
	if (ohmsE && (mm2 || awg)) {
		add(ctx, ohmsE.keyLine, key, `wire ${id} has both ohms and a size; give one of them`);
		bad = true;
	} else if (mm2 && awg) {
		add(ctx, awg.keyLine, key, `wire ${id} has both gauge_mm2 and gauge_awg; give one size`);
		bad = true;
	} else if (ohmsE) {
		const v = num(ctx, ohmsE.value, `${key}.ohms`, `wire ${id} ohms`, 0, false);
		if (v === undefined) bad = true;
		else ohms = v;
		if (len) add(ctx, len.keyLine, `${key}.length_m`, `wire ${id} has length_m with ohms; length_m goes with gauge_mm2 or gauge_awg`);
	} else if (mm2 || awg) {
		const e = (mm2 ?? awg)!;
		const table = mm2 ? IEC_60228_CLASS5_MOHM_PER_M : AWG_OHM_PER_1000FT;
		const name = mm2 ? 'gauge_mm2' : 'gauge_awg';
		const size = e.value.kind === 'scalar' && typeof e.value.value === 'number' ? e.value.value : NaN;
		const per = table.get(size);
		if (per === undefined) {
			add(ctx, e.value.line, `${key}.${name}`, `wire ${id} ${name} ${str(e.value)} is not in the table; use one of ${[...table.keys()].join(', ')}`);
			bad = true;
		}
		if (!len) {
			add(ctx, e.keyLine, `${key}.length_m`, `wire ${id} has a size but no length_m; add length_m in metres`);
			bad = true;
		} else {
			const l = num(ctx, len.value, `${key}.length_m`, `wire ${id} length_m`, 0, true);
			if (l === undefined) bad = true;
			else if (per !== undefined) ohms = mm2 ? (per / 1000) * l : (per / 1000) * (l / METRES_PER_FOOT);
		}
	} else if (len) {
		add(ctx, len.keyLine, `${key}.length_m`, `wire ${id} has length_m but no size; add gauge_mm2 or gauge_awg`);
		bad = true;
	}
	const color = get('color');
	if (color && color.value.kind !== 'scalar') add(ctx, color.keyLine, `${key}.color`, `wire ${id} color must be letter codes like GN/WH`);
	if (bad && (!fromS || !toS)) return null;
	return { id, from: fromS ?? '', to: toS ?? '', ohms, line: item.line, color: color ? str(color.value) : undefined };
}

function readState(ctx: Ctx, name: string, line: number, v: Located, partById: Map<string, Part>): CircuitState | null {
	const st: CircuitState = { name, line, switches: {}, resistors: {} };
	if (v.kind === 'scalar' && v.value === null) return st;
	if (v.kind !== 'map') {
		add(ctx, line, `states.${name}`, `state ${name} must be a map like { S1: closed }`);
		return null;
	}
	for (const e of v.entries) {
		const key = `states.${name}.${e.key}`;
		if (e.key === 'supply') {
			const volts = num(ctx, e.value, key, `state ${name} supply volts`, 0, true);
			if (volts !== undefined) st.supply = volts;
			continue;
		}
		const p = partById.get(e.key);
		if (!p) {
			add(ctx, e.keyLine, key, `state ${name} names "${e.key}", which is not a part; fix the id or add the part`);
			continue;
		}
		if (p.type === 'switch') {
			const s = str(e.value);
			if (p.positions) {
				if (e.value.kind !== 'scalar' || !p.positions.some((x) => x.name === s))
					add(ctx, e.keyLine, key, `${p.id} has no position "${s}"; its positions are ${p.positions.map((x) => x.name).join(', ')}`);
				else st.switches[p.id] = s!;
			} else if (s === 'open' || s === 'closed') st.switches[p.id] = s;
			else add(ctx, e.keyLine, key, `${p.id} is a switch; set it open or closed, not "${s}"`);
		} else if (p.type === 'resistor') {
			const o = e.value.kind === 'map' ? e.value.entries.find((x) => x.key === 'ohms') : undefined;
			if (!o || e.value.kind !== 'map' || e.value.entries.length !== 1)
				add(ctx, e.keyLine, key, `${p.id} is a resistor; set it as { ohms: N }`);
			else {
				const val = num(ctx, o.value, `${key}.ohms`, `${p.id} ohms`, 0, true);
				if (val !== undefined) st.resistors[p.id] = val;
			}
		} else add(ctx, e.keyLine, key, `${p.id} is a ${p.type}, which has no setting a state can change; states set switches, resistor ohms and supply`);
	}
	return st;
}

function assemble(
	id: string | null,
	title: string | null,
	supply: { volts: number; ohms: number },
	parts: Part[],
	wires: Wire[],
	points: { label: string; node: string }[],
	states: CircuitState[],
	fileNodes: string[],
	wireEnds: [number, number][]
): Circuit {
	const nodeNames = fileNodes.slice();
	const idx = new Map(fileNodes.map((n, i) => [n, i]));
	const elements: NetElement[] = [];
	let plus = 0;
	if (supply.ohms > 0) {
		plus = nodeNames.length;
		nodeNames.push('B+#emf');
	}
	elements.push(makeElement('battery', null, 'source', 'source', plus, 1, 0, supply.volts, -1, undefined, undefined, undefined, undefined, true));
	if (supply.ohms > 0) elements.push(makeElement('battery#ohms', null, 'source', 'resistor', plus, 0, supply.ohms, 0, -1));
	for (let pi = 0; pi < parts.length; pi++) {
		const p = parts[pi];
		const id = p.id;
		const pin = (x: string) => idx.get(`${id}.${x}`)!;
		if (FUSE_TYPES.has(p.type)) elements.push(makeElement(id, id, 'part', 'fuse', pin('1'), pin('2'), FUSE_OHMS, 0, pi));
		else if (p.type === 'relay') {
			elements.push(makeElement(`${id}.coil`, `${id}.coil`, 'part', 'coil', pin('86'), pin('85'), p.ohms!, 0, pi));
			elements.push(makeElement(`${id}.contact`, `${id}.contact`, 'part', 'no', pin('30'), pin('87'), 0, 0, pi));
			elements.push(makeElement(`${id}.contact`, `${id}.contact`, 'part', 'nc', pin('30'), pin('87a'), 0, 0, pi));
		} else if (p.type === 'switch') {
			if (p.positions) {
				for (const pos of p.positions)
					for (const [x, y] of pos.pairs) {
						elements.push(makeElement(id, id, 'part', 'position', pin(x), pin(y), 0, 0, pi, pos.name));
					}
			} else elements.push(makeElement(id, id, 'part', 'switch', pin('1'), pin('2'), 0, 0, pi));
		} else if (LOAD_TYPES.has(p.type) || p.type === 'resistor') elements.push(makeElement(id, id, 'part', 'resistor', pin('1'), pin('2'), p.ohms!, 0, pi));
		else if (p.type === 'diode') {
			elements.push(makeElement(id, id, 'part', 'diode', pin('a'), pin('k'), p.ohms!, p.drop!, pi, undefined, undefined, undefined, nodeNames.length));
			nodeNames.push(`${id}#int`);
		} else if (p.type === 'supply') elements.push(makeElement(id, id, 'source', 'source', pin('+'), pin('-'), 0, p.volts!, pi));
		else if (p.type === 'connector') {
			for (let n = 1; n <= p.cavities!; n++) elements.push(makeElement(`${id}.${n}`, `${id}.${n}`, 'part', 'ideal', pin(`${n}a`), pin(`${n}b`), 0, 0, pi));
		} else if (p.type === 'ground') {
			const g = idx.get(id)!;
			elements.push(makeElement(id, id, 'part', p.ohms! > 0 ? 'resistor' : 'ideal', g, 1, p.ohms!, 0, pi));
		}
	}
	for (let i = 0; i < wires.length; i++) {
		const w = wires[i];
		elements.push(makeElement(w.id, w.id, 'wire', w.ohms > 0 ? 'resistor' : 'ideal', wireEnds[i][0], wireEnds[i][1], w.ohms, 0, -1));
	}
	return {
		id,
		title,
		supply,
		parts,
		wires,
		points,
		states,
		nodeNames,
		fileNodeCount: fileNodes.length,
		elements,
		fault: null,
		deadCoils: [],
		openedParts: []
	};
}

