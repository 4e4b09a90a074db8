import { describe, expect, it } from 'vitest';
import { itemStatistics } from './review';

// Pearson's product-moment correlation, written out independently: the point-biserial coefficient is
// Pearson's r between a 0/1 variable and a continuous one (Tate 1954, "Correlation between a discrete
// and a continuous variable", Ann. Math. Statist. 25(3)).
function pearson(x: number[], y: number[]): number {
	const n = x.length;
	const mx = x.reduce((a, b) => a + b, 0) / n;
	const my = y.reduce((a, b) => a + b, 0) / n;
	let sxy = 0, sxx = 0, syy = 0;
	for (let i = 0; i < n; i++) {
		sxy += (x[i] - mx) * (y[i] - my);
		sxx += (x[i] - mx) ** 2;
		syy += (y[i] - my) ** 2;
	}
	return sxy / Math.sqrt(sxx * syy);
}

describe('itemStatistics', () => {
	it('gives the point-biserial discrimination, equal to Pearson r of score and ability', () => {
		const ability = [1, 2, 3, 4, 5];
		const correct = [false, false, true, true, true];
		const s = itemStatistics(ability.map((a, i) => ({ abilityBefore: a, correct: correct[i], ms: 1000 * (i + 1) })))!;
		// Worked by hand: M1 = 4, M0 = 1.5, s = sqrt(2), p = 0.6, so r = 2.5 / sqrt(2) * sqrt(0.24) = sqrt(3)/2.
		expect(s.discrimination).toBeCloseTo(Math.sqrt(3) / 2, 9);
		expect(s.discrimination).toBeCloseTo(pearson(correct.map(Number), ability), 9);
		expect(s.pCorrect).toBeCloseTo(0.6, 9);
		expect(s.medianMs).toBe(3000);
	});

	it('matches Pearson r on an uneven set, and has no discrimination when everyone is right', () => {
		const ability = [-1.2, 0.4, 0.1, 2.2, -0.3, 0.9, 1.5, -2.0];
		const correct = [false, true, false, true, true, false, true, false];
		const s = itemStatistics(ability.map((a, i) => ({ abilityBefore: a, correct: correct[i], ms: 500 })))!;
		expect(s.discrimination).toBeCloseTo(pearson(correct.map(Number), ability), 9);
		expect(itemStatistics(ability.map((a) => ({ abilityBefore: a, correct: true, ms: 1 })))!.discrimination).toBeNull();
		expect(itemStatistics([])).toBeNull();
	});
});
