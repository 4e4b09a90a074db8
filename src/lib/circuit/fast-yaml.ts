/**
 * A fast reader for the plain subset of YAML 1.2 that circuit files are written in: block maps and
 * lists by indentation, one-line flow maps and lists, plain and simply quoted scalars, comments.
 * It returns exactly what the full `yaml` reader gives for such text (the same values, core schema,
 * and lines), and null for anything outside the subset or anything doubtful, so that the caller
 * falls back to the full reader (which also reports every YAML error).
 */
import type { Located } from './parse';

type Line = { no: number; indent: number; text: string };

/** Thrown inside the reader to give up on the fast path. */
class NotSimple extends Error {}

const giveUp = (): never => {
	throw new NotSimple();
};

const INT = /^[-+]?[0-9]+$/;
const FLOAT = /^[-+]?(?:\.[0-9]+|[0-9]+(?:\.[0-9]*)?)(?:[eE][-+]?[0-9]+)?$/;
const KEY = /^[A-Za-z_][A-Za-z0-9_.+\-#/]*$/;
const SPECIAL_WORDS = new Set(['null', 'Null', 'NULL', 'true', 'True', 'TRUE', 'false', 'False', 'FALSE']);

/** Core-schema value of a plain scalar, or a give-up for forms the fast path leaves to the full reader. */
function plainValue(s: string): string | number | boolean | null {
	if (s === '~' || s === 'null' || s === 'Null' || s === 'NULL') return null;
	if (s === 'true' || s === 'True' || s === 'TRUE') return true;
	if (s === 'false' || s === 'False' || s === 'FALSE') return false;
	if (INT.test(s) || FLOAT.test(s)) {
		const v = Number(s);
		if (!Number.isFinite(v) || (INT.test(s) && !Number.isSafeInteger(v)) || Object.is(v, -0)) giveUp();
		return v;
	}
	// indicator starts, and the number forms 0o, 0x, .inf and .nan, go to the full reader
	if (/^[?:,[\]{}#&*!|>'"%@`]/.test(s) || /^- /.test(s) || /^[-+]?\.(inf|Inf|INF)$/.test(s) || /^\.(nan|NaN|NAN)$/.test(s) || /^0[ox]/.test(s))
		giveUp();
	return s;
}

/** Splits text into lines without comments; gives up on tabs, directives, documents and anchors. */
function lines(text: string): Line[] {
	if (text.charCodeAt(0) === 0xfeff) giveUp();
	const out: Line[] = [];
	const raw = text.split('\n');
	for (let i = 0; i < raw.length; i++) {
		let t = raw[i];
		if (t.endsWith('\r')) t = t.slice(0, -1);
		if (t.includes('\t')) giveUp();
		let indent = 0;
		while (indent < t.length && t.charCodeAt(indent) === 32) indent++;
		const body = stripComment(t.slice(indent));
		if (body === '') continue;
		if (indent === 0 && (body.startsWith('---') || body.startsWith('...') || body.startsWith('%'))) giveUp();
		out.push({ no: i + 1, indent, text: body });
	}
	return out;
}

/** Removes a trailing comment (a # at the start or after a space, outside quotes) and trailing spaces. */
function stripComment(s: string): string {
	let q = '';
	for (let i = 0; i < s.length; i++) {
		const c = s[i];
		if (q) {
			if (c === q) q = '';
			continue;
		}
		if ((c === '"' || c === "'") && (i === 0 || /[\s,[{:]/.test(s[i - 1]))) q = c;
		else if (c === '#' && (i === 0 || s[i - 1] === ' ')) return s.slice(0, i).trimEnd();
	}
	if (q) giveUp();
	return s.trimEnd();
}

/** A cursor over one line's inline value (flow collections and scalars on a single line). */
class Inline {
	pos = 0;
	constructor(
		readonly s: string,
		readonly line: number
	) {}

	skipSpaces(): void {
		while (this.s[this.pos] === ' ') this.pos++;
	}

	/** A value in block context: the whole rest of the line. */
	block(): Located {
		this.skipSpaces();
		const c = this.s[this.pos];
		let v: Located;
		if (c === '{' || c === '[') v = this.flow();
		else if (c === '"' || c === "'") v = this.quoted();
		else {
			const rest = this.s.slice(this.pos);
			if (/:(\s|$)/.test(rest) || rest === '') giveUp();
			this.pos = this.s.length;
			return { kind: 'scalar', line: this.line, value: plainValue(rest) };
		}
		this.skipSpaces();
		if (this.pos !== this.s.length) giveUp();
		return v;
	}

	quoted(): Located {
		const q = this.s[this.pos];
		const end = this.s.indexOf(q, this.pos + 1);
		if (end < 0) giveUp();
		const body = this.s.slice(this.pos + 1, end);
		if (q === '"' && body.includes('\\')) giveUp();
		if (q === "'" && this.s[end + 1] === "'") giveUp();
		this.pos = end + 1;
		return { kind: 'scalar', line: this.line, value: body };
	}

	/** A plain scalar in flow context: up to , ] } or ': '. */
	flowPlain(): string {
		const start = this.pos;
		while (this.pos < this.s.length) {
			const c = this.s[this.pos];
			if (c === ',' || c === ']' || c === '}') break;
			if (c === '[' || c === '{') giveUp();
			if (c === ':') {
				const n = this.s[this.pos + 1];
				if (n === undefined || n === ' ' || n === ',' || n === ']' || n === '}') break;
			}
			this.pos++;
		}
		const t = this.s.slice(start, this.pos).trimEnd();
		if (t === '') giveUp();
		return t;
	}

	flowValue(): Located {
		this.skipSpaces();
		const c = this.s[this.pos];
		if (c === '{' || c === '[') return this.flow();
		if (c === '"' || c === "'") return this.quoted();
		return { kind: 'scalar', line: this.line, value: plainValue(this.flowPlain()) };
	}

	flow(): Located {
		const open = this.s[this.pos];
		const close = open === '{' ? '}' : ']';
		this.pos++;
		const entries: { key: string; keyLine: number; value: Located }[] = [];
		const items: Located[] = [];
		const seen = new Set<string>();
		this.skipSpaces();
		if (this.s[this.pos] === close) {
			this.pos++;
			return open === '{' ? { kind: 'map', line: this.line, entries } : { kind: 'list', line: this.line, items };
		}
		for (;;) {
			this.skipSpaces();
			if (open === '{') {
				const c = this.s[this.pos];
				if (c === '"' || c === "'" || c === '{' || c === '[' || c === '?') giveUp();
				const key = this.flowPlain();
				if (!KEY.test(key) || SPECIAL_WORDS.has(key) || seen.has(key)) giveUp();
				seen.add(key);
				if (this.s[this.pos] !== ':') giveUp();
				this.pos++;
				if (this.s[this.pos] !== ' ') giveUp();
				const value = this.flowValue();
				entries.push({ key, keyLine: this.line, value });
			} else {
				const c = this.s[this.pos];
				if (c !== '{' && c !== '[' && c !== '"' && c !== "'") {
					const save = this.pos;
					this.flowPlain();
					if (this.s[this.pos] === ':') giveUp(); // an implicit single-pair map
					this.pos = save;
				}
				items.push(this.flowValue());
			}
			this.skipSpaces();
			const c = this.s[this.pos];
			if (c === ',') {
				this.pos++;
				this.skipSpaces();
				if (this.s[this.pos] === close) giveUp(); // trailing comma: leave to the full reader
				continue;
			}
			if (c === close) {
				this.pos++;
				break;
			}
			giveUp();
		}
		return open === '{' ? { kind: 'map', line: this.line, entries } : { kind: 'list', line: this.line, items };
	}
}

/** Reads the block at lines[i] with exactly `indent`; returns the value and the next line index. */
function readBlock(ls: Line[], i: number, indent: number): [Located, number] {
	const first = ls[i];
	if (first.text === '-' || first.text.startsWith('- ')) return readList(ls, i, indent);
	return readMap(ls, i, indent);
}

function readList(ls: Line[], i: number, indent: number): [Located, number] {
	const items: Located[] = [];
	const line = ls[i].no;
	while (i < ls.length && ls[i].indent === indent && (ls[i].text === '-' || ls[i].text.startsWith('- '))) {
		const rest = ls[i].text.slice(1).trimStart();
		if (rest === '') giveUp();
		const c = rest[0];
		if (c !== '{' && c !== '[' && c !== '"' && c !== "'" && /:(\s|$)/.test(rest)) giveUp(); // a map inside a list item
		items.push(new Inline(rest, ls[i].no).block());
		i++;
		if (i < ls.length && ls[i].indent > indent) giveUp();
	}
	return [{ kind: 'list', line, items }, i];
}

function readMap(ls: Line[], i: number, indent: number): [Located, number] {
	const entries: { key: string; keyLine: number; value: Located }[] = [];
	const seen = new Set<string>();
	const line = ls[i].no;
	while (i < ls.length && ls[i].indent === indent) {
		const t = ls[i].text;
		if (t === '-' || t.startsWith('- ')) giveUp();
		const m = /^([^\s:'"{}[\],#]+):( |$)/.exec(t);
		if (!m) giveUp();
		const key = m![1];
		if (!KEY.test(key) || SPECIAL_WORDS.has(key) || seen.has(key)) giveUp();
		seen.add(key);
		const rest = t.slice(m![0].length).trim();
		const keyLine = ls[i].no;
		i++;
		if (rest !== '') {
			entries.push({ key, keyLine, value: new Inline(rest, keyLine).block() });
			if (i < ls.length && ls[i].indent > indent) giveUp();
			continue;
		}
		if (i >= ls.length) giveUp();
		const next = ls[i];
		if (next.indent > indent) {
			const [value, j] = readBlock(ls, i, next.indent);
			entries.push({ key, keyLine, value });
			i = j;
			if (i < ls.length && ls[i].indent > indent) giveUp();
		} else if (next.indent === indent && (next.text === '-' || next.text.startsWith('- '))) {
			const [value, j] = readList(ls, i, indent);
			entries.push({ key, keyLine, value });
			i = j;
		} else giveUp(); // an empty value
	}
	return [{ kind: 'map', line, entries }, i];
}

/**
 * Reads circuit-file YAML in the plain subset. Returns the root value (null root for a document
 * without content is left to the full reader), or null when the text is outside the subset.
 */
export function readSimpleYaml(text: string): Located | null {
	try {
		const ls = lines(text);
		if (ls.length === 0 || ls[0].indent !== 0) return null;
		const [root, i] = readBlock(ls, 0, 0);
		if (i !== ls.length) return null;
		return root;
	} catch (e) {
		if (e instanceof NotSimple) return null;
		throw e;
	}
}
