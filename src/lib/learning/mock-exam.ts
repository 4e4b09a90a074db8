/**
 * Mock exam assembly: a full-length practice test drawn by the blueprint's area weights from items the
 * learner has not seen in the last 30 days.
 */
import { makeRng } from './rng';
import { allocateByWeight } from './readiness';
import { toMs } from './learning-day';

export type ExamCandidate = { id: string; skillId: string; area: string };

export const MOCK_ITEMS = 50;
export const MOCK_MINUTES = 60;
/** Items seen within this many days are left out. */
export const FRESH_DAYS = 30;

export type MockExam = {
	items: ExamCandidate[];
	minutes: number;
	/** Per area: how many the weights asked for and how many it got. */
	perArea: Record<string, { wanted: number; got: number }>;
	/** Plain-language notes on any area that ran short and how the gap was filled. */
	notes: string[];
};

/**
 * Draws `count` items (default 50, 60 minutes) by area weight, spreading each area's share over its
 * skills, from candidates not seen in the last `freshDays` days. An area short of fresh items is filled
 * from the other areas' fresh items (noted); if fewer than `count` fresh items exist, the exam is shorter
 * (noted). Deterministic for a given seed.
 */
export function assembleMockExam(input: {
	candidates: readonly ExamCandidate[];
	weights: Readonly<Record<string, number>>;
	/** When the learner last saw each item id (ISO string or epoch ms). */
	lastSeen: Readonly<Record<string, string | number>>;
	now: Date | string | number;
	count?: number;
	minutes?: number;
	freshDays?: number;
	seed: number | string;
}): MockExam {
	const count = input.count ?? MOCK_ITEMS;
	if (!Number.isInteger(count) || count < 1) throw new RangeError(`A mock exam needs a whole number of items of at least 1, not ${count}.`);
	const minutes = input.minutes ?? MOCK_MINUTES;
	const cutoff = toMs(input.now) - (input.freshDays ?? FRESH_DAYS) * 86_400_000;
	const fresh = input.candidates.filter((c) => input.lastSeen[c.id] == null || toMs(input.lastSeen[c.id]) < cutoff);
	const rng = makeRng(input.seed);
	const shuffle = <T>(list: T[]): T[] => {
		for (let i = list.length - 1; i > 0; i--) {
			const j = rng.int(i + 1);
			[list[i], list[j]] = [list[j], list[i]];
		}
		return list;
	};
	const wanted = allocateByWeight(input.weights, count);
	const taken = new Set<string>();
	const items: ExamCandidate[] = [];
	const perArea: MockExam['perArea'] = {};
	const notes: string[] = [];
	for (const area of Object.keys(wanted).sort()) {
		// Round robin over the area's skills (in a seeded order) so its share covers as many skills as it can.
		const bySkill = new Map<string, ExamCandidate[]>();
		for (const c of fresh.filter((c) => c.area === area)) bySkill.set(c.skillId, [...(bySkill.get(c.skillId) ?? []), c]);
		const queues = shuffle([...bySkill.keys()].sort()).map((k) => shuffle(bySkill.get(k)!));
		let got = 0;
		for (let round = 0; got < wanted[area] && queues.some((q) => q.length > 0); round++)
			for (const q of queues) {
				if (got >= wanted[area]) break;
				const c = q.shift();
				if (c) {
					items.push(c);
					taken.add(c.id);
					got++;
				}
			}
		perArea[area] = { wanted: wanted[area], got };
		if (got < wanted[area]) notes.push(`${area}: only ${got} of ${wanted[area]} items unseen in ${input.freshDays ?? FRESH_DAYS} days`);
	}
	if (items.length < count) {
		const rest = shuffle(fresh.filter((c) => !taken.has(c.id) && (input.weights[c.area] ?? 0) > 0));
		const fill = rest.slice(0, count - items.length);
		for (const c of fill) {
			items.push(c);
			perArea[c.area] = perArea[c.area] ?? { wanted: 0, got: 0 };
			perArea[c.area].got++;
		}
		if (fill.length > 0) notes.push(`${fill.length} item${fill.length === 1 ? '' : 's'} taken from other areas to fill the gap`);
		if (items.length < count) notes.push(`only ${items.length} unseen items exist, so this mock exam has ${items.length} items instead of ${count}`);
	}
	return { items: shuffle(items), minutes: Math.round((minutes * items.length) / count), perArea, notes };
}
