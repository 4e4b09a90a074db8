import { describe, expect, it } from 'vitest';
import { forgetting_curve, generatorParameters } from 'ts-fsrs';
import { addDays } from './learning-day';
import { calibrateMemoryFactor, desiredRetention, newCard, rateAnswer, scheduleReview, type StoredCard } from './schedule';
import { makeRng } from './rng';

describe('rateAnswer (the rule in docs/learning.md)', () => {
	it.each([
		[{ correct: false, seconds: 10, medianSeconds: 40 }, 1, 'wrong → Again'],
		[{ correct: false }, 1, 'wrong without a time → Again'],
		[{ correct: true, seconds: 61, medianSeconds: 40 }, 2, 'right, slower than 1.5 × 40 s → Hard'],
		[{ correct: true, seconds: 60, medianSeconds: 40 }, 3, 'right at exactly 1.5 × the median → Good'],
		[{ correct: true, seconds: 5, medianSeconds: 40 }, 3, 'right and fast → Good (we never give Easy)'],
		[{ correct: true, seconds: 300, medianSeconds: null }, 3, 'right with no median yet → Good']
	] as [Parameters<typeof rateAnswer>[0], number, string][])('%o → %i (%s)', (answer, rating) => {
		expect(rateAnswer(answer)).toBe(rating);
	});
});

describe('scheduleReview', () => {
	it('keeps the card plain serialisable data with ISO dates', () => {
		const { card } = scheduleReview(null, 3, '2026-05-01T18:00:00Z', { timeZone: 'UTC' });
		expect(JSON.parse(JSON.stringify(card))).toEqual(card);
		expect(card.last_review).toBe('2026-05-01T18:00:00.000Z');
		expect(card.reps).toBe(1);
	});

	// Wall-clock offsets from the IANA tz database (see learning-day.test.ts): after the change a due date
	// at 04:00 local is 11:00 UTC in Denver (MST, UTC−7) and 02:00 UTC in Berlin (CEST, UTC+2).
	it('puts a Denver learner’s due date at 04:00 MST after the November DST end', () => {
		// 20:00 MDT on Friday 30 October 2026 = 02:00 UTC on the 31st; the learning day is 30 October.
		const r = scheduleReview(null, 3, '2026-10-31T02:00:00Z', { timeZone: 'America/Denver', learningStepDays: 0 });
		const days = r.card.scheduled_days;
		expect(days).toBeGreaterThanOrEqual(2); // so the due day is on or after 1 November
		expect(r.dueDay).toBe(addDays('2026-10-30', days));
		expect(r.card.due).toBe(new Date(Date.UTC(2026, 9, 30 + days, 11)).toISOString());
	});

	it('puts a Berlin learner’s due date at 04:00 CEST after the March change', () => {
		// 21:00 CET on Friday 27 March 2026 = 20:00 UTC.
		const r = scheduleReview(null, 3, '2026-03-27T20:00:00Z', { timeZone: 'Europe/Berlin', learningStepDays: 0 });
		const days = r.card.scheduled_days;
		expect(days).toBeGreaterThanOrEqual(2);
		expect(r.card.due).toBe(new Date(Date.UTC(2026, 2, 27 + days, 2)).toISOString());
		// A review at 03:30 CEST on the 29th (01:30 UTC) still belongs to the 28th: it counts from there.
		const late = scheduleReview(null, 3, '2026-03-29T01:30:00Z', { timeZone: 'Europe/Berlin', learningStepDays: 0 });
		expect(late.dueDay).toBe(addDays('2026-03-28', late.card.scheduled_days));
	});

	it('raises the desired retention linearly over the 21 days before the exam (our rule, docs/learning.md)', () => {
		// 0.92 + (0.95 − 0.92)·(1 − 7/21) = 0.94
		expect(desiredRetention(7)).toBeCloseTo(0.94, 12);
		expect(desiredRetention(30)).toBe(0.92);
		expect(desiredRetention(null)).toBe(0.92);
		expect(desiredRetention(1)).toBeCloseTo(0.92 + 0.03 * (20 / 21), 12);
		// With the base given, the same ramp from it: 0.90 + (0.95 − 0.90)·(1 − 7/21) = 0.933333.
		expect(desiredRetention(7, 0.9)).toBeCloseTo(0.933333, 6);
	});

	const mature: StoredCard = {
		...newCard('2026-01-01T12:00:00Z'),
		state: 2,
		stability: 30,
		difficulty: 5,
		reps: 5,
		scheduled_days: 30,
		last_review: '2026-01-01T12:00:00Z',
		due: '2026-01-31T04:00:00.000Z'
	};

	it('places a last review the day before the exam when the next interval would pass it', () => {
		const now = '2026-01-31T18:00:00Z';
		const free = scheduleReview(mature, 3, now, { timeZone: 'UTC' });
				expect(free.dueDay > '2026-03-10').toBe(true);
		const r = scheduleReview(mature, 3, now, { timeZone: 'UTC', examDate: '2026-03-10' });
		expect(r.dueDay).toBe('2026-03-09');
		expect(r.card.due).toBe('2026-03-09T04:00:00.000Z');
		expect(r.reason).toMatch(/last review before the exam on 2026-03-10: FSRS predicts \d+ % retention/);
		// The same card's memory state is unchanged by the move: only the due date is placed.
		expect(r.card.stability).toBeCloseTo(free.card.stability, 12);
	});

	it('leaves the due date alone when the exam is after it', () => {
		const r = scheduleReview(null, 3, '2026-01-31T18:00:00Z', { timeZone: 'UTC', examDate: '2026-06-01', learningStepDays: 0 });
		expect(r.reason).toMatch(/^FSRS interval/);
	});

	it('reviews a skill again the next learning day after its first answer and after a lapse (learning step, common practice)', () => {
		// 19:00 in Berlin on 20 April (CEST, UTC+2) = 17:00 UTC; the next learning day starts 04:00 CEST on the 21st.
		const now = '2026-04-20T17:00:00Z';
		const first = scheduleReview(null, 3, now, { timeZone: 'Europe/Berlin' });
		expect(first.dueDay).toBe('2026-04-21');
		expect(first.card.due).toBe('2026-04-21T02:00:00.000Z');
		expect(first.reason).toBe('learning step: first answer on this skill, review again in 1 day');
		// Without the step FSRS-6's first Good (initial stability w₂ ≈ 2.3 days) gives 2 days or more.
		expect(scheduleReview(null, 3, now, { timeZone: 'Europe/Berlin', learningStepDays: 0 }).card.scheduled_days).toBeGreaterThanOrEqual(2);
		// A mature card (stability 30 days) answered wrong comes back the next day; answered right it does not.
		const lapse = scheduleReview(mature, 1, '2026-01-31T18:00:00Z', { timeZone: 'UTC' });
		expect(lapse.dueDay).toBe('2026-02-01');
		expect(lapse.reason).toMatch(/^learning step: forgotten/);
		expect(lapse.card.lapses).toBe(mature.lapses + 1);
		expect(scheduleReview(mature, 3, '2026-01-31T18:00:00Z', { timeZone: 'UTC' }).card.scheduled_days).toBeGreaterThan(1);
		expect(() => scheduleReview(null, 3, now, { timeZone: 'UTC', learningStepDays: 0.5 })).toThrow(/learning step must be a whole number/);
	});

	it('names what is wrong with a bad rating, exam date or time zone', () => {
		expect(() => scheduleReview(null, 7 as 3, '2026-01-01T00:00:00Z', { timeZone: 'UTC' })).toThrow(/Not a rating: 7/);
		expect(() => scheduleReview(null, 3, '2026-01-01T00:00:00Z', { timeZone: 'UTC', examDate: '10/02/2026' })).toThrow(/YYYY-MM-DD/);
		expect(() => scheduleReview(null, 3, '2026-01-01T00:00:00Z', { timeZone: 'Nowhere/Else' })).toThrow(/Unknown time zone/);
	});
});

describe('calibrateMemoryFactor', () => {
	it('recovers a learner who forgets twice as fast as FSRS’s defaults (answers drawn from the FSRS-6 curve, Ye et al.)', () => {
		const w = generatorParameters().w;
		const rng = makeRng(11);
		const reviews = Array.from({ length: 4000 }, () => {
			const stability = 1 + rng.next() * 30;
			const elapsedDays = rng.next() * 6 * stability;
			return { stability, elapsedDays, correct: rng.next() < forgetting_curve(w, elapsedDays, stability * 0.5) };
		});
		// FSRS-6's curve is flat (decay 0.1542), so one learner's few hundred reviews pin m only loosely;
		// 4000 reviews make the check tight enough to fail on a wrong fit.
		const m = calibrateMemoryFactor(reviews, { window: 4000 });
		// The grid steps by a factor 10^(1/15) ≈ 1.17, so 0.5 lands on a neighbouring point.
		expect(m).toBeGreaterThan(0.4);
		expect(m).toBeLessThan(0.62);
		// A learner who remembers as FSRS expects stays near 1.
		const typical = reviews.map((r) => ({ ...r, correct: rng.next() < forgetting_curve(w, r.elapsedDays, r.stability) }));
		const m1 = calibrateMemoryFactor(typical, { window: 4000 });
		expect(m1).toBeGreaterThan(0.8);
		expect(m1).toBeLessThan(1.25);
		expect(calibrateMemoryFactor(reviews.slice(0, 10))).toBe(1); // too few reviews: FSRS's defaults
	});
});
