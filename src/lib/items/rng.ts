/**
 * A seeded pseudo-random generator (mulberry32) for generator variants: the same seed gives the
 * same sequence on every machine.
 */
import { hashText } from './hash';

export type Rng = {
	/** A float in [0, 1). */
	next(): number;
	/** A whole number in [0, n). */
	int(n: number): number;
	/** One element of a non-empty list. */
	pick<T>(list: readonly T[]): T;
	/** A copy of the list in a seeded order. */
	shuffle<T>(list: readonly T[]): T[];
};

/** A generator seeded from any text (e.g. `family:variant:seed`). */
export function makeRng(seedText: string): Rng {
	let a = parseInt(hashText(seedText).slice(0, 8), 16) >>> 0;
	const next = () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
	const int = (n: number) => Math.floor(next() * n);
	return {
		next,
		int,
		pick: (list) => list[int(list.length)],
		shuffle: (list) => {
			const out = list.slice();
			for (let i = out.length - 1; i > 0; i--) {
				const j = int(i + 1);
				[out[i], out[j]] = [out[j], out[i]];
			}
			return out;
		}
	};
}
