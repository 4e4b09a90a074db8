/**
 * Which target a tap meant: the wire or part nearest to the tapped point, measured to the drawn geometry
 * (a wire's polyline, a part's body box), not to the enlarged invisible hit areas. On a phone the hit
 * areas of neighbouring wires overlap; without this the one painted last would take every tap between
 * them. Pure geometry in drawing units.
 */
import type { Box, Point } from './layout';

export type HitCandidates = { wires: readonly { id: string; points: readonly Point[] }[]; parts: readonly (Box & { id: string })[] };

/** Distance from p to the segment a–b. */
function toSegment(p: Point, a: Point, b: Point): number {
	const dx = b[0] - a[0];
	const dy = b[1] - a[1];
	const len2 = dx * dx + dy * dy;
	const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2));
	return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

/** Distance from p to a polyline (Infinity for an empty one). */
export function distanceToPolyline(p: Point, points: readonly Point[]): number {
	if (points.length === 1) return Math.hypot(p[0] - points[0][0], p[1] - points[0][1]);
	let best = Infinity;
	for (let i = 1; i < points.length; i++) best = Math.min(best, toSegment(p, points[i - 1], points[i]));
	return best;
}

/** Distance from p to a box (0 inside it). */
export function distanceToBox(p: Point, b: Box): number {
	const dx = Math.max(b.x - p[0], 0, p[0] - (b.x + b.w));
	const dy = Math.max(b.y - p[1], 0, p[1] - (b.y + b.h));
	return Math.hypot(dx, dy);
}

/**
 * The id of the wire or part nearest to `p`, if it is within `reach` (drawing units); null otherwise.
 * A part wins a tie with a wire (a tap on a part's body means the part); among equals the first listed wins.
 */
export function nearestTarget(p: Point, c: HitCandidates, reach: number): string | null {
	let best: string | null = null;
	let bestD = Infinity;
	for (const part of c.parts) {
		const d = distanceToBox(p, part);
		if (d < bestD) {
			bestD = d;
			best = part.id;
		}
	}
	for (const w of c.wires) {
		const d = distanceToPolyline(p, w.points);
		if (d < bestD) {
			bestD = d;
			best = w.id;
		}
	}
	return bestD <= reach ? best : null;
}
