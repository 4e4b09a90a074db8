import { describe, expect, it } from 'vitest';
import { calibrateSuccessOffset, composeDailySet, type DailySetInput, type FirstAnswer, type SkillInfo } from './daily-set';
import { makeRng } from './rng';
import { newCard, type StoredCard } from './schedule';

// Rasch success σ(θ − b) written out here, independently of rasch.ts (Rasch 1960).
const rasch = (theta: number, b: number) => 1 / (1 + Math.exp(b - theta));
const NOW = '2026-04-20T17:00:00Z'; // 19:00 CEST in Berlin, learning day 2026-04-20

function skill(id: string, area: string, difficulty: number, variants = 3): SkillInfo {
	return { id, area, difficulty, variants: Array.from({ length: variants }, (_, i) => ({ id: `${id}-v${i}`, medianSeconds: 30 })) };
}
function dueCard(dueIso: string): StoredCard {
	return { ...newCard('2026-04-01T17:00:00Z'), state: 2, stability: 5, reps: 2, last_review: '2026-04-10T17:00:00.000Z', due: dueIso };
}

// Abilities: "wiring" is the weakest area (−0.5), then "relays" (0.2), "starting" (1.0).
const ABILITIES = { wiring: { value: -0.5, count: 8 }, relays: { value: 0.2, count: 8 }, starting: { value: 1, count: 8 } };
const SKILLS: SkillInfo[] = [
	skill('splice-reading', 'wiring', -2.4), // σ(1.9) = 0.870, above the band
	skill('ground-paths', 'wiring', -2.1), // σ(1.6) = 0.832, inside 80–85 %
	skill('open-location', 'wiring', 0.5), // σ(−1.0) = 0.269, below the floor
	skill('relay-coil', 'relays', -1.3), // σ(1.5) = 0.818, inside
	skill('relay-contacts', 'relays', 0),
	skill('starter-control', 'starting', -0.6),
	skill('cranking-drop', 'starting', 0.4)
];

function input(over: Partial<DailySetInput> = {}): DailySetInput {
	return {
		now: NOW,
		timeZone: 'Europe/Berlin',
		skills: SKILLS,
		cards: { 'relay-contacts': dueCard('2026-04-18T02:00:00.000Z'), 'starter-control': dueCard('2026-04-20T02:00:00.000Z'), 'cranking-drop': dueCard('2026-04-25T02:00:00.000Z') },
		lastVariant: { 'relay-contacts': 'relay-contacts-v1', 'starter-control': 'starter-control-v0' },
		abilities: ABILITIES,
		seed: 7,
		...over
	};
}

describe('composeDailySet', () => {
	it('puts due reviews first (most overdue first), then new skills; a skill not yet due waits', () => {
		const set = composeDailySet(input());
		expect(set.day).toBe('2026-04-20');
		const kinds = set.items.map((i) => i.kind);
		expect(kinds.slice(0, 2)).toEqual(['review', 'review']);
		expect(kinds.slice(2).every((k) => k === 'new')).toBe(true);
		expect(set.items.slice(0, 2).map((i) => i.skillId)).toEqual(['relay-contacts', 'starter-control']);
		expect(set.items[0].reason).toBe('review due 2 days ago');
		expect(set.items.some((i) => i.skillId === 'cranking-drop')).toBe(false);
	});

	it('serves a fresh variant of each reviewed skill, never the one seen last (every seed)', () => {
		for (let seed = 0; seed < 200; seed++)
			for (const item of composeDailySet(input({ seed })).items.filter((i) => i.kind === 'review'))
				expect(item.itemId).not.toBe(input().lastVariant[item.skillId]);
	});

	it('skips a due skill that has no other variant, and says so', () => {
		const only = SKILLS.map((s) => (s.id === 'relay-contacts' ? { ...s, variants: [{ id: 'relay-contacts-v1' }] } : s));
		const set = composeDailySet(input({ skills: only }));
		expect(set.items.some((i) => i.skillId === 'relay-contacts')).toBe(false);
		expect(set.skipped).toEqual([{ skillId: 'relay-contacts', reason: 'due, but it has no variant other than the one seen last' }]);
	});

	it('takes new skills from the weakest area first, inside the 80–85 % band', () => {
		const set = composeDailySet(input());
		const fresh = set.items.filter((i) => i.kind === 'new');
		expect(fresh[0].skillId).toBe('ground-paths');
		expect(fresh[0].area).toBe('wiring');
		expect(fresh[0].predictedSuccess).toBeCloseTo(rasch(-0.5, -2.1), 12); // 0.832
		expect(fresh[0].predictedSuccess).toBeGreaterThanOrEqual(0.8);
		expect(fresh[0].predictedSuccess).toBeLessThanOrEqual(0.85);
		expect(fresh[0].reason).toMatch(/weakest area \(wiring\).*inside the 80 %–85 % band/);
		// Then the nearest left in the weakest area (0.870, above the band, stated), never the one below the floor.
		expect(fresh[1].skillId).toBe('splice-reading');
		expect(fresh[1].reason).toMatch(/nearest to the 80 %–85 % band/);
		expect(fresh.some((i) => i.skillId === 'open-location')).toBe(false);
		// Then the next weakest area.
		expect(fresh[2].skillId).toBe('relay-coil');
	});

	it('counts the guessing chance of a choice item in the predicted success', () => {
		const choice = SKILLS.map((s) => (s.area === 'wiring' ? { ...s, guess: 0.25 } : s));
		const set = composeDailySet(input({ skills: choice }));
		const first = set.items.find((i) => i.kind === 'new')!;
		// With g = 0.25 the wiring skills predict 0.903, 0.874 and 0.452 (below the floor): none is in the
		// band, so the nearest, ground-paths at 0.25 + 0.75·0.832 = 0.874, comes first.
		expect(first.skillId).toBe('ground-paths');
		expect(first.reason).toMatch(/nearest to the 80 %–85 % band/);
		expect(first.predictedSuccess).toBeCloseTo(0.25 + 0.75 * rasch(-0.5, -2.1), 12);
	});

	it('stops at the item limit and at the time limit (10 minutes by default)', () => {
		expect(composeDailySet(input({ settings: { maxItems: 3 } })).items).toHaveLength(3);
		// 30 s items: 2 minutes hold 4 of them.
		const set = composeDailySet(input({ settings: { maxMinutes: 2 } }));
		expect(set.items).toHaveLength(4);
		expect(set.minutes).toBe(2);
	});

	it('adds no new skill while due reviews are left out for lack of time', () => {
		// Two 30 s reviews are due; a 0.5-minute budget holds one, so the other waits and no new skill comes in.
		const set = composeDailySet(input({ settings: { maxMinutes: 0.5 } }));
		expect(set.items.map((i) => i.kind)).toEqual(['review']);
	});

	it('adds no new skills in the week before the exam', () => {
		const set = composeDailySet(input({ examDate: '2026-04-25' }));
		expect(set.items.every((i) => i.kind === 'review')).toBe(true);
		expect(composeDailySet(input({ examDate: '2026-05-20' })).items.some((i) => i.kind === 'new')).toBe(true);
	});

	it('never leaves a learner with nothing to do: with no review due and no skill above the floor it starts the one nearest the band', () => {
		// Only hard skills left: σ(−0.5 − 0.5) = 0.269 and σ(0.2 − 0.6) = 0.401, both below the 75 % floor.
		// The weakest area (wiring) comes first, as for any new skill; only one is started.
		const hard = [skill('open-location', 'wiring', 0.5), skill('relay-load', 'relays', 0.6)];
		const set = composeDailySet(input({ skills: hard, cards: {}, lastVariant: {} }));
		expect(set.items.map((i) => i.skillId)).toEqual(['open-location']);
		expect(set.items[0].predictedSuccess).toBeCloseTo(rasch(-0.5, 0.5), 6);
		expect(set.items[0].reason).toMatch(/below the usual 75 % floor/);
		// With a review due, the floor holds: the review alone is served.
		const withReview = composeDailySet(
			input({ skills: [...hard, skill('relay-contacts', 'relays', 0)], cards: { 'relay-contacts': dueCard('2026-04-18T02:00:00.000Z') }, lastVariant: {} })
		);
		expect(withReview.items.map((i) => i.kind)).toEqual(['review']);
	});

	it('is deterministic for a seed', () => {
		expect(composeDailySet(input({ seed: 'x' }))).toEqual(composeDailySet(input({ seed: 'x' })));
	});
});

describe('new-skill success offset', () => {
	it('shifts the prediction of new skills by the offset and picks the skill inside the band under it', () => {
		// δ = −0.5 in wiring (θ = −0.5): splice-reading σ(−1.0 + 2.4) = σ(1.4) = 0.802 is now inside 80–85 %,
		// ground-paths σ(1.1) = 0.750 falls below it (still at the 75 % floor), open-location stays out.
		const set = composeDailySet(input({ successOffset: -0.5 }));
		const fresh = set.items.filter((i) => i.kind === 'new');
		expect(fresh[0].skillId).toBe('splice-reading');
		expect(fresh[0].predictedSuccess).toBeCloseTo(rasch(-1, -2.4), 12); // 0.802184
		expect(fresh[0].reason).toMatch(/inside the 80 %–85 % band/);
		expect(fresh.some((i) => i.skillId === 'open-location')).toBe(false);
		// The default (no offset) is the plain Rasch prediction: ground-paths first, as above.
		expect(composeDailySet(input()).items.find((i) => i.kind === 'new')!.skillId).toBe('ground-paths');
		expect(() => composeDailySet(input({ successOffset: Number.NaN }))).toThrow(/success offset must be a finite number/);
	});

	it('solves the MAP offset by hand: one right answer at θ = b with a N(0, 1) prior gives δ = 1 − σ(δ), δ ≈ 0.401058', () => {
		// Fixed point of the score equation −δ + (1 − σ(δ)) = 0 (Rasch 1960 likelihood, normal prior).
		expect(calibrateSuccessOffset([{ ability: 0.7, difficulty: 0.7, correct: true }], { priorSd: 1, minAnswers: 1 })).toBeCloseTo(0.401058, 5);
		expect(calibrateSuccessOffset([{ ability: 0.7, difficulty: 0.7, correct: true }])).toBe(0); // fewer than 20 answers
	});

	it('recovers an overstated ability: first answers drawn 0.6 logit below the estimate, with a 1-in-4 guess on some (Birnbaum 1968 model)', () => {
		const rng = makeRng(5);
		const answers: FirstAnswer[] = Array.from({ length: 2000 }, () => {
			const ability = 3 * rng.next() - 1.5;
			const difficulty = ability - 2 + 2 * rng.next();
			const guess = rng.next() < 0.6 ? 0.25 : 0;
			const p = guess + (1 - guess) * rasch(ability - 0.6, difficulty);
			return { ability, difficulty, guess, correct: rng.next() < p };
		});
		const delta = calibrateSuccessOffset(answers, { window: 2000 });
		// With 2000 answers the standard error is about 0.07 logit; a fit ignoring the guess would land far off.
		expect(delta).toBeGreaterThan(-0.8);
		expect(delta).toBeLessThan(-0.4);
		const noGuess = calibrateSuccessOffset(answers.map((a) => ({ ...a, guess: 0 })), { window: 2000 });
		expect(noGuess).toBeGreaterThan(-0.4);
	});
});
