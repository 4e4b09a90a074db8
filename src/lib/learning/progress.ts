/** Progress data: reviews due over the coming days, the streak of learning days, the weakest skills. */
import { addDays, learningDay, toMs } from './learning-day';
import { abilityOf, pSuccess, type Estimate } from './rasch';
import { predictedRetention, type StoredCard } from './schedule';

/** Reviews due on each of the next `days` learning days, starting today; overdue reviews count today. */
export function reviewsDueByDay(cards: readonly StoredCard[], now: Date | string | number, timeZone: string, days = 14): { day: string; count: number }[] {
	const today = learningDay(now, timeZone);
	const out = Array.from({ length: days }, (_, i) => ({ day: addDays(today, i), count: 0 }));
	const index = new Map(out.map((d, i) => [d.day, i]));
	for (const c of cards) {
		if (c.state === 0) continue;
		const d = learningDay(c.due, timeZone);
		const i = d <= today ? 0 : index.get(d);
		if (i != null) out[i].count++;
	}
	return out;
}

/**
 * The streak: consecutive learning days with activity, ending today, or ending yesterday when today has
 * none yet (the streak is not broken until the day is over). `activeDays` are 'YYYY-MM-DD' learning days.
 */
export function learningStreak(activeDays: readonly string[], now: Date | string | number, timeZone: string): number {
	const set = new Set(activeDays);
	let day = learningDay(now, timeZone);
	if (!set.has(day)) day = addDays(day, -1);
	let n = 0;
	while (set.has(day)) {
		n++;
		day = addDays(day, -1);
	}
	return n;
}

export type SkillStanding = { skillId: string; area: string; predictedSuccess: number; retention: number | null; score: number };

/**
 * The learner's weakest started skills, lowest first: score = Rasch success (area ability against the
 * skill's difficulty) × FSRS recall now (1 when the skill has no review history).
 */
export function weakestSkills(input: {
	skills: readonly { id: string; area: string; difficulty: number }[];
	cards: Readonly<Record<string, StoredCard>>;
	abilities: Readonly<Record<string, Estimate | number>>;
	now: Date | string | number;
	limit?: number;
}): SkillStanding[] {
	const nowMs = toMs(input.now);
	return input.skills
		.filter((s) => input.cards[s.id])
		.map((s) => {
			const card = input.cards[s.id];
			const p = pSuccess(abilityOf(input.abilities, s.area), s.difficulty);
			const r = card.last_review ? predictedRetention(card, (nowMs - toMs(card.last_review)) / 86_400_000) : null;
			return { skillId: s.id, area: s.area, predictedSuccess: p, retention: r, score: p * (r ?? 1) };
		})
		.sort((a, b) => a.score - b.score || (a.skillId < b.skillId ? -1 : 1))
		.slice(0, input.limit ?? 5);
}
