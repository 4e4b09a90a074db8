/**
 * Union-find over integer ids in an Int32Array, used to merge nodes joined by 0 Ω elements.
 */

/** Root of `x` with path halving. */
export function findRoot(parent: Int32Array, x: number): number {
	while (parent[x] !== x) {
		parent[x] = parent[parent[x]];
		x = parent[x];
	}
	return x;
}

/** Joins the sets of `a` and `b` (the smaller root index becomes the root); returns false when already joined. */
export function unite(parent: Int32Array, a: number, b: number): boolean {
	const ra = findRoot(parent, a);
	const rb = findRoot(parent, b);
	if (ra === rb) return false;
	if (ra < rb) parent[rb] = ra;
	else parent[ra] = rb;
	return true;
}

/** A fresh union-find of `n` singletons. */
export function makeSets(n: number): Int32Array {
	const p = new Int32Array(n);
	for (let i = 0; i < n; i++) p[i] = i;
	return p;
}
