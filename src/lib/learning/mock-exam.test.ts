import { describe, expect, it } from 'vitest';
import { assembleMockExam, type ExamCandidate } from './mock-exam';

const WEIGHTS = { wiring: 30, relays: 30, starting: 20, charging: 20 };
// 4 areas × 5 skills × 6 variants = 120 items.
const BANK: ExamCandidate[] = Object.keys(WEIGHTS).flatMap((area) =>
	Array.from({ length: 5 }, (_, k) => Array.from({ length: 6 }, (_, v) => ({ id: `${area}-${k}-v${v}`, skillId: `${area}-${k}`, area }))).flat()
);
const NOW = '2026-06-01T12:00:00Z';
const DAY = 86_400_000;

describe('assembleMockExam', () => {
	it('draws 50 items in 60 minutes by area weight (30/30/20/20 % of 50 = 15/15/10/10), no item twice', () => {
		const exam = assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 1 });
		expect(exam.items).toHaveLength(50);
		expect(exam.minutes).toBe(60);
		expect(new Set(exam.items.map((i) => i.id)).size).toBe(50);
		const count = (a: string) => exam.items.filter((i) => i.area === a).length;
		expect([count('wiring'), count('relays'), count('starting'), count('charging')]).toEqual([15, 15, 10, 10]);
		// Each area's share spreads over its 5 skills: 15 items → 3 per skill.
		const perSkill = new Set(exam.items.filter((i) => i.area === 'wiring').map((i) => i.skillId));
		expect(perSkill.size).toBe(5);
		expect(exam.notes).toEqual([]);
	});

	it('leaves out items seen in the last 30 days, and keeps those seen 31 days ago', () => {
		const lastSeen: Record<string, string> = {};
		for (const c of BANK) if (c.area === 'wiring' && !c.id.endsWith('v0')) lastSeen[c.id] = new Date(Date.parse(NOW) - 29 * DAY).toISOString();
		lastSeen['wiring-0-v0'] = new Date(Date.parse(NOW) - 31 * DAY).toISOString();
		const exam = assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen, now: NOW, seed: 2 });
		for (const it of exam.items) if (lastSeen[it.id]) expect(Date.parse(NOW) - Date.parse(lastSeen[it.id])).toBeGreaterThan(30 * DAY);
		// Only the five v0 wiring items are fresh: the area gets 5 of its 15, the rest comes from other areas.
		expect(exam.perArea.wiring).toEqual({ wanted: 15, got: 5 });
		expect(exam.items).toHaveLength(50);
		expect(exam.notes[0]).toBe('wiring: only 5 of 15 items unseen in 30 days');
		expect(exam.notes[1]).toBe('10 items taken from other areas to fill the gap');
	});

	it('is shorter, and says so, when fewer fresh items exist; time scales with length', () => {
		const exam = assembleMockExam({ candidates: BANK.slice(0, 20), weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 3, count: 40, minutes: 48 });
		expect(exam.items).toHaveLength(20);
		expect(exam.minutes).toBe(24);
		expect(exam.notes.at(-1)).toBe('only 20 unseen items exist, so this mock exam has 20 items instead of 40');
	});

	it('is deterministic for a seed and differs between seeds', () => {
		const a = assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 'a' });
		expect(assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 'a' })).toEqual(a);
		expect(assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 'b' }).items).not.toEqual(a.items);
	});

	it('explains a bad length', () => {
		expect(() => assembleMockExam({ candidates: BANK, weights: WEIGHTS, lastSeen: {}, now: NOW, seed: 1, count: 0 })).toThrow(/at least 1, not 0/);
	});
});
