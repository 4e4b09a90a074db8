import { describe, expect, it } from 'vitest';
import { allocateByWeight, examMixFromWeights, passMark, poissonBinomial, readiness } from './readiness';

describe('readiness', () => {
	// Hand-computed Poisson-binomial for three items right with 0.9, 0.8 and 0.5:
	// P(0) = .1·.2·.5 = 0.01; P(1) = .9·.2·.5 + .1·.8·.5 + .1·.2·.5 = 0.14;
	// P(2) = .9·.8·.5 + .9·.2·.5 + .1·.8·.5 = 0.49; P(3) = .9·.8·.5 = 0.36.
	it('computes the distribution of the total by the exact recursion (Poisson-binomial, Hong 2013)', () => {
		const d = poissonBinomial([0.9, 0.8, 0.5]);
		[0.01, 0.14, 0.49, 0.36].forEach((p, k) => expect(d[k]).toBeCloseTo(p, 12));
	});

	it('gives the pass probability of a 3-item exam at our 70 % cut (3 of 3 needed) and at 60 % (2 of 3)', () => {
		// Ability 0 against difficulties −ln 9, −ln 4 and 0 gives Rasch successes 0.9, 0.8, 0.5.
		const items = [
			{ area: 'a', difficulty: -Math.log(9) },
			{ area: 'a', difficulty: -Math.log(4) },
			{ area: 'b', difficulty: 0 }
		];
		const r = readiness({ abilities: { a: { value: 0, count: 5 }, b: 0 }, items });
		expect(r.passMark).toBe(3);
		expect(r.probability).toBeCloseTo(0.36, 12);
		expect(r.expectedScore).toBeCloseTo(2.2, 12);
		expect(r.label).toBe('estimate');
		expect(readiness({ abilities: { a: 0, b: 0 }, items, cutScore: 0.6 }).probability).toBeCloseTo(0.49 + 0.36, 12);
	});

	it('needs 35 of 50 at 70 %', () => {
		expect(passMark(50)).toBe(35);
		expect(passMark(10, 0.75)).toBe(8);
	});

	it('splits 50 items by area weight (largest remainder) and spreads each share over the area’s skills', () => {
		const weights = { a: 12, b: 14, c: 14, d: 10, e: 8, f: 10, g: 10, h: 10, i: 12 };
		// Each weight is in percent, so each share is weight / 2 of 50: all whole numbers here.
		expect(allocateByWeight(weights, 50)).toEqual({ a: 6, b: 7, c: 7, d: 5, e: 4, f: 5, g: 5, h: 5, i: 6 });
		// 3 items over weights 1:1:1 → one each; 4 items → one area gets the extra (ties by name).
		expect(allocateByWeight({ x: 1, y: 1, z: 1 }, 4)).toEqual({ x: 2, y: 1, z: 1 });
		const mix = examMixFromWeights({ a: 50, b: 50 }, [{ area: 'a', difficulty: 1 }, { area: 'a', difficulty: -1 }, { area: 'b', difficulty: 0 }], 4);
		expect(mix.map((m) => `${m.area}${m.difficulty}`).sort()).toEqual(['a-1', 'a1', 'b0', 'b0']);
	});

	it('explains a bad input', () => {
		expect(() => readiness({ abilities: {}, items: [] })).toThrow(/at least one item/);
		expect(() => poissonBinomial([1.2])).toThrow(/Not a probability: 1.2/);
		expect(() => allocateByWeight({ a: 0 }, 5)).toThrow(/positive weight/);
	});
});
