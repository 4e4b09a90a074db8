import { describe, expect, it } from 'vitest';
import { eloStep, itemInformation, mapAbility, pSuccess, pWithGuess, updateAbility, updateDifficulty } from './rasch';

describe('Rasch model and Elo updates', () => {
	it('gives the Rasch probability σ(θ − b) (Rasch 1960)', () => {
		expect(pSuccess(0, 0)).toBe(0.5);
		expect(pSuccess(1, 0)).toBeCloseTo(Math.E / (1 + Math.E), 12); // 0.731059
		expect(pSuccess(0, Math.log(3))).toBeCloseTo(0.25, 12); // odds 1:3
	});

	it('updates ability and difficulty by the Elo rule with K(n) = 1/(1 + 0.05n) (Pelánek 2016), worked by hand', () => {
		// First answer: θ = 0, b = 0, p = 0.5, K(0) = 1, right: θ' = 0 + 1·(1 − 0.5) = 0.5; b' = 0 − 1·(1 − 0.5) = −0.5.
		expect(updateAbility({ value: 0, count: 0 }, 0, true)).toEqual({ value: 0.5, count: 1 });
		expect(updateDifficulty({ value: 0, count: 0 }, 0, true)).toEqual({ value: -0.5, count: 1 });
		// Second: θ = 0.5 (n = 1), b = 1.0 (n = 10), p = σ(−0.5) = 0.377541, wrong.
		// K(1) = 1/1.05 = 0.952381: θ' = 0.5 − 0.952381·0.377541 = 0.140437.
		// K(10) = 1/1.5 = 0.666667: b' = 1.0 + 0.666667·0.377541 = 1.251694.
		expect(eloStep(1)).toBeCloseTo(0.952381, 6);
		expect(updateAbility({ value: 0.5, count: 1 }, 1, false).value).toBeCloseTo(0.140437, 6);
		expect(updateDifficulty({ value: 1, count: 10 }, 0.5, false).value).toBeCloseTo(1.251694, 6);
	});

	it('with a guessing chance predicts g + (1 − g)·σ(θ − b) and moves less on a right answer', () => {
		// θ = b, g = 0.25: p = 0.25 + 0.75·0.5 = 0.625; right: θ' = 0 + 1·(1 − 0.625) = 0.375.
		expect(pWithGuess(0, 0, 0.25)).toBe(0.625);
		expect(updateAbility({ value: 0, count: 0 }, 0, true, 0.25).value).toBeCloseTo(0.375, 12);
	});

	it('gives the item information of the 1PL and of the 3PL with unit slope (Baker 2001, The Basics of Item Response Theory, ch. 6)', () => {
		expect(itemInformation(0, 0)).toBe(0.25); // P·Q at P = 0.5
		// 3PL: I = (Q/P)·((P − c)/(1 − c))²; at θ = b, c = 0.25: P = 0.625, (0.375/0.625)·(0.375/0.75)² = 0.15.
		expect(itemInformation(0, 0, 0.25)).toBeCloseTo(0.15, 12);
	});

	it('finds the MAP ability: one right answer at b = 0 with a N(0, 1) prior solves θ = 1 − σ(θ), θ ≈ 0.401058', () => {
		// Hand-solved by fixed-point iteration of the score equation −θ + (1 − σ(θ)) = 0.
		expect(mapAbility([{ difficulty: 0, correct: true }], 0, 1)).toBeCloseTo(0.401058, 5);
		expect(mapAbility([{ difficulty: 0, correct: false }], 0, 1)).toBeCloseTo(-0.401058, 5);
		expect(mapAbility([], 0.3, 1)).toBe(0.3);
	});
});
