/**
 * LU with partial pivoting and union-find, checked against hand-solved textbook networks and by
 * residuals on seeded random systems.
 */
import { describe, expect, it } from 'vitest';
import { SingularMatrixError, luFactor, luFactorByPlan, luFactorRecorded, luSolve, luSolveByPlan, makeSpans } from './lu';
import { findRoot, makeSets, unite } from './union-find';

function solve(rows: number[][], b: number[]): number[] {
	const n = rows.length;
	const a = Float64Array.from(rows.flat());
	const perm = new Int32Array(n);
	const x = new Float64Array(n);
	luFactor(a, n, perm);
	luSolve(a, n, perm, Float64Array.from(b), x);
	return [...x];
}

describe('luFactor / luSolve', () => {
	it('solves the nodal equations of a voltage divider (Lessons In Electric Circuits Vol. I ch. 6.1)', () => {
		// 45 V; 5 kΩ, 10 kΩ, 7.5 kΩ in series; drops 10, 20, 15 V, so the inner nodes sit at 35 V and 15 V
		const g1 = 1 / 5000;
		const g2 = 1 / 10000;
		const g3 = 1 / 7500;
		const x = solve(
			[
				[g1 + g2, -g2],
				[-g2, g2 + g3]
			],
			[45 * g1, 0]
		);
		expect(x[0]).toBeCloseTo(35, 10);
		expect(x[1]).toBeCloseTo(15, 10);
	});

	it('pivots past the zero diagonal of a voltage source row (OpenStax College Physics Example 21.1)', () => {
		// 12.0 V across 1.00, 6.00, 13.0 Ω in series: 0.600 A; drops 0.600, 3.60, 7.80 V.
		// Unknowns V1 (source +), V2, V3 and the source current I (+ to − through the source).
		const x = solve(
			[
				[1 / 1, -1, 0, 1],
				[-1, 1 + 1 / 6, -1 / 6, 0],
				[0, -1 / 6, 1 / 6 + 1 / 13, 0],
				[1, 0, 0, 0]
			],
			[0, 0, 0, 12]
		);
		expect(x[0]).toBeCloseTo(12, 12);
		expect(x[1]).toBeCloseTo(11.4, 12);
		expect(x[2]).toBeCloseTo(7.8, 12);
		expect(x[3]).toBeCloseTo(-0.6, 12);
	});

	it('swaps rows when the first pivot is zero', () => {
		// hand: [[0, 1], [1, 0]] x = [2, 3] gives x = [3, 2]
		expect(solve([[0, 1], [1, 0]], [2, 3])).toEqual([3, 2]);
	});

	it('throws SingularMatrixError naming the column for a singular matrix', () => {
		const a = Float64Array.from([1, 2, 2, 4]);
		let err: unknown = null;
		try {
			luFactor(a, 2, new Int32Array(2));
		} catch (e) {
			err = e;
		}
		expect(err).toBeInstanceOf(SingularMatrixError);
		expect((err as SingularMatrixError).column).toBe(1);
	});

	it('leaves a residual below 1e-10 on seeded random dense and sparse systems that need row swaps', () => {
		let seed = 12345;
		const rnd = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648) * 2 - 1;
		for (let t = 0; t < 60; t++) {
			const n = 2 + (t % 25);
			const rows = Array.from({ length: n }, () => Array.from({ length: n }, () => (rnd() > (t % 2 ? 0.6 : -2) ? rnd() : 0)));
			for (let i = 0; i < n; i++) rows[i][(i + t) % n] += 1.5; // a shifted diagonal: non-singular, and it needs row swaps
			const b = Array.from({ length: n }, () => rnd());
			const x = solve(rows, b);
			for (let i = 0; i < n; i++) {
				let r = -b[i];
				for (let j = 0; j < n; j++) r += rows[i][j] * x[j];
				expect(Math.abs(r)).toBeLessThan(1e-10);
			}
		}
	});
});

describe('recorded LU schedules', () => {
	/** A seeded nodal matrix: conductances on a random tree plus a few loops, and a meter to ground on every node. */
	function nodal(n: number, seed: number): { a: Float64Array; b: Float64Array } {
		let sd = seed;
		const rnd = () => (sd = (sd * 1103515245 + 12345) % 2147483648) / 2147483648;
		const a = new Float64Array(n * n);
		const stamp = (i: number, j: number, g: number) => {
			a[i * n + i] += g;
			a[j * n + j] += g;
			a[i * n + j] -= g;
			a[j * n + i] -= g;
		};
		for (let i = 1; i < n; i++) stamp(i, Math.floor(rnd() * i), 10 ** (rnd() * 6 - 2));
		for (let k = 0; k < n / 4; k++) {
			const i = Math.floor(rnd() * n);
			const j = Math.floor(rnd() * n);
			if (i !== j) stamp(i, j, 10 ** (rnd() * 6 - 2));
		}
		for (let i = 0; i < n; i++) a[i * n + i] += 1e-7;
		return { a, b: Float64Array.from({ length: n }, () => rnd() * 24 - 12) };
	}

	it('replays to bit-identical solutions with a small residual on seeded nodal systems', () => {
		for (let t = 0; t < 40; t++) {
			const n = 2 + (t % 30);
			const { a, b } = nodal(n, 777 + t);
			// the reference: the factorisation and the row-list solve the engine runs without a schedule
			const ref = a.slice();
			const perm = new Int32Array(n);
			const x1 = new Float64Array(n);
			const refSpans = makeSpans(n);
			luFactor(ref, n, perm, refSpans);
			luSolve(ref, n, perm, b, x1, refSpans);
			const rec = a.slice();
			const spans = makeSpans(n);
			const plan = luFactorRecorded(rec, n, perm, spans);
			expect(plan, `system ${t}`).not.toBeNull();
			// a matrix holding garbage outside the plan's positions, reset at those positions only
			const again = new Float64Array(n * n).fill(Number.NaN);
			for (const q of plan!.pos) again[q] = a[q];
			luFactorByPlan(again, n, plan!);
			const x2 = new Float64Array(n);
			luSolveByPlan(again, n, plan!, b, x2);
			for (let i = 0; i < n; i++) expect(Object.is(x2[i], x1[i]), `system ${t}, x[${i}]`).toBe(true);
			// componentwise relative residual |A·x − b|ᵢ / (|A|·|x| + |b|)ᵢ, small for a backward-stable solve (Higham, Accuracy and Stability of Numerical Algorithms, ch. 7)
			for (let i = 0; i < n; i++) {
				let r = -b[i];
				let scale = Math.abs(b[i]);
				for (let j = 0; j < n; j++) {
					r += a[i * n + j] * x2[j];
					scale += Math.abs(a[i * n + j] * x2[j]);
				}
				expect(Math.abs(r) / scale).toBeLessThan(1e-10);
			}
		}
	});

	it('records no schedule for a factorisation that swaps rows (zero diagonal of a source row)', () => {
		// the OpenStax Example 21.1 matrix above: its source row has a zero diagonal
		const a = Float64Array.from([1, -1, 0, 1, -1, 1 + 1 / 6, -1 / 6, 0, 0, -1 / 6, 1 / 6 + 1 / 13, 0, 1, 0, 0, 0]);
		expect(luFactorRecorded(a, 4, new Int32Array(4), makeSpans(4))).toBeNull();
	});
});

describe('union-find', () => {
	it('joins sets and keeps the smallest index as the root', () => {
		const p = makeSets(6);
		expect(unite(p, 4, 2)).toBe(true);
		expect(unite(p, 2, 5)).toBe(true);
		expect(unite(p, 5, 4)).toBe(false); // already one set
		expect([0, 1, 2, 3, 4, 5].map((i) => findRoot(p, i))).toEqual([0, 1, 2, 3, 2, 2]);
		unite(p, 5, 0);
		expect(findRoot(p, 4)).toBe(0);
	});
});
