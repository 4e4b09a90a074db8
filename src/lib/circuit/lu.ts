/**
 * Dense LU factorisation with partial pivoting, in place on a row-major Float64Array.
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
 * Factors the n×n matrix `a` (row-major, first n*n entries used) into L·U in place, row swaps in
 * `perm` (perm[i] = original row now at i). A pivot whose magnitude is below `PIVOT_REL_TOL` times
 * the largest magnitude in the matrix is treated as zero.
 * @throws SingularMatrixError when a column has no usable pivot.
 */
export function luFactor(a: Float64Array, n: number, perm: Int32Array): void {
	let scale = 0;
	for (let i = 0; i < n * n; i++) {
		const v = Math.abs(a[i]);
		if (v > scale) scale = v;
	}
	const tol = scale * PIVOT_REL_TOL;
	for (let i = 0; i < n; i++) perm[i] = i;
	for (let k = 0; k < n; k++) {
		let p = k;
		let best = Math.abs(a[k * n + k]);
		for (let i = k + 1; i < n; i++) {
			const v = Math.abs(a[i * n + k]);
			if (v > best) {
				best = v;
				p = i;
			}
		}
		if (!(best > tol)) throw new SingularMatrixError(k);
		if (p !== k) {
			const rk = k * n;
			const rp = p * n;
			for (let j = 0; j < n; j++) {
				const t = a[rk + j];
				a[rk + j] = a[rp + j];
				a[rp + j] = t;
			}
			const t = perm[k];
			perm[k] = perm[p];
			perm[p] = t;
		}
		const rk = k * n;
		const piv = a[rk + k];
		for (let i = k + 1; i < n; i++) {
			const ri = i * n;
			const m = a[ri + k];
			if (m === 0) continue;
			const f = m / piv;
			a[ri + k] = f;
			for (let j = k + 1; j < n; j++) a[ri + j] -= f * a[rk + j];
		}
	}
}

/** Solves L·U·x = P·b for a matrix factored by `luFactor`; writes x into `x` (may not alias `b`). */
export function luSolve(a: Float64Array, n: number, perm: Int32Array, b: Float64Array, x: Float64Array): void {
	for (let i = 0; i < n; i++) {
		let s = b[perm[i]];
		const ri = i * n;
		for (let j = 0; j < i; j++) s -= a[ri + j] * x[j];
		x[i] = s;
	}
	for (let i = n - 1; i >= 0; i--) {
		let s = x[i];
		const ri = i * n;
		for (let j = i + 1; j < n; j++) s -= a[ri + j] * x[j];
		x[i] = s / a[ri + i];
	}
}
