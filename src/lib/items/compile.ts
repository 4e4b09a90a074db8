/**
 * Compiling one item source into a built item: the engine computes the key and every distractor;
 * a stated key is compared with the engine's; markdown is rendered safely.
 */
import { formatFault, parseFault, parseObservations, solveCircuit, standardFaults, type Observation, type Reads, type SolveResult } from '../circuit';
import { cautionsFor, findSkill } from './blueprint';
import {
	checkScalarAsk,
	checkWhere,
	diagnoseCached,
	engineNotes,
	evalScalar,
	ItemError,
	LOAD_TYPES,
	pathCached,
	scalarOf,
	selectableElements,
	sharedCached,
	solveCached,
	unitOf,
	variantsFor,
	type CircuitCtx
} from './engine';
import { hashText, shortHash, stableJson } from './hash';
import { renderMarkdown } from './render';
import { faultWords } from './words';
import type { Ask, BuiltItem, Claim, Distractor, FeedbackData, ItemSource, Key, Kind, Option, QuestionPayload, ScalarAsk, Value, Where } from './types';

/** Which asks each kind takes. */
export const ASKS_BY_KIND: Record<Kind, Ask['type'][]> = {
	numeric: ['volts', 'amps', 'watts', 'drop'],
	'choose-one': ['volts', 'reads', 'status', 'amps', 'watts', 'drop'],
	'choose-all': ['candidates'],
	'select-diagram': ['path', 'shared', 'opens'],
	'predict-works': ['works'],
	'claim-check': ['claims'],
	'next-test': ['next-test']
};

/** The default tolerance shown to the learner, in the ask's unit (see docs/item-format.md). */
export function defaultTolerance(type: ScalarAsk['type'], key: number): number {
	if (type === 'volts' || type === 'drop') return 0.1;
	if (type === 'amps') return Math.max(Math.abs(key) < 0.1 ? 0.0001 : 0.01, Math.round(Math.abs(key) * 0.02 * 10000) / 10000);
	if (type === 'watts') return Math.max(0.1, Math.round(Math.abs(key) * 0.02 * 100) / 100);
	return 0;
}

/** A value as the learner sees it: volts and watts to 0.01/0.1, amps to 0.01 A or 0.1 mA, words as they are. */
export function formatValue(type: ScalarAsk['type'], v: Value): string {
	if (typeof v === 'string') return v;
	if (type === 'volts' || type === 'drop') return `${v.toFixed(2)} V`;
	if (type === 'amps') return Math.abs(v) < 0.1 ? `${(v * 1000).toFixed(1)} mA` : `${v.toFixed(2)} A`;
	if (type === 'watts') return `${v.toFixed(1)} W`;
	return String(v);
}

/** Options in a fixed order that depends on the item id only. */
function orderOptions(id: string, labels: string[]): Option[] {
	return labels
		.map((l) => ({ id: l, label: l, r: shortHash(`${id}|${l}`) }))
		.sort((a, b) => (a.r < b.r ? -1 : a.r > b.r ? 1 : 0))
		.map(({ id: oid, label }) => ({ id: oid, label }));
}

const setKey = (xs: string[]) => [...xs].sort().join(',');

/** Scalar distractors through the engine's what-if options; dropped when equal to the key or an earlier one. */
function scalarDistractors(ctx: CircuitCtx, ask: ScalarAsk, keyLabel: string, keyResult: SolveResult): Distractor[] {
	const pointAsk = ask.type === 'volts' || ask.type === 'reads';
	const seen = new Set([keyLabel]);
	const out: Distractor[] = [];
	const keyValue = scalarOf(ctx, ask, keyResult);
	const tol = typeof keyValue === 'number' ? defaultTolerance(ask.type, keyValue) : 0;
	const values: number[] = typeof keyValue === 'number' ? [keyValue] : [];
	const add = (tag: string, value: Value, via?: Distractor['via']) => {
		const label = formatValue(ask.type, value);
		if (seen.has(label)) return;
		// a number within the tolerance of the key or of an earlier distractor would grade as the same answer
		if (typeof value === 'number' && values.some((v) => Math.abs(v - value) <= tol + 1e-9)) return;
		seen.add(label);
		if (typeof value === 'number') values.push(value);
		out.push(via ? { tag, value, label, via } : { tag, value, label });
	};
	for (const v of variantsFor(ctx, ask, keyResult, pointAsk)) {
		const r = solveCached(ctx, v.where, v.whatIf);
		if (r) add(v.tag, scalarOf(ctx, { ...ask, ...v.where } as ScalarAsk, r), { ...v.where, ...(v.whatIf ? { whatIf: v.whatIf } : {}) });
	}
	if (ask.type === 'drop') {
		const r = keyResult;
		const pt = ctx.circuit.points.find((p) => p.label === ask.from);
		add('measured-to-ground', pt ? r.points[ask.from].volts : r.nodes[ask.from], { state: ask.state, fault: ask.fault });
	}
	return out;
}

function toleranceFor(src: ItemSource, type: ScalarAsk['type'], key: number): number {
	return src.tolerance ?? defaultTolerance(type, key);
}

function feedbackOf(ctx: CircuitCtx, where: Where, highlight: string[], point?: string): FeedbackData {
	const r = solveCached(ctx, where);
	return {
		state: where.state,
		fault: where.fault,
		highlight,
		readings: r ? { ...r.points } : {},
		notes: engineNotes(ctx, where, point)
	};
}

/** Paths through every working load in a solve, for highlighting. */
function loadPaths(ctx: CircuitCtx, where: Where, loads: string[]): string[] {
	const all = new Set<string>();
	for (const l of loads) for (const e of pathCached(ctx, l, where) ?? []) all.add(e);
	const order = selectableElements(ctx.circuit);
	return order.filter((e) => all.has(e));
}

type Compiled = { question: QuestionPayload; key: Key; distractors: Distractor[]; feedback: FeedbackData; keyText: string };

function compileScalar(ctx: CircuitCtx, src: ItemSource, ask: ScalarAsk): Compiled {
	checkScalarAsk(ctx, ask);
	const { value, reads, result } = evalScalar(ctx, ask);
	const keyLabel = formatValue(ask.type, value);
	const distractors = scalarDistractors(ctx, ask, keyLabel, result);
	const partOf = 'part' in ask ? ask.part : undefined;
	const highlight = partOf ? (pathCached(ctx, partOf, ask) ?? []) : [];
	const feedback = feedbackOf(ctx, ask, highlight, 'point' in ask ? ask.point : undefined);
	if (src.kind === 'numeric') {
		const unit = unitOf(ask);
		if (!unit || typeof value !== 'number') throw new ItemError('kind', `numeric items need a volts, amps, watts or drop ask, not ${ask.type}`, 'use kind choose-one for a status or reading class');
		const tolerance = toleranceFor(src, ask.type, value);
		const quantity = ask.type as 'volts' | 'amps' | 'watts' | 'drop';
		return {
			question: { kind: 'numeric', quantity, unit, tolerance, state: ask.state },
			key: { kind: 'numeric', value, unit, tolerance, reads, emf: reads ? (ctx.circuit.states.find((s) => s.name === ask.state)?.supply ?? ctx.circuit.supply.volts) : null },
			distractors,
			feedback,
			keyText: `${keyLabel} (±${tolerance} ${unit})`
		};
	}
	if (distractors.length === 0)
		throw new ItemError('ask', `no mistake the engine models gives an answer other than the key (${keyLabel}), so a choose-one item would have one option`, 'ask in another state or with a fault, or use kind numeric');
	const options = orderOptions(src.id, [keyLabel, ...distractors.map((d) => d.label)]);
	return {
		question: { kind: 'choose-one', options, state: ask.state },
		key: { kind: 'choose-one', choice: keyLabel, value },
		distractors,
		feedback,
		keyText: keyLabel
	};
}

function compilePath(ctx: CircuitCtx, ask: Extract<Ask, { type: 'path' | 'shared' }>): Compiled {
	checkWhere(ctx, ask);
	const selectable = selectableElements(ctx.circuit);
	const relays = ctx.circuit.parts.filter((p) => p.type === 'relay').map((p) => p.id);
	for (const t of ask.type === 'path' ? [ask.through] : ask.through)
		if (!selectable.includes(t) && !relays.includes(t))
			throw new ItemError('ask', `"${t}" is not an element of the circuit`, `name a part, a wire, K1.coil, K1.contact or a cavity such as C1.2`);
	const compute = (where: Where, whatIf?: Parameters<typeof pathCached>[3]) =>
		ask.type === 'path' ? pathCached(ctx, ask.through, where, whatIf) : sharedCached(ctx, ask.through[0], ask.through[1], where, whatIf);
	const key = compute(ask);
	if (!key) throw new ItemError('ask', `the fault ${ask.fault} makes a dead short in state ${ask.state}, so there is no current path`, 'choose another fault or state');
	const keyResult = solveCached(ctx, ask)!;
	const seen = new Set([setKey(key)]);
	const distractors: Distractor[] = [];
	const add = (tag: string, els: string[] | null, via?: Distractor['via']) => {
		if (!els || els.length === 0 || seen.has(setKey(els))) return;
		seen.add(setKey(els));
		distractors.push(via ? { tag, value: els, label: els.join(', '), via } : { tag, value: els, label: els.join(', ') });
	};
	for (const v of variantsFor(ctx, ask, keyResult, false))
		add(v.tag === 'fault-ignored' ? 'path-without-fault' : v.tag, compute(v.where, v.whatIf), { ...v.where, ...(v.whatIf ? { whatIf: v.whatIf } : {}) });
	if (ask.type === 'shared') add('whole-path-not-shared', pathCached(ctx, ask.through[0], ask));
	return {
		question: { kind: 'select-diagram', selectable, state: ask.state },
		key: { kind: 'select-diagram', elements: key },
		distractors,
		feedback: feedbackOf(ctx, ask, key),
		keyText: key.join(', ') || '(nothing: no current flows)'
	};
}

/**
 * Faults that explain part of a complaint but not all of it: faults of the standard list (in order,
 * up to `limit`, among those `want` accepts) that reproduce its last state's observations (or, for a
 * one-state complaint, its first observation) without being full candidates.
 */
function partialMatches(ctx: CircuitCtx, complaint: string, full: string[], limit: number, want: (fault: string) => boolean = () => true): string[] {
	const obs = parseObservations(complaint);
	let piece: Observation;
	if (obs.length > 1) piece = obs[obs.length - 1];
	else {
		const o = obs[0];
		const [k, v] = Object.entries(o.parts)[0] ?? [];
		const [pk, pv] = Object.entries(o.points)[0] ?? [];
		if (Object.keys(o.parts).length + Object.keys(o.points).length < 2) return [];
		piece = k ? { state: o.state, parts: { [k]: v }, points: {} } : { state: o.state, parts: {}, points: { [pk]: pv } };
	}
	const fullSet = new Set(full);
	const out: string[] = [];
	for (const f of standardFaults(ctx.circuit)) {
		const text = formatFault(f);
		if (fullSet.has(text) || !want(text)) continue;
		const r = solveCached(ctx, { state: piece.state, fault: text });
		if (!r) continue;
		if (Object.entries(piece.parts).every(([id, st]) => r.parts[id].status === st) && Object.entries(piece.points).every(([id, cls]) => r.points[id].reads === cls)) {
			out.push(text);
			if (out.length >= limit) break;
		}
	}
	return out;
}

function complaintDiagnosis(ctx: CircuitCtx, complaint: string) {
	try {
		return diagnoseCached(ctx, complaint);
	} catch (e) {
		if ((e as Error).name === 'ObservationError') throw new ItemError('ask', (e as Error).message, 'write the complaint as "STATE: PART=STATUS, POINT=READS; STATE: ..."');
		throw e;
	}
}

function compileCandidates(ctx: CircuitCtx, src: ItemSource, ask: Extract<Ask, { type: 'candidates' }>): Compiled {
	const d = complaintDiagnosis(ctx, ask.complaint);
	const cands = d.candidates.filter((x) => x !== 'none');
	const partial = partialMatches(ctx, ask.complaint, cands, ask.among ? Infinity : 3);
	let options: string[];
	if (ask.among) {
		const listed = new Set(standardFaults(ctx.circuit).map(formatFault));
		for (const f of ask.among) {
			let text: string;
			try {
				text = formatFault(parseFault(f));
			} catch (e) {
				throw new ItemError('ask', `"${f}" in among is not a fault: ${(e as Error).message}`, 'write faults as KIND:TARGET, e.g. open:W3');
			}
			if (!listed.has(text)) throw new ItemError('ask', `"${f}" in among is not in the circuit's standard fault list`, 'name a fault of the standard list (open, short-to-ground, high-resistance on a wire; open, shorted on a part; ...)');
		}
		options = ask.among.map((f) => formatFault(parseFault(f)));
	} else options = [...cands.slice(0, 4), ...partial.slice(0, 3)];
	const key = options.filter((o) => cands.includes(o));
	if (key.length === 0) throw new ItemError('ask', `none of the options explains the complaint (the engine's candidates: ${cands.join(', ') || 'none'})`, 'include at least one candidate in among');
	const distractors: Distractor[] = options
		.filter((o) => !cands.includes(o))
		.map((o) => ({ tag: partial.includes(o) ? 'explains-part-of-complaint' : 'explains-nothing-observed', value: o, label: faultWords(ctx, o) }));
	if (distractors.length === 0) throw new ItemError('ask', 'every option explains the complaint, so nothing is left to rule out', 'add a fault that does not explain it to among');
	return {
		question: { kind: 'choose-all', options: orderOptions(src.id, options).map((op) => ({ id: op.id, label: faultWords(ctx, op.id) })) },
		key: { kind: 'choose-all', choices: key },
		distractors,
		feedback: { state: null, fault: null, highlight: [], readings: {}, notes: [`the engine's candidates for the complaint: ${cands.join(', ')}`] },
		keyText: key.map((k) => faultWords(ctx, k)).join('; ')
	};
}

function compileOpens(ctx: CircuitCtx, ask: Extract<Ask, { type: 'opens' }>): Compiled {
	const wires = new Set(ctx.circuit.wires.map((w) => w.id));
	const openWires = (cands: string[]) => cands.filter((x) => x.startsWith('open:') && wires.has(x.slice(5))).map((x) => x.slice(5));
	const d = complaintDiagnosis(ctx, ask.complaint);
	const key = openWires(d.candidates);
	if (key.length === 0) throw new ItemError('ask', 'no open wire explains this complaint', 'describe a complaint that an open wire produces');
	const wrong = openWires(partialMatches(ctx, ask.complaint, d.candidates, Infinity, (f) => f.startsWith('open:') && wires.has(f.slice(5)))).filter((w) => !key.includes(w));
	const distractors: Distractor[] = wrong.length ? [{ tag: 'explains-part-of-complaint', value: [...key, ...wrong], label: [...key, ...wrong].join(', ') }] : [];
	return {
		question: { kind: 'select-diagram', selectable: selectableElements(ctx.circuit), state: null },
		key: { kind: 'select-diagram', elements: key },
		distractors,
		feedback: { state: null, fault: null, highlight: key, readings: {}, notes: [`the engine's candidates for the complaint: ${d.candidates.join(', ')}`] },
		keyText: key.join(', ')
	};
}

function compileWorks(ctx: CircuitCtx, ask: Extract<Ask, { type: 'works' }>): Compiled {
	checkWhere(ctx, ask);
	for (const l of ask.loads) {
		const p = ctx.circuit.parts.find((x) => x.id === l);
		if (!p || !LOAD_TYPES.has(p.type)) throw new ItemError('ask', `"${l}" is not a load of the circuit`, 'list lamps, motors, horns, heaters or solenoids');
	}
	const r = solveCached(ctx, ask);
	if (!r) throw new ItemError('ask', `the fault ${ask.fault} makes a dead short in state ${ask.state}`, 'choose another fault or state');
	const statuses = (x: SolveResult) => Object.fromEntries(ask.loads.map((l) => [l, x.parts[l].status ?? 'off']));
	const key = statuses(r);
	const seen = new Set([stableJson(key)]);
	const distractors: Distractor[] = [];
	for (const v of variantsFor(ctx, ask, r, false)) {
		const vr = solveCached(ctx, v.where, v.whatIf);
		if (!vr) continue;
		const m = statuses(vr);
		if (seen.has(stableJson(m))) continue;
		seen.add(stableJson(m));
		distractors.push({ tag: v.tag, value: m, label: ask.loads.map((l) => `${l} ${m[l]}`).join(', '), via: { ...v.where, ...(v.whatIf ? { whatIf: v.whatIf } : {}) } });
	}
	return {
		question: { kind: 'predict-works', loads: ask.loads, statuses: ['on', 'weak', 'off'], state: ask.state },
		key: { kind: 'predict-works', loads: key },
		distractors,
		feedback: feedbackOf(ctx, ask, loadPaths(ctx, ask, ask.loads)),
		keyText: ask.loads.map((l) => `${l} ${key[l]}`).join(', ')
	};
}

/** Whether a claim holds: numbers within the item's tolerance (or the default), words exactly. */
export function claimHolds(claim: Claim, value: Value, tolerance: number | null): boolean {
	if (typeof value === 'number') {
		const is = typeof claim.is === 'number' ? claim.is : Number(claim.is);
		return Number.isFinite(is) && Math.abs(value - is) <= (tolerance ?? defaultTolerance(claim.ask.type, value)) + 1e-9;
	}
	return String(claim.is) === value;
}

function compileClaims(ctx: CircuitCtx, src: ItemSource, claims: Claim[]): Compiled {
	if (claims.length < 1 || claims.length > 2) throw new ItemError('claims', `a claim-check item has one or two statements, not ${claims.length}`, 'write one or two claims');
	const values: Value[] = [];
	const verdicts: boolean[] = [];
	const highlight: string[] = [];
	for (const cl of claims) {
		checkScalarAsk(ctx, cl.ask, 'claims');
		const { value } = evalScalar(ctx, cl.ask);
		values.push(value);
		verdicts.push(claimHolds(cl, value, src.tolerance));
		if ('part' in cl.ask) highlight.push(...(pathCached(ctx, cl.ask.part, cl.ask) ?? []));
	}
	const w = claims[0].ask;
	return {
		question: { kind: 'claim-check', statements: claims.map((c) => c.text) },
		key: { kind: 'claim-check', verdicts, values },
		distractors: [],
		feedback: feedbackOf(ctx, w, [...new Set(highlight)], 'point' in w ? w.point : undefined),
		keyText: verdicts.map((v, i) => `${v ? 'true' : 'false'} (${formatValue(claims[i].ask.type, values[i])})`).join('; ')
	};
}

/** Expected candidates left after each test (Σ nᵢ² / N over its outcomes), by `STATE/POINT`, computed from the candidates' own solves. */
export function expectedLeftTable(ctx: CircuitCtx, candidates: string[]): Record<string, number> {
	const c = ctx.circuit;
	const out: Record<string, number> = {};
	const N = candidates.length;
	for (const s of c.states) {
		const rs = candidates.map((f) => {
			const r = solveCircuit(c, { state: s.name, fault: f === 'none' ? null : f });
			return 'error' in r ? null : r;
		});
		for (const pt of c.points) {
			const groups = new Map<string, number>();
			for (const r of rs) {
				const cls: Reads | 'dead-short' = r ? r.points[pt.label].reads : 'dead-short';
				groups.set(cls, (groups.get(cls) ?? 0) + 1);
			}
			let sum = 0;
			for (const n of groups.values()) sum += n * n;
			out[`${s.name}/${pt.label}`] = sum / N;
		}
	}
	return out;
}

function compileNextTest(ctx: CircuitCtx, ask: Extract<Ask, { type: 'next-test' }>): Compiled {
	const d = complaintDiagnosis(ctx, ask.complaint);
	if (!d.next_test)
		throw new ItemError('ask', `the complaint leaves ${d.candidates.length} candidate${d.candidates.length === 1 ? '' : 's'} (${d.candidates.join(', ') || 'none'}), so there is no next test to choose`, 'observe less, so that two or more faults remain');
	const expectedLeft = expectedLeftTable(ctx, d.candidates);
	const mine = expectedLeft[`${d.next_test.state}/${d.next_test.point}`];
	if (Math.abs(mine - d.next_test.expected_left) > 1e-9)
		throw new ItemError('ask', `internal check failed: the engine's next test leaves ${d.next_test.expected_left} candidates, the item's table says ${mine}`, 'report this to the engine maintainers');
	return {
		question: { kind: 'next-test', states: ctx.circuit.states.map((s) => s.name), points: ctx.circuit.points.map((p) => p.label) },
		key: { kind: 'next-test', state: d.next_test.state, point: d.next_test.point, candidates: d.candidates, expectedLeft },
		distractors: [],
		feedback: {
			state: d.next_test.state,
			fault: null,
			highlight: [],
			readings: {},
			notes: Object.entries(d.next_test.outcomes).map(([cls, fs]) => `reads ${cls}: ${fs.join(', ')}`)
		},
		keyText: `point ${d.next_test.point} in state ${d.next_test.state}`
	};
}

function compileKind(ctx: CircuitCtx, src: ItemSource): Compiled {
	const ask = src.ask;
	if (!ASKS_BY_KIND[src.kind].includes(ask.type))
		throw new ItemError('kind', `kind ${src.kind} cannot ask "${ask.type}"`, `a ${src.kind} item asks one of: ${ASKS_BY_KIND[src.kind].join(', ')}`);
	switch (ask.type) {
		case 'path':
		case 'shared':
			return compilePath(ctx, ask);
		case 'opens':
			return compileOpens(ctx, ask);
		case 'works':
			return compileWorks(ctx, ask);
		case 'candidates':
			return compileCandidates(ctx, src, ask);
		case 'next-test':
			return compileNextTest(ctx, ask);
		case 'claims':
			return compileClaims(ctx, src, ask.claims);
		default:
			return compileScalar(ctx, src, ask);
	}
}

const show = (v: unknown) => (typeof v === 'string' ? v : JSON.stringify(v));

/** Compares a stated key with the engine's; returns null when they agree, else what differs. */
export function statedKeyMismatch(key: Key, stated: unknown): string | null {
	const sameSet = (a: unknown, b: string[]) => Array.isArray(a) && a.every((x) => typeof x === 'string') && setKey(a as string[]) === setKey(b);
	switch (key.kind) {
		case 'numeric':
			return typeof stated === 'number' && Math.abs(stated - key.value) <= key.tolerance + 1e-9
				? null
				: `stated_key ${show(stated)} but the engine computes ${key.value} ${key.unit} (tolerance ±${key.tolerance} ${key.unit})`;
		case 'choose-one': {
			const ok = typeof key.value === 'number' ? typeof stated === 'number' && Math.abs(stated - key.value) < 0.005 + 1e-9 : stated === key.value || stated === key.choice;
			return ok ? null : `stated_key ${show(stated)} but the engine computes ${key.choice}`;
		}
		case 'choose-all':
			return sameSet(stated, key.choices) ? null : `stated_key ${show(stated)} but the engine computes [${key.choices.join(', ')}]`;
		case 'select-diagram':
			return sameSet(stated, key.elements) ? null : `stated_key ${show(stated)} but the engine computes [${key.elements.join(', ')}]`;
		case 'predict-works':
			return stated && typeof stated === 'object' && stableJson(stated) === stableJson(key.loads) ? null : `stated_key ${show(stated)} but the engine computes ${JSON.stringify(key.loads)}`;
		case 'claim-check':
			return Array.isArray(stated) && stableJson(stated) === stableJson(key.verdicts)
				? null
				: `stated_key ${show(stated)} but the engine computes [${key.verdicts.join(', ')}] (values ${key.values.join(', ')})`;
		case 'next-test': {
			const s = stated as { state?: unknown; point?: unknown } | string;
			const [st, pt] = typeof s === 'string' ? s.split('/').map((x) => x.trim()) : [s?.state, s?.point];
			return st === key.state && pt === key.point ? null : `stated_key ${show(stated)} but the engine computes ${key.state}/${key.point}`;
		}
	}
}

/**
 * Compiles one item source against its circuit context. The explanation may use `{{key}}` (the key
 * as the learner reads it) and `{{why}}` (the engine's sentences on the relays, fuses and the point).
 * @throws ItemError for a problem with the item; the engine's typed errors for a bad fault or option.
 */
export function compileItem(ctx: CircuitCtx, src: ItemSource): BuiltItem {
	const skill = findSkill(src.skill);
	if (!skill) throw new ItemError('skill', `unknown skill "${src.skill}"`, 'use a skill id from src/lib/items/blueprint.ts');
	if (skill.area !== src.area) throw new ItemError('skill', `skill ${skill.id} belongs to area ${skill.area}, not ${src.area}`, `set area: ${skill.area} or choose a skill of ${src.area}`);
	const comp = compileKind(ctx, src);
	if (src.statedKey !== undefined) {
		const bad = statedKeyMismatch(comp.key, src.statedKey);
		if (bad) throw new ItemError('stated_key', bad, 'correct the stated key (or the ask), or remove stated_key and let the engine key the item');
	}
	const why = comp.feedback.notes.join('; ');
	const explanation = src.explanation.replace(/\{\{key\}\}/g, comp.keyText).replace(why ? /\{\{why\}\}/g : /\s*\{\{why\}\}\.?/g, why);
	const contentHash = hashText(
		stableJson({ id: src.id, area: src.area, skill: src.skill, kind: src.kind, circuit: ctx.hash, ask: src.ask, tolerance: src.tolerance, tags: src.tags, stem: src.stem, explanation: src.explanation, stated: src.statedKey })
	);
	const keyHash = hashText(stableJson({ key: comp.key, distractors: comp.distractors }));
	return {
		id: src.id,
		version: hashText(contentHash + keyHash),
		contentHash,
		keyHash,
		area: src.area,
		skill: src.skill,
		difficulty: skill.difficulty,
		kind: src.kind,
		family: src.family,
		origin: src.origin,
		circuitText: src.circuitText,
		circuitRef: src.circuitRef,
		stemHtml: renderMarkdown(src.stem),
		explanationHtml: renderMarkdown(explanation),
		ask: src.ask,
		question: comp.question,
		key: comp.key,
		distractors: comp.distractors,
		cautions: cautionsFor(src.area, src.skill, src.tags).map((c) => ({ id: c.id, text: c.text })),
		feedback: comp.feedback,
		tags: src.tags
	};
}
