/**
 * Readiness: an estimate of the probability of passing a full exam at our cut score, from per-area
 * abilities and the exam's mix (Rasch success per item, then the Poisson-binomial distribution of the
 * total). Method in docs/learning.md.
 */
import { abilityOf, pWithGuess, type Estimate } from './rasch';

/** Our pass mark: 70 % of the items right. */
export const CUT_SCORE = 0.7;

/** P(total = k) for k = 0..n when item i is right with probability ps[i], independently (exact recursion). */
export function poissonBinomial(ps: readonly number[]): number[] {
	let dist = [1];
	for (const p of ps) {
		if (!(p >= 0 && p <= 1)) throw new RangeError(`Not a probability: ${p}. Each item's success must lie in [0, 1].`);
		const next = new Array(dist.length + 1).fill(0);
		for (let k = 0; k < dist.length; k++) {
			next[k] += dist[k] * (1 - p);
			next[k + 1] += dist[k] * p;
		}
		dist = next;
	}
	return dist;
}

/** One exam item: its area, its skill's difficulty, and the chance of guessing it (1 / options on a choice item). */
export type ExamItem = { area: string; difficulty: number; guess?: number };

/** The number of right answers needed to pass `n` items at `cutScore`. */
export function passMark(n: number, cutScore = CUT_SCORE): number {
	return Math.ceil(cutScore * n - 1e-9);
}

export type Readiness = { probability: number; expectedScore: number; passMark: number; items: number; cutScore: number; label: 'estimate' };

/** The estimated probability of passing an exam made of `items` at `cutScore`. */
export function readiness(input: { abilities: Readonly<Record<string, Estimate | number>>; items: readonly ExamItem[]; cutScore?: number }): Readiness {
	const cut = input.cutScore ?? CUT_SCORE;
	if (input.items.length === 0) throw new RangeError('An exam mix needs at least one item.');
	const ps = input.items.map((it) => pWithGuess(abilityOf(input.abilities, it.area), it.difficulty, it.guess ?? 0));
	const dist = poissonBinomial(ps);
	const mark = passMark(ps.length, cut);
	let probability = 0;
	for (let k = mark; k < dist.length; k++) probability += dist[k];
	return { probability: Math.min(1, probability), expectedScore: ps.reduce((a, b) => a + b, 0), passMark: mark, items: ps.length, cutScore: cut, label: 'estimate' };
}

/** Splits `n` items over the areas with a positive weight, in proportion, by largest remainder (ties by area id). */
export function allocateByWeight(weights: Readonly<Record<string, number>>, n: number): Record<string, number> {
	const areas = Object.keys(weights).filter((a) => weights[a] > 0);
	const total = areas.reduce((s, a) => s + weights[a], 0);
	if (total <= 0) throw new RangeError('The area weights must include at least one positive weight.');
	const raw = areas.map((a) => ({ a, x: (weights[a] / total) * n }));
	const out: Record<string, number> = {};
	for (const r of raw) out[r.a] = Math.floor(r.x);
	let left = n - Object.values(out).reduce((s, v) => s + v, 0);
	for (const r of [...raw].sort((p, q) => q.x - Math.floor(q.x) - (p.x - Math.floor(p.x)) || (p.a < q.a ? -1 : 1))) {
		if (left-- <= 0) break;
		out[r.a]++;
	}
	return out;
}

/**
 * The expected mix of a full exam, for readiness before a particular exam is drawn: `n` items split over
 * areas by weight, each area's share spread evenly over its skills. Throws if a weighted area has no skill.
 */
export function examMixFromWeights(weights: Readonly<Record<string, number>>, skills: readonly ExamItem[], n = 50): ExamItem[] {
	const share = allocateByWeight(weights, n);
	const out: ExamItem[] = [];
	for (const [area, count] of Object.entries(share)) {
		const mine = skills.filter((s) => s.area === area);
		if (mine.length === 0) throw new RangeError(`Area "${area}" has weight but no skills to draw from.`);
		for (let i = 0; i < count; i++) out.push({ ...mine[i % mine.length], area });
	}
	return out;
}
