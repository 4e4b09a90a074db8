/** Plain-text forms of a given answer and of an item's key, for the feedback screen and the history. */
import type { BuiltItem, QuestionPayload } from '$lib/items/types';

const obj = (v: unknown): Record<string, unknown> => (v && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : {});
const list = (v: unknown): string[] => (Array.isArray(v) ? v.map(String) : []);
const yesNo = (b: unknown) => (b === true ? 'true' : b === false ? 'false' : '?');

function optionLabel(q: QuestionPayload, id: string): string {
	if (q.kind === 'choose-one' || q.kind === 'choose-all') return q.options.find((o) => o.id === id)?.label ?? id;
	return id;
}

/** A learner's answer as text, e.g. "11.8 V", "K1, W3", "M1 on, L2 off". */
export function formatAnswer(q: QuestionPayload, answer: unknown): string {
	const a = obj(answer);
	switch (q.kind) {
		case 'numeric':
			return typeof a.value === 'number' ? `${a.value} ${q.unit}` : '—';
		case 'choose-one':
			return typeof a.choice === 'string' ? optionLabel(q, a.choice) : '—';
		case 'choose-all':
			return list(a.choices).map((c) => optionLabel(q, c)).join('; ') || 'none chosen';
		case 'select-diagram':
			return list(a.elements).join(', ') || 'nothing selected';
		case 'predict-works':
			return Object.entries(obj(a.loads)).map(([k, v]) => `${k} ${String(v)}`).join(', ') || '—';
		case 'claim-check':
			return list(a.verdicts).map((v, i) => `${i + 1}: ${v}`).join(', ') || '—';
		case 'next-test':
			return typeof a.point === 'string' ? `${a.point} in state ${String(a.state)}` : '—';
	}
}

/** The item's key as text in the same form. */
export function formatKey(it: BuiltItem): string {
	const k = it.key;
	switch (k.kind) {
		case 'numeric':
			return `${k.value} ${k.unit} (± ${k.tolerance} ${k.unit})`;
		case 'choose-one':
			return optionLabel(it.question, k.choice);
		case 'choose-all':
			return k.choices.map((c) => optionLabel(it.question, c)).join('; ') || 'none of them';
		case 'select-diagram':
			return k.elements.join(', ');
		case 'predict-works':
			return Object.entries(k.loads).map(([id, s]) => `${id} ${s}`).join(', ');
		case 'claim-check':
			return k.verdicts.map((v, i) => `${i + 1}: ${yesNo(v)}`).join(', ');
		case 'next-test':
			return `${k.point} in state ${k.state}`;
	}
}
