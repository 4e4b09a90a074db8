/**
 * A seeded pseudo-random generator (mulberry32, a public-domain 32-bit generator): the same seed gives
 * the same sequence on every machine, so every choice the learning logic makes is reproducible.
 */

export type Rng = { next(): number; int(n: number): number };

/** FNV-1a hash of a text to a 32-bit seed. */
export function seedFrom(text: string): number {
	let h = 0x811c9dc5;
	for (let i = 0; i < text.length; i++) {
		h ^= text.charCodeAt(i);
		h = Math.imul(h, 0x01000193) >>> 0;
	}
	return h >>> 0;
}

/** A generator seeded from a number or a text. */
export function makeRng(seed: number | string): Rng {
	let a = (typeof seed === 'string' ? seedFrom(seed) : seed) >>> 0;
	const next = () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	return { next, int: (n) => Math.floor(next() * n) };
}
