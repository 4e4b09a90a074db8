/**
 * LU factorisation with partial pivoting, in place on a row-major Float64Array. It keeps each row's
 * list of nonzero columns, so the sparse, nearly tree-shaped matrices of wiring networks cost little
 * more than their nonzeros; the arithmetic is that of ordinary LU with partial pivoting.
 */
import { PIVOT_REL_TOL } from './tables';

/** Thrown when a matrix is singular to the relative pivot tolerance; `column` is the failing column. */
export class SingularMatrixError extends Error {
	column: number;
	constructor(column: number) {
		super(`matrix is singular at column ${column}`);
		this.name = 'SingularMatrixError';
		this.column = column;
	}
}

/**
 * Scratch of a factorisation for matrices up to `cap`×`cap`: row spans (row i has no nonzero left of
 * first[i] or right of last[i]), each row's nonzero columns (`nz`, `cnt`) and a presence mark
 * (an entry is present in the current factorisation when its mark equals `gen`, so no clearing is needed).
 */
export type Spans = {
	cap: number;
	first: Int32Array;
	last: Int32Array;
	nz: Int32Array;
	cnt: Int32Array;
	mark: Int32Array;
	/** Mark value of the current factorisation. */
	gen: number;
	/** True when the last factorisation swapped rows (its row lists then no longer drive the solve). */
	swapped: boolean;
};

/** Allocates factorisation scratch for matrices up to n×n. */
export function makeSpans(n: number): Spans {
	return {
		cap: n,
		first: new Int32Array(n),
		last: new Int32Array(n),
		nz: new Int32Array(n * n),
		cnt: new Int32Array(n),
		mark: new Int32Array(n * n),
		gen: 0,
		swapped: false
	};
}

/**
 * Factors the n×n matrix `a` (row-major, first n*n entries used) into L·U in place with partial
 * pivoting (perm[i] = original row now at i). A pivot whose magnitude is at most `PIVOT_REL_TOL`
 * times the largest magnitude in the matrix counts as zero. With `known` true, `spans.first`/`last`
 * already bound each row's nonzeros; with `'lists'`, `spans` also holds each row's nonzero columns
 * (`nz`, `cnt`; zeros allowed); otherwise the rows are scanned.
 * While no row has been swapped the pattern stays symmetric (as for nodal matrices), so the rows to
 * eliminate below a pivot are read from the pivot row's list; after a swap every row below is scanned.
 * `symmetricPattern` true promises a symmetric nonzero pattern (skips checking it).
 * @throws SingularMatrixError when a column has no usable pivot.
 */
export function luFactor(
	a: Float64Array,
	n: number,
	perm: Int32Array,
	spans?: Spans,
	known: boolean | 'lists' = false,
	symmetricPattern = false
): void {
	const sp = spans && spans.cap >= n ? spans : makeSpans(n);
	const { first, last, nz, cnt, mark } = sp;
	if (sp.gen >= 0x7ffffffe) {
		mark.fill(0);
		sp.gen = 0;
	}
	const g = ++sp.gen;
	let scale = 0;
	let symmetric = true;
	for (let i = 0; i < n; i++) {
		const r = i * n;
		perm[i] = i;
		if (known === 'lists') {
			for (let q = 0; q < cnt[i]; q++) {
				const j = nz[r + q];
				mark[r + j] = g;
				const v = a[r + j];
				const m = v < 0 ? -v : v;
				if (m > scale) scale = m;
			}
			continue;
		}
		const lo = known ? first[i] : 0;
		const hi = known ? last[i] : n - 1;
		let f = n;
		let l = -1;
		let c = 0;
		for (let j = lo; j <= hi; j++) {
			const v = a[r + j];
			if (v === 0) continue;
			if (f === n) f = j;
			l = j;
			nz[r + c++] = j;
			mark[r + j] = g;
			const m = v < 0 ? -v : v;
			if (m > scale) scale = m;
		}
		if (!known) {
			first[i] = f;
			last[i] = l;
		}
		cnt[i] = c;
	}
	// a pattern that is not symmetric (not a nodal matrix) takes the scanning path throughout; a
	// caller whose matrix is symmetric by construction (equal stamps on both sides) skips the check
	for (let i = 0; i < n && symmetric && !symmetricPattern; i++) {
		const r = i * n;
		for (let q = 0; q < cnt[i]; q++) if (mark[nz[r + q] * n + i] !== g) symmetric = false;
	}
	const tol = scale * PIVOT_REL_TOL;
	const failed = factorColumns(sp, a, n, perm, tol, symmetric);
	if (failed >= 0) throw new SingularMatrixError(failed);
}

/** Eliminates column by column; returns the column without a usable pivot, or -1. */
function factorColumns(sp: Spans, a: Float64Array, n: number, perm: Int32Array, tol: number, sym: boolean): number {
	const first = sp.first;
	const last = sp.last;
	const nz = sp.nz;
	const cnt = sp.cnt;
	let symmetric = sym;
	{
		for (let k = 0; k < n; k++) {
			const rk0 = k * n;
			let p = -1;
			let best = tol;
			if (symmetric) {
				const v = a[rk0 + k];
				const mk = v < 0 ? -v : v;
				if (mk > best) {
					best = mk;
					p = k;
				}
				for (let q = 0; q < cnt[k]; q++) {
					const i = nz[rk0 + q];
					if (i <= k) continue;
					const x = a[i * n + k];
					const m = x < 0 ? -x : x;
					if (m > best) {
						best = m;
						p = i;
					}
				}
			} else {
				for (let i = k; i < n; i++) {
					if (first[i] > k) continue;
					const x = a[i * n + k];
					const m = x < 0 ? -x : x;
					if (m > best) {
						best = m;
						p = i;
					}
				}
			}
			if (p < 0) {
				sp.swapped = true;
				return k;
			}
			if (p !== k) {
				symmetric = false;
				swapRows(sp, a, n, k, p);
				let t = perm[k];
				perm[k] = perm[p];
				perm[p] = t;
				t = first[k];
				first[k] = first[p];
				first[p] = t;
				t = last[k];
				last[k] = last[p];
				last[p] = t;
			}
			const rk = k * n;
			const piv = a[rk + k];
			if (symmetric) {
				for (let q = 0; q < cnt[k]; q++) {
					const i = nz[rk + q];
					if (i > k) eliminate(sp, a, n, i, k, piv);
				}
			} else {
				for (let i = k + 1; i < n; i++) if (first[i] <= k) eliminate(sp, a, n, i, k, piv);
			}
		}
	}
	sp.swapped = !symmetric;
	return -1;
}

function swapRows(sp: Spans, a: Float64Array, n: number, k: number, p: number): void {
	const rk = k * n;
	const rp = p * n;
	for (let j = 0; j < n; j++) {
		const t = a[rk + j];
		a[rk + j] = a[rp + j];
		a[rp + j] = t;
		const m = sp.mark[rk + j];
		sp.mark[rk + j] = sp.mark[rp + j];
		sp.mark[rp + j] = m;
	}
	const cmax = Math.max(sp.cnt[k], sp.cnt[p]);
	for (let q = 0; q < cmax; q++) {
		const t = sp.nz[rk + q];
		sp.nz[rk + q] = sp.nz[rp + q];
		sp.nz[rp + q] = t;
	}
	const t = sp.cnt[k];
	sp.cnt[k] = sp.cnt[p];
	sp.cnt[p] = t;
}

function eliminate(sp: Spans, a: Float64Array, n: number, i: number, k: number, piv: number): void {
	const ri = i * n;
	const m = a[ri + k];
	if (m === 0) return;
	if (recorder) recorder.push(i, k);
	const f = m / piv;
	a[ri + k] = f;
	const rk = k * n;
	const nz = sp.nz;
	const mark = sp.mark;
	const g = sp.gen;
	const ck = sp.cnt[k];
	for (let q = 0; q < ck; q++) {
		const j = nz[rk + q];
		if (j <= k) continue;
		if (mark[ri + j] !== g) {
			mark[ri + j] = g;
			nz[ri + sp.cnt[i]++] = j;
			if (j > sp.last[i]) sp.last[i] = j;
		}
		a[ri + j] -= f * a[rk + j];
	}
}

/**
 * Solves L·U·x = P·b for a matrix factored by `luFactor`; writes x (may not alias b). Pass the same
 * `spans` to use the row lists (when no row was swapped) or spans; without it the solve is dense.
 */
export function luSolve(a: Float64Array, n: number, perm: Int32Array, b: Float64Array, x: Float64Array, spans?: Spans): void {
	const lists = spans !== undefined && !spans.swapped;
	for (let i = 0; i < n; i++) {
		let s = b[perm[i]];
		const ri = i * n;
		if (lists) {
			const c = spans!.cnt[i];
			for (let q = 0; q < c; q++) {
				const j = spans!.nz[ri + q];
				if (j < i) s -= a[ri + j] * x[j];
			}
		} else {
			const f = spans ? spans.first[i] : 0;
			for (let j = f; j < i; j++) s -= a[ri + j] * x[j];
		}
		x[i] = s;
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = x[i];
		const ri = i * n;
		if (lists) {
			const c = spans!.cnt[i];
			for (let q = 0; q < c; q++) {
				const j = spans!.nz[ri + q];
				if (j > i) s -= a[ri + j] * x[j];
			}
		} else {
			const l = spans ? spans.last[i] : n - 1;
			for (let j = i + 1; j <= l; j++) s -= a[ri + j] * x[j];
		}
		x[i] = s / a[ri + i];
	}
}

/**
 * The elimination schedule of one factorisation without row swaps: which rows each pivot
 * eliminated and each row's final nonzero columns in list order. `luFactorByPlan` and
 * `luSolveByPlan` replay it on a matrix with the same values, doing the same floating-point
 * operations in the same order as `luFactor` and `luSolve` (so the results are bit-identical),
 * without searching for pivots or tracking the pattern.
 */
export type LuPlan = {
	n: number;
	/** Rows eliminated by pivot k: `rows[rowAt[k]]` up to `rows[rowAt[k + 1] - 1]`. */
	rowAt: Int32Array;
	rows: Int32Array;
	/** Columns right of the diagonal in row k's list, in list order. */
	upAt: Int32Array;
	up: Int32Array;
	/** Columns left of the diagonal in row i's list, in list order. */
	lowAt: Int32Array;
	low: Int32Array;
	/** Every position (row × n + column) that the replay reads or writes: the final pattern and the diagonal. */
	pos: Int32Array;
};

/** Pairs (row, pivot) eliminated by the factorisation being recorded, or null. */
let recorder: number[] | null = null;

/**
 * `luFactor` (with the same arguments) that also returns its schedule, or null when rows were
 * swapped or the pattern is not symmetric (such a factorisation is not replayed).
 * @throws SingularMatrixError as `luFactor`.
 */
export function luFactorRecorded(
	a: Float64Array,
	n: number,
	perm: Int32Array,
	spans: Spans,
	known: boolean | 'lists' = false,
	symmetricPattern = false
): LuPlan | null {
	const rec: number[] = [];
	recorder = rec;
	try {
		luFactor(a, n, perm, spans, known, symmetricPattern);
	} finally {
		recorder = null;
	}
	if (spans.swapped || spans.cap < n) return null;
	const { nz, cnt } = spans;
	const rowAt = new Int32Array(n + 1);
	for (let q = 0; q < rec.length; q += 2) rowAt[rec[q + 1] + 1]++;
	for (let k = 0; k < n; k++) rowAt[k + 1] += rowAt[k];
	const rows = new Int32Array(rec.length / 2);
	// recorded pivot by pivot (factorisation goes column by column), so rows are already grouped by k
	for (let q = 0; q < rec.length; q += 2) rows[q / 2] = rec[q];
	const upAt = new Int32Array(n + 1);
	const lowAt = new Int32Array(n + 1);
	for (let i = 0; i < n; i++) {
		let u = 0;
		let l = 0;
		for (let q = 0; q < cnt[i]; q++) {
			const j = nz[i * n + q];
			if (j > i) u++;
			else if (j < i) l++;
		}
		upAt[i + 1] = upAt[i] + u;
		lowAt[i + 1] = lowAt[i] + l;
	}
	const up = new Int32Array(upAt[n]);
	const low = new Int32Array(lowAt[n]);
	const pos = new Int32Array(upAt[n] + lowAt[n] + n);
	let pu = 0;
	let pl = 0;
	let pp = 0;
	for (let i = 0; i < n; i++) {
		for (let q = 0; q < cnt[i]; q++) {
			const j = nz[i * n + q];
			if (j > i) up[pu++] = j;
			else if (j < i) low[pl++] = j;
			if (j !== i) pos[pp++] = i * n + j;
		}
		pos[pp++] = i * n + i;
	}
	return { n, rowAt, rows, upAt, up, lowAt, low, pos };
}

/** Factors `a` (the same values as when `plan` was recorded) in place by replaying `plan`. */
export function luFactorByPlan(a: Float64Array, n: number, plan: LuPlan): void {
	const { rowAt, rows, upAt, up } = plan;
	for (let k = 0; k < n; k++) {
		const r0 = rowAt[k];
		const r1 = rowAt[k + 1];
		if (r0 === r1) continue;
		const rk = k * n;
		const piv = a[rk + k];
		const u0 = upAt[k];
		const u1 = upAt[k + 1];
		for (let r = r0; r < r1; r++) {
			const ri = rows[r] * n;
			const f = a[ri + k] / piv;
			a[ri + k] = f;
			for (let q = u0; q < u1; q++) {
				const j = up[q];
				a[ri + j] -= f * a[rk + j];
			}
		}
	}
}

/** Solves L·U·x = b for a matrix factored by `luFactorByPlan` (no rows swapped); writes x (may not alias b). */
export function luSolveByPlan(a: Float64Array, n: number, plan: LuPlan, b: Float64Array, x: Float64Array): void {
	const { lowAt, low, upAt, up } = plan;
	for (let i = 0; i < n; i++) {
		let s = b[i];
		const ri = i * n;
		for (let q = lowAt[i]; q < lowAt[i + 1]; q++) {
			const j = low[q];
			s -= a[ri + j] * x[j];
		}
		x[i] = s;
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = x[i];
		const ri = i * n;
		for (let q = upAt[i]; q < upAt[i + 1]; q++) {
			const j = up[q];
			s -= a[ri + j] * x[j];
		}
		x[i] = s / a[ri + i];
	}
}
