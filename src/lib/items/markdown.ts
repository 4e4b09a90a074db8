/**
 * Reading a markdown item file (docs/item-format.md): YAML front matter, a circuit (a reference to
 * `content/circuits/NAME.yaml` or an inline ```yaml circuit block), the stem and the explanation.
 */
import { LineCounter, isMap, isScalar, parseDocument, type Node as YamlNode } from 'yaml';
import { KINDS, type Ask, type BuildError, type Claim, type ItemSource, type Kind, type ScalarAsk } from './types';

const FRONT_KEYS = ['id', 'area', 'skill', 'kind', 'circuit', 'ask', 'claims', 'tolerance', 'tags', 'stated_key'];
const SCALAR_ASKS = ['volts', 'reads', 'status', 'amps', 'watts', 'drop'] as const;
const ASK_KEYS = [...SCALAR_ASKS, 'path', 'shared', 'works', 'opens', 'candidates', 'next_test'];
const ID_RE = /^[a-z0-9][a-z0-9-]*$/;

/** A read item: the source, and the line in the file where the circuit text starts (1 for a referenced file). */
export type ReadItem = { source: ItemSource; circuitLine: number; circuitFile: string };

class FrontError extends Error {
	constructor(
		readonly line: number,
		message: string,
		readonly fix: string
	) {
		super(message);
	}
}

function asString(v: unknown, what: string, line: number, fix: string): string {
	if (typeof v === 'string' && v.trim()) return v.trim();
	if (typeof v === 'number') return String(v);
	throw new FrontError(line, `${what} must be text`, fix);
}

/** Reads a scalar ask object (`{ volts: B, state: on, fault: open:W3 }`). */
export function readScalarAsk(o: Record<string, unknown>, line: number, key = 'ask'): ScalarAsk {
	const which = SCALAR_ASKS.filter((k) => k in o);
	if (which.length !== 1) throw new FrontError(line, `${key} needs exactly one of ${SCALAR_ASKS.join(', ')}`, 'e.g. { volts: B, state: on }');
	const where = readWhere(o, line, key, [which[0]]);
	const t = which[0];
	if (t === 'drop') {
		const d = o.drop;
		if (!Array.isArray(d) || d.length !== 2 || !d.every((x) => typeof x === 'string'))
			throw new FrontError(line, `${key}: drop needs two points or nodes`, 'write drop: [A, B] for V(A) − V(B)');
		return { type: 'drop', from: d[0], to: d[1], ...where };
	}
	const target = asString(o[t], `${key}: ${t}`, line, t === 'volts' || t === 'reads' ? 'name a labelled point, e.g. B' : 'name a part, e.g. M1');
	if (t === 'volts' || t === 'reads') return { type: t, point: target, ...where };
	return { type: t, part: target, ...where };
}

function readWhere(o: Record<string, unknown>, line: number, key: string, main: string[]): { state: string | null; fault: string | null } {
	for (const k of Object.keys(o))
		if (![...main, 'state', 'fault', 'among'].includes(k)) throw new FrontError(line, `${key} has an unknown key "${k}"`, `use ${main.join('/')}, state and fault`);
	const state = o.state === undefined || o.state === null ? null : asString(o.state, `${key}: state`, line, 'name a state of the circuit');
	const fault = o.fault === undefined || o.fault === null ? null : asString(o.fault, `${key}: fault`, line, 'write a fault as KIND:TARGET, e.g. open:W3');
	return { state, fault };
}

function readAsk(v: unknown, line: number): Ask {
	if (!v || typeof v !== 'object' || Array.isArray(v)) throw new FrontError(line, 'ask must be a map', 'e.g. ask: { volts: B, state: on }');
	const o = v as Record<string, unknown>;
	const which = ASK_KEYS.filter((k) => k in o);
	if (which.length !== 1) throw new FrontError(line, `ask needs exactly one of ${ASK_KEYS.join(', ')}`, 'see docs/item-format.md, "What to ask"');
	const t = which[0];
	if ((SCALAR_ASKS as readonly string[]).includes(t)) return readScalarAsk(o, line);
	if (t === 'path') return { type: 'path', through: asString(o.path, 'ask: path', line, 'name a part, wire, K1.coil or K1.contact'), ...readWhere(o, line, 'ask', ['path']) };
	if (t === 'shared') {
		const s = o.shared;
		if (!Array.isArray(s) || s.length !== 2 || !s.every((x) => typeof x === 'string'))
			throw new FrontError(line, 'ask: shared needs two elements', 'write shared: [K1.coil, K1.contact]');
		return { type: 'shared', through: [s[0], s[1]], ...readWhere(o, line, 'ask', ['shared']) };
	}
	if (t === 'works') {
		const l = o.works;
		if (!Array.isArray(l) || l.length === 0 || !l.every((x) => typeof x === 'string'))
			throw new FrontError(line, 'ask: works needs a list of loads', 'write works: [L1, L2]');
		return { type: 'works', loads: l as string[], ...readWhere(o, line, 'ask', ['works']) };
	}
	const complaint = asString(o[t], `ask: ${t}`, line, 'write the complaint as "STATE: PART=STATUS, POINT=READS; STATE: ..."');
	if (t === 'candidates') {
		readWhere(o, line, 'ask', ['candidates']);
		const among = o.among;
		if (among !== undefined && (!Array.isArray(among) || !among.every((x) => typeof x === 'string')))
			throw new FrontError(line, 'ask: among must be a list of faults', 'write among: [open:W3, open:M1]');
		return { type: 'candidates', complaint, among: (among as string[] | undefined) ?? null };
	}
	if ('state' in o || 'fault' in o || 'among' in o) throw new FrontError(line, `ask: ${t} takes only the complaint`, 'the complaint names its own states');
	return t === 'opens' ? { type: 'opens', complaint } : { type: 'next-test', complaint };
}

function readClaims(v: unknown, line: number): Claim[] {
	if (!Array.isArray(v)) throw new FrontError(line, 'claims must be a list', 'write claims: [{ text, ask, is }]');
	return v.map((c, i) => {
		if (!c || typeof c !== 'object') throw new FrontError(line, `claim ${i + 1} must be a map`, 'write { text: "...", ask: { reads: B, state: on }, is: supply }');
		const o = c as Record<string, unknown>;
		for (const k of Object.keys(o)) if (!['text', 'ask', 'is'].includes(k)) throw new FrontError(line, `claim ${i + 1} has an unknown key "${k}"`, 'use text, ask and is');
		const text = asString(o.text, `claim ${i + 1}: text`, line, 'write the statement the learner judges');
		if (!o.ask || typeof o.ask !== 'object') throw new FrontError(line, `claim ${i + 1} needs an ask`, 'e.g. ask: { reads: B, state: on }');
		const ask = readScalarAsk(o.ask as Record<string, unknown>, line, `claim ${i + 1}: ask`);
		if (typeof o.is !== 'string' && typeof o.is !== 'number') throw new FrontError(line, `claim ${i + 1} needs is: the value it claims`, 'e.g. is: supply, is: released or is: 12.6');
		return { text, ask, is: o.is };
	});
}

/**
 * Reads one markdown item file. `circuits` maps project paths (`content/circuits/x.yaml`) to their
 * text. Returns the item, or every problem found (never throws).
 */
export function readItemFile(file: string, text: string, circuits: Record<string, string>): { item: ReadItem | null; errors: BuildError[] } {
	const err = (line: number, message: string, fix: string): { item: null; errors: BuildError[] } => ({ item: null, errors: [{ file, line, message, fix }] });
	const m = /^---\r?\n([\s\S]*?)\r?\n---[ \t]*(?:\r?\n|$)/.exec(text);
	if (!m) return err(1, 'the file does not start with YAML front matter between two --- lines', 'start the file with ---, the front matter, and --- (see docs/item-format.md)');
	const lc = new LineCounter();
	const doc = parseDocument(m[1], { lineCounter: lc, version: '1.2', schema: 'core', prettyErrors: false });
	if (doc.errors.length) {
		const e = doc.errors[0];
		return err(1 + lc.linePos(e.pos[0]).line, `front matter YAML: ${e.message.split('\n')[0]}`, 'fix the YAML syntax on this line');
	}
	if (!isMap(doc.contents)) return err(2, 'front matter must be a map of keys', 'write key: value lines, e.g. id: my-item');
	const lines: Record<string, number> = {};
	for (const pair of doc.contents.items) {
		const k = pair.key as YamlNode;
		if (isScalar(k) && k.range) lines[String(k.value)] = 1 + lc.linePos(k.range[0]).line;
	}
	const fm = doc.toJS() as Record<string, unknown>;
	const bodyStart = text.slice(0, m[0].length).split('\n').length;
	const body = text.slice(m[0].length);
	try {
		for (const k of Object.keys(fm)) if (!FRONT_KEYS.includes(k)) throw new FrontError(lines[k] ?? 2, `unknown front matter key "${k}"`, `use only ${FRONT_KEYS.join(', ')}`);
		for (const k of ['id', 'area', 'skill', 'kind']) if (fm[k] === undefined) throw new FrontError(2, `front matter needs ${k}`, `add a line ${k}: ...`);
		const id = asString(fm.id, 'id', lines.id, 'write a lowercase id, e.g. fan-relay-volts-b');
		if (!ID_RE.test(id)) throw new FrontError(lines.id, `id "${id}" may hold only lowercase letters, digits and -`, 'rename it, e.g. fan-relay-volts-b');
		const kind = asString(fm.kind, 'kind', lines.kind, `use one of ${KINDS.join(', ')}`) as Kind;
		if (!KINDS.includes(kind)) throw new FrontError(lines.kind, `unknown kind "${kind}"`, `use one of ${KINDS.join(', ')}`);
		let ask: Ask;
		if (kind === 'claim-check') {
			if (fm.claims === undefined) throw new FrontError(lines.kind, 'a claim-check item needs claims', 'add claims: [{ text, ask, is }]');
			if (fm.ask !== undefined) throw new FrontError(lines.ask, 'a claim-check item asks through claims, not ask', 'move the ask into each claim');
			ask = { type: 'claims', claims: readClaims(fm.claims, lines.claims) };
		} else {
			if (fm.ask === undefined) throw new FrontError(2, 'front matter needs ask', 'add ask: { ... } (see docs/item-format.md)');
			if (fm.claims !== undefined) throw new FrontError(lines.claims, 'only claim-check items have claims', 'remove claims or set kind: claim-check');
			ask = readAsk(fm.ask, lines.ask);
		}
		const tolerance = fm.tolerance === undefined ? null : fm.tolerance;
		if (tolerance !== null && (typeof tolerance !== 'number' || !(tolerance > 0)))
			throw new FrontError(lines.tolerance, 'tolerance must be a number above 0', 'e.g. tolerance: 0.1 (in the ask’s unit)');
		const tags = fm.tags === undefined ? [] : fm.tags;
		if (!Array.isArray(tags) || !tags.every((t) => typeof t === 'string')) throw new FrontError(lines.tags, 'tags must be a list of words', 'e.g. tags: [relay, battery]');
		// the circuit: a reference or one inline block
		const block = /^```yaml[ \t]+circuit[ \t]*\r?\n([\s\S]*?)^```[ \t]*$/m.exec(body);
		let circuitText: string;
		let circuitRef: string;
		let circuitLine = 1;
		let circuitFile = file;
		if (fm.circuit !== undefined) {
			if (block) throw new FrontError(lines.circuit, 'the item has both circuit: and an inline circuit block', 'keep one of them');
			const ref = asString(fm.circuit, 'circuit', lines.circuit, 'write circuit: content/circuits/NAME.yaml');
			if (!(ref in circuits)) throw new FrontError(lines.circuit, `circuit file "${ref}" was not found`, `use one of ${Object.keys(circuits).sort().join(', ')}`);
			circuitText = circuits[ref];
			circuitRef = ref;
			circuitFile = ref;
		} else {
			if (!block) throw new FrontError(2, 'the item has no circuit', 'add circuit: content/circuits/NAME.yaml or a ```yaml circuit block in the body');
			circuitText = block[1];
			circuitRef = 'inline';
			circuitLine = bodyStart + body.slice(0, block.index).split('\n').length;
		}
		const rest = block ? body.slice(0, block.index) + body.slice(block.index + block[0].length) : body;
		const split = /^##[ \t]+Explanation[ \t]*$/im.exec(rest);
		const stem = (split ? rest.slice(0, split.index) : rest).trim();
		const explanation = split ? rest.slice(split.index + split[0].length).trim() : '';
		if (!stem) throw new FrontError(bodyStart, 'the item has no stem', 'write the question below the front matter');
		const source: ItemSource = {
			id,
			area: asString(fm.area, 'area', lines.area, 'name a content area'),
			skill: asString(fm.skill, 'skill', lines.skill, 'name a skill'),
			kind,
			family: null,
			origin: file,
			circuitText,
			circuitRef,
			ask,
			tolerance: tolerance as number | null,
			tags: tags as string[],
			stem,
			explanation,
			statedKey: 'stated_key' in fm ? fm.stated_key : undefined,
			lines
		};
		return { item: { source, circuitLine, circuitFile }, errors: [] };
	} catch (e) {
		if (e instanceof FrontError) return err(e.line ?? 2, e.message, e.fix);
		throw e;
	}
}
