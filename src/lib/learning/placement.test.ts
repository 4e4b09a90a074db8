import { describe, expect, it } from 'vitest';
import { nextPlacementItem, placementAbilities, type PlacementCandidate, type PlacementResponse } from './placement';
import { makeRng } from './rng';

const AREAS = ['wiring', 'relays', 'starting', 'charging'];
// 19 skills per area with difficulties spread evenly from −3 to +3 (steps of 1/3 logit).
const POOL: PlacementCandidate[] = AREAS.flatMap((area) =>
	Array.from({ length: 19 }, (_, i) => ({ id: `${area}-${i}-v0`, skillId: `${area}-${i}`, area, difficulty: -3 + i / 3 }))
);
const rasch = (theta: number, b: number) => 1 / (1 + Math.exp(b - theta));

function place(theta: number, seed: number, n: number, choose: 'ours' | 'random'): PlacementResponse[] {
	const rng = makeRng(seed);
	const responses: PlacementResponse[] = [];
	for (let k = 0; k < n; k++) {
		let item: PlacementCandidate;
		if (choose === 'ours') item = nextPlacementItem({ candidates: POOL, responses, length: n, seed })!.item;
		else {
			const open = POOL.filter((c) => !responses.some((r) => r.skillId === c.skillId));
			item = open[rng.int(open.length)];
		}
		responses.push({ ...item, correct: rng.next() < rasch(theta, item.difficulty) });
	}
	return responses;
}

describe('placement', () => {
	it('starts at the middle and picks items near 50 % predicted success (maximum Fisher information of the Rasch model)', () => {
		const first = nextPlacementItem({ candidates: POOL, responses: [], seed: 1 })!;
		expect(first.item.difficulty).toBeCloseTo(0, 12);
		expect(first.predictedSuccess).toBeCloseTo(0.5, 12);
		for (let s = 0; s < 20; s++) {
			const r = place(1, s, 11, 'ours');
			const next = nextPlacementItem({ candidates: POOL, responses: r, seed: s })!;
			// Within an area difficulties step by 1/3 logit and used skills drop out, so not exactly 50 %.
			expect(next.predictedSuccess).toBeGreaterThan(0.35);
			expect(next.predictedSuccess).toBeLessThan(0.65);
		}
	});

	it('covers every area before repeating one, uses each skill once, and stops at 12', () => {
		const r = place(0.5, 3, 12, 'ours');
		expect(new Set(r.slice(0, 4).map((x) => x.area)).size).toBe(4);
		expect(new Set(r.map((x) => x.skillId)).size).toBe(12);
		expect(nextPlacementItem({ candidates: POOL, responses: r, seed: 3 })).toBeNull();
	});

	it('converges on simulated learners: error shrinks with items and beats random choice at 12 items', () => {
		// Simulated learners answer by the Rasch model with known abilities; 300 of them per check.
		const rmse = (n: number, choose: 'ours' | 'random') => {
			let sq = 0;
			for (let i = 0; i < 300; i++) {
				const theta = -2 + (4 * i) / 299;
				sq += (placementAbilities(place(theta, 1000 + i, n, choose), AREAS).overall - theta) ** 2;
			}
			return Math.sqrt(sq / 300);
		};
		const at4 = rmse(4, 'ours');
		const at12 = rmse(12, 'ours');
		expect(at12).toBeLessThan(at4);
		expect(at12).toBeLessThan(0.75);
		expect(at12).toBeLessThan(rmse(12, 'random'));
	});

	it('gives per-area abilities that stay near the overall estimate with few answers', () => {
		const r = place(1, 9, 12, 'ours');
		const { overall, areas } = placementAbilities(r, [...AREAS, 'sensors']);
		expect(areas.sensors).toEqual({ value: overall, count: 0 });
		for (const a of AREAS) {
			expect(areas[a].count).toBe(3);
			expect(Math.abs(areas[a].value - overall)).toBeLessThan(1.5);
		}
	});
});
