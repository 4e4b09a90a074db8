/**
 * LU factorisation with partial pivoting, in place on a row-major Float64Array. It tracks each
 * row's nonzero span (first to last column), so the sparse, nearly banded matrices of wiring
 * networks cost far less than a dense elimination; the arithmetic is that of ordinary LU.
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

/** Row spans of a factorisation: L of row i lies in columns first[i]..i-1, U in i..last[i]. */
export type Spans = { first: Int32Array; last: Int32Array };

/** Allocates spans for matrices up to n×n. */
export function makeSpans(n: number): Spans {
	return { first: new Int32Array(n), last: new Int32Array(n) };
}

/**
 * Factors the n×n matrix `a` (row-major, first n*n entries used) into L·U in place with partial
 * pivoting (perm[i] = original row now at i). A pivot whose magnitude is at most `PIVOT_REL_TOL`
 * times the largest magnitude in the matrix counts as zero. With `known`, `spans` already hold each
 * row's first and last nonzero column (as the matrix was built); otherwise they are found by a scan.
 * @throws SingularMatrixError when a column has no usable pivot.
 */
export function luFactor(a: Float64Array, n: number, perm: Int32Array, spans: Spans = makeSpans(n), known = false): void {
	const { first, last } = spans;
	let scale = 0;
	for (let i = 0; i < n; i++) {
		const r = i * n;
		if (!known) {
			let f = n;
			let l = -1;
			for (let j = 0; j < n; j++)
				if (a[r + j] !== 0) {
					if (f === n) f = j;
					l = j;
				}
			first[i] = f;
			last[i] = l;
		}
		for (let j = first[i], e = last[i]; j <= e; j++) {
			const v = a[r + j];
			const m = v < 0 ? -v : v;
			if (m > scale) scale = m;
		}
		perm[i] = i;
	}
	const tol = scale * PIVOT_REL_TOL;
	// rows that have entries left of the diagonal, bucketed by their first column: while no row swap
	// happens, the rows below k with a nonzero in column k are exactly those bucketed at columns <= k
	ensureBook(n);
	const head = bookHead;
	const next = bookNext;
	const act = bookAct;
	head.fill(-1, 0, n);
	for (let i = n - 1; i >= 0; i--) {
		const c = first[i];
		if (c < i) {
			next[i] = head[c];
			head[c] = i;
		}
	}
	let na = 0;
	let swapped = false;
	for (let k = 0; k < n; k++) {
		if (!swapped) {
			let m = 0;
			for (let q = 0; q < na; q++) if (act[q] > k) act[m++] = act[q];
			na = m;
			for (let r = head[k]; r >= 0; r = next[r]) act[na++] = r;
		}
		let p = -1;
		let best = tol;
		if (swapped) {
			for (let i = k; i < n; i++) {
				if (first[i] > k) continue;
				const v = a[i * n + k];
				const m = v < 0 ? -v : v;
				if (m > best) {
					best = m;
					p = i;
				}
			}
		} else {
			const v = a[k * n + k];
			const mk = v < 0 ? -v : v;
			if (first[k] <= k && mk > best) {
				best = mk;
				p = k;
			}
			for (let q = 0; q < na; q++) {
				const i = act[q];
				const x = a[i * n + k];
				const m = x < 0 ? -x : x;
				if (m > best) {
					best = m;
					p = i;
				}
			}
		}
		if (p < 0) throw new SingularMatrixError(k);
		if (p !== k) {
			swapped = true;
			const rk = k * n;
			const rp = p * n;
			const lo = Math.min(first[k], first[p]);
			const hi = Math.max(last[k], last[p]);
			for (let j = lo; j <= hi; j++) {
				const t = a[rk + j];
				a[rk + j] = a[rp + j];
				a[rp + j] = t;
			}
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
		const lk = last[k];
		if (swapped) {
			for (let i = k + 1; i < n; i++) {
				if (first[i] > k) continue;
				eliminate(a, n, i, k, rk, piv, lk, last);
			}
		} else for (let q = 0; q < na; q++) eliminate(a, n, act[q], k, rk, piv, lk, last);
	}
}

function eliminate(a: Float64Array, n: number, i: number, k: number, rk: number, piv: number, lk: number, last: Int32Array): void {
	const ri = i * n;
	const m = a[ri + k];
	if (m === 0) return;
	const f = m / piv;
	a[ri + k] = f;
	for (let j = k + 1; j <= lk; j++) a[ri + j] -= f * a[rk + j];
	if (lk > last[i]) last[i] = lk;
}

let bookHead = new Int32Array(0);
let bookNext = new Int32Array(0);
let bookAct = new Int32Array(0);
function ensureBook(n: number): void {
	if (bookHead.length >= n) return;
	bookHead = new Int32Array(n);
	bookNext = new Int32Array(n);
	bookAct = new Int32Array(n);
}

/** Solves L·U·x = P·b for a matrix factored by `luFactor` with the same spans; writes x (may not alias b). */
export function luSolve(a: Float64Array, n: number, perm: Int32Array, b: Float64Array, x: Float64Array, spans?: Spans): void {
	for (let i = 0; i < n; i++) {
		let s = b[perm[i]];
		const ri = i * n;
		const f = spans ? spans.first[i] : 0;
		for (let j = f; j < i; j++) s -= a[ri + j] * x[j];
		x[i] = s;
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = x[i];
		const ri = i * n;
		const l = spans ? spans.last[i] : n - 1;
		for (let j = i + 1; j <= l; j++) s -= a[ri + j] * x[j];
		x[i] = s / a[ri + i];
	}
}
