import { describe, expect, it } from 'vitest';
import { forgetting_curve, generatorParameters } from 'ts-fsrs';
import { learningStreak, reviewsDueByDay, weakestSkills } from './progress';
import { newCard, type StoredCard } from './schedule';

const card = (due: string, extra: Partial<StoredCard> = {}): StoredCard => ({ ...newCard('2026-01-01T00:00:00Z'), state: 2, stability: 10, reps: 3, last_review: '2026-03-20T18:00:00.000Z', due, ...extra });

describe('progress helpers', () => {
	it('counts reviews due on each of the next 14 learning days, overdue ones today (Denver, across the DST end)', () => {
		// Learning days start at 04:00 local: 04:00 MDT = 10:00 UTC before 1 November, 04:00 MST = 11:00 UTC after (tzdata).
		const cards = [
			card('2026-10-25T10:00:00Z'), // overdue → today
			card('2026-10-30T10:00:00Z'), // today
			card('2026-11-01T10:30:00Z'), // 03:30 MST on 1 November → still learning day 31 October
			card('2026-11-01T11:00:00Z'), // 04:00 MST → 1 November
			card('2026-11-13T11:00:00Z'), // 14 days on: outside the window
			card('2026-11-20T11:00:00Z', { state: 0 }) // a new card is not a review
		];
		const days = reviewsDueByDay(cards, '2026-10-31T02:00:00Z', 'America/Denver');
		expect(days).toHaveLength(14);
		expect(days[0]).toEqual({ day: '2026-10-30', count: 2 });
		expect(days[1]).toEqual({ day: '2026-10-31', count: 1 });
		expect(days[2]).toEqual({ day: '2026-11-01', count: 1 });
		expect(days.at(-1)!.day).toBe('2026-11-12');
		expect(days.reduce((s, d) => s + d.count, 0)).toBe(4);
	});

	it('counts the streak of learning days, unbroken until today is over', () => {
		const active = ['2026-03-25', '2026-03-26', '2026-03-27', '2026-03-29'];
		// 03:00 CEST on 30 March is still learning day 29 March: streak 1 (the 28th is missing).
		expect(learningStreak(active, '2026-03-30T01:00:00Z', 'Europe/Berlin')).toBe(1);
		// On the 28th before any activity: 25, 26, 27 count.
		expect(learningStreak(active, '2026-03-28T12:00:00Z', 'Europe/Berlin')).toBe(3);
		expect(learningStreak(active, '2026-04-05T12:00:00Z', 'Europe/Berlin')).toBe(0);
	});

	it('lists the weakest started skills by Rasch success × FSRS recall, lowest first', () => {
		const skills = [
			{ id: 'splices', area: 'wiring', difficulty: 0 },
			{ id: 'grounds', area: 'wiring', difficulty: 1 },
			{ id: 'relays', area: 'relays', difficulty: -1 },
			{ id: 'unstarted', area: 'relays', difficulty: 3 }
		];
		const cards = { splices: card('2026-04-01T04:00:00Z'), grounds: card('2026-04-01T04:00:00Z'), relays: card('2026-04-01T04:00:00Z', { stability: 1 }) };
		const out = weakestSkills({ skills, cards, abilities: { wiring: 0, relays: 0 }, now: '2026-03-30T18:00:00Z' });
		// Expected scores from ts-fsrs's FSRS-6 forgetting curve, 10 days after the last review.
		const w = generatorParameters().w;
		const sig = (x: number) => 1 / (1 + Math.exp(-x));
		const expected = { grounds: sig(-1) * forgetting_curve(w, 10, 10), splices: sig(0) * forgetting_curve(w, 10, 10), relays: sig(1) * forgetting_curve(w, 10, 1) };
		const order = Object.entries(expected).sort((a, b) => a[1] - b[1]).map(([k]) => k);
		expect(out.map((s) => s.skillId)).toEqual(order);
		for (const s of out) expect(s.score).toBeCloseTo(expected[s.skillId as keyof typeof expected], 9);
		// grounds: σ(−1) = 0.268941 before recall; relays: σ(1) = 0.731059 (Rasch 1960).
		expect(out[0].predictedSuccess).toBeCloseTo(0.268941, 6);
		expect(out.find((s) => s.skillId === 'relays')!.predictedSuccess).toBeCloseTo(0.731059, 6);
		expect(out.find((s) => s.skillId === 'relays')!.retention!).toBeLessThan(out.find((s) => s.skillId === 'splices')!.retention!);
	});
});
