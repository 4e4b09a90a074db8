// Tap targets: the nearest drawn geometry wins, whatever the paint order of the hit areas.
// Distances are plain Euclidean geometry (point to segment, point to box), checked on hand-worked cases.
import { describe, expect, it } from 'vitest';
import { distanceToBox, distanceToPolyline, nearestTarget } from './hit';

describe('distances', () => {
	it('measures a point to a polyline and to a box', () => {
		// (5, 3) to the segment (0,0)–(10,0): 3 straight down; past the end (13, 4) to (10, 0): a 3-4-5 triangle.
		expect(distanceToPolyline([5, 3], [[0, 0], [10, 0]])).toBe(3);
		expect(distanceToPolyline([13, 4], [[0, 0], [10, 0]])).toBe(5);
		expect(distanceToPolyline([12, 5], [[0, 0], [10, 0], [10, 10]])).toBe(2);
		expect(distanceToBox([5, 5], { x: 0, y: 0, w: 10, h: 10 })).toBe(0);
		expect(distanceToBox([13, 14], { x: 0, y: 0, w: 10, h: 10 })).toBe(5);
	});
});

describe('nearestTarget', () => {
	// Two parallel wires 12 units apart, as side-by-side runs into a shared ground are drawn.
	const wires = [
		{ id: 'W1', points: [[0, 0], [100, 0]] as [number, number][] },
		{ id: 'W2', points: [[0, 12], [100, 12]] as [number, number][] }
	];
	const parts = [{ id: 'L1', x: 40, y: 30, w: 20, h: 20 }];

	it('gives a tap between two close wires to the nearer one, in either paint order', () => {
		expect(nearestTarget([50, 4], { wires, parts }, 26)).toBe('W1');
		expect(nearestTarget([50, 8], { wires, parts }, 26)).toBe('W2');
		expect(nearestTarget([50, 8], { wires: [...wires].reverse(), parts }, 26)).toBe('W2');
	});
	it('gives a tap on a part body to the part, and nothing beyond reach', () => {
		expect(nearestTarget([50, 31], { wires, parts }, 26)).toBe('L1');
		expect(nearestTarget([50, 200], { wires, parts }, 26)).toBeNull();
	});
});
