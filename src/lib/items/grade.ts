/**
 * Grading: a pure function of the built item (from the server, never the client) and the learner's
 * response. The partial-credit rule of each kind is written beside its code and in
 * docs/item-format.md.
 */
import type { Reads } from '../circuit';
import type { BuiltItem, Distractor } from './types';

/** A response of the wrong shape for the item's kind; `message` says what is wrong and what to send. */
export class ResponseError extends Error {
	constructor(message: string) {
		super(message);
		this.name = 'ResponseError';
	}
}

/** What the feedback screen needs about one graded answer. */
export type GradeFeedback = {
	/** The key, as data of the item's kind. */
	key: unknown;
	/** The mistake the answer matches, when it matches a tagged distractor. */
	mistake: string | null;
	/** Per-part marks: options, elements, loads or statements right (true) or wrong (false). */
	marks?: Record<string, boolean>;
	/** Numeric only: how far the answer is from the key, in the key's unit. */
	off_by?: number;
};

export type Grade = { score: number; correct: boolean; feedback: GradeFeedback };

const isObj = (v: unknown): v is Record<string, unknown> => !!v && typeof v === 'object' && !Array.isArray(v);
const strings = (v: unknown, what: string): string[] => {
	if (!Array.isArray(v) || !v.every((x) => typeof x === 'string')) throw new ResponseError(`${what} must be a list of ids`);
	return [...new Set(v as string[])];
};

/** The reading class of a number against a supply, by the engine's rule (0.2 V bands, inclusive). */
function classOf(volts: number, supply: number): Reads {
	if (Math.abs(volts - supply) <= 0.2 + 1e-9) return 'supply';
	if (Math.abs(volts) <= 0.2 + 1e-9) return 'ground';
	return 'partial';
}

function mistakeOf(distractors: Distractor[], match: (d: Distractor) => boolean): string | null {
	return distractors.find(match)?.tag ?? null;
}

/** Score of a set answer: (right picks − wrong picks) / size of the key, floored at 0; an empty key scores 1 only for an empty answer. */
export function setScore(key: string[], answer: string[]): { score: number; marks: Record<string, boolean> } {
	const k = new Set(key);
	const marks: Record<string, boolean> = {};
	let right = 0;
	let wrong = 0;
	for (const a of answer) {
		marks[a] = k.has(a);
		if (k.has(a)) right++;
		else wrong++;
	}
	for (const x of key) if (!(x in marks)) marks[x] = false;
	if (key.length === 0) return { score: answer.length === 0 ? 1 : 0, marks };
	return { score: Math.max(0, (right - wrong) / key.length), marks };
}

const round = (x: number) => Math.round(x * 1e6) / 1e6;

/**
 * Grades a response against the built item. Only `response` comes from the learner.
 * @throws ResponseError when the response does not have the shape the kind needs.
 */
export function gradeResponse(item: BuiltItem, response: unknown): Grade {
	if (!isObj(response)) throw new ResponseError('the response must be an object, e.g. { "value": 12.6 }');
	const key = item.key;
	const done = (score: number, fb: Omit<GradeFeedback, 'key'>): Grade => ({ score: round(score), correct: score >= 1 - 1e-9, feedback: { key, ...fb } });
	switch (key.kind) {
		case 'numeric': {
			// 1 within the tolerance; 0.5 outside it when the value lands in the key's reading class; else 0
			const v = response.value;
			if (typeof v !== 'number' || !Number.isFinite(v)) throw new ResponseError(`send { "value": a number in ${key.unit} }`);
			const off = v - key.value;
			const mistake = mistakeOf(item.distractors, (d) => typeof d.value === 'number' && Math.abs(v - d.value) <= key.tolerance + 1e-9);
			if (Math.abs(off) <= key.tolerance + 1e-9) return done(1, { mistake: null, off_by: round(off) });
			const sameClass = key.reads !== null && key.reads !== 'floating' && key.emf !== null && classOf(v, key.emf) === key.reads;
			return done(sameClass ? 0.5 : 0, { mistake, off_by: round(off) });
		}
		case 'choose-one': {
			// 1 for the key, else 0
			const c = response.choice;
			if (typeof c !== 'string') throw new ResponseError('send { "choice": the id of one option }');
			const q = item.question;
			if (q.kind === 'choose-one' && !q.options.some((o) => o.id === c)) throw new ResponseError(`"${c}" is not an option of this item`);
			return done(c === key.choice ? 1 : 0, { mistake: c === key.choice ? null : mistakeOf(item.distractors, (d) => d.label === c) });
		}
		case 'choose-all': {
			// (right picks − wrong picks) / number of right options, floored at 0
			const picks = strings(response.choices, 'choices');
			const q = item.question;
			if (q.kind === 'choose-all') for (const p of picks) if (!q.options.some((o) => o.id === p)) throw new ResponseError(`"${p}" is not an option of this item`);
			const { score, marks } = setScore(key.choices, picks);
			const wrongPick = picks.find((p) => !key.choices.includes(p));
			return done(score, { mistake: wrongPick ? mistakeOf(item.distractors, (d) => d.value === wrongPick) : null, marks });
		}
		case 'select-diagram': {
			// (right ids − wrong ids) / size of the key, floored at 0
			const els = strings(response.elements, 'elements');
			const q = item.question;
			if (q.kind === 'select-diagram') for (const e of els) if (!q.selectable.includes(e)) throw new ResponseError(`"${e}" is not a part or wire of this diagram`);
			const { score, marks } = setScore(key.elements, els);
			const as = [...els].sort().join(',');
			return done(score, { mistake: score === 1 ? null : mistakeOf(item.distractors, (d) => Array.isArray(d.value) && [...(d.value as string[])].sort().join(',') === as), marks });
		}
		case 'predict-works': {
			// the share of loads predicted right
			const loads = response.loads;
			if (!isObj(loads)) throw new ResponseError('send { "loads": { LOAD: "on" | "weak" | "off" } } for every load');
			const ids = Object.keys(key.loads);
			const marks: Record<string, boolean> = {};
			for (const id of ids) {
				const v = loads[id];
				if (v !== 'on' && v !== 'weak' && v !== 'off') throw new ResponseError(`load ${id} needs "on", "weak" or "off"`);
				marks[id] = v === key.loads[id];
			}
			for (const id of Object.keys(loads)) if (!ids.includes(id)) throw new ResponseError(`"${id}" is not a load of this item`);
			const right = ids.filter((id) => marks[id]).length;
			const same = (m: unknown) => isObj(m) && ids.every((id) => m[id] === loads[id]);
			return done(right / ids.length, { mistake: right === ids.length ? null : mistakeOf(item.distractors, (d) => same(d.value)), marks });
		}
		case 'claim-check': {
			// the share of statements judged right
			const v = response.verdicts;
			if (!Array.isArray(v) || v.length !== key.verdicts.length || !v.every((x) => typeof x === 'boolean'))
				throw new ResponseError(`send { "verdicts": [${key.verdicts.map(() => 'true or false').join(', ')}] }, one per statement`);
			const marks: Record<string, boolean> = {};
			key.verdicts.forEach((k, i) => (marks[String(i + 1)] = v[i] === k));
			const right = Object.values(marks).filter(Boolean).length;
			return done(right / key.verdicts.length, { mistake: null, marks });
		}
		case 'next-test': {
			// 1 for the best test or one as good; 0.5 for a test that splits the candidates at all; 0 for one that tells nothing
			const { state, point } = response;
			if (typeof state !== 'string' || typeof point !== 'string') throw new ResponseError('send { "state": a state name, "point": a point label }');
			const e = key.expectedLeft[`${state}/${point}`];
			if (e === undefined) throw new ResponseError(`"${point}" in state "${state}" is not a test of this item`);
			const best = key.expectedLeft[`${key.state}/${key.point}`];
			const n = key.candidates.length;
			const score = e <= best + 1e-9 ? 1 : e < n - 1e-9 ? 0.5 : 0;
			return done(score, { mistake: score === 0 ? 'test-tells-nothing' : null });
		}
	}
}
