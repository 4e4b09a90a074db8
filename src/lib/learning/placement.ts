/**
 * Placement: a short first session chosen for measurement. Each next item is the one with the most
 * Fisher information at the current ability estimate (predicted success nearest 50 % for an item that
 * cannot be guessed; a little higher for a choice item), taken from the
 * content area with the fewest placement answers so far so that every area gets a start.
 */
import { makeRng } from './rng';
import { itemInformation, mapAbility, pWithGuess, type Estimate } from './rasch';

/** `guess`: the chance of guessing right (1 / options on a choice item); 0 or absent otherwise. */
export type PlacementCandidate = { id: string; skillId: string; area: string; difficulty: number; guess?: number };
export type PlacementResponse = PlacementCandidate & { correct: boolean };

/** About this many items make a placement set. */
export const PLACEMENT_LENGTH = 12;
/** Prior of the overall ability (logits) and the spread of an area around it. */
export const PRIOR_SD = 1.5;
export const AREA_SD = 0.7;

export type PlacementChoice = { item: PlacementCandidate; predictedSuccess: number; reason: string };

/**
 * The next placement item, or null when the set is complete (`length` answers) or no candidate is left.
 * One item per skill. Deterministic for a given seed (ties are broken by it).
 */
export function nextPlacementItem(input: {
	candidates: readonly PlacementCandidate[];
	responses: readonly PlacementResponse[];
	length?: number;
	seed: number | string;
	/** Areas to balance across; by default those of the candidates. */
	balanceAreas?: boolean;
}): PlacementChoice | null {
	if (input.responses.length >= (input.length ?? PLACEMENT_LENGTH)) return null;
	const usedSkills = new Set(input.responses.map((r) => r.skillId));
	const usedItems = new Set(input.responses.map((r) => r.id));
	let open = input.candidates.filter((c) => !usedItems.has(c.id) && !usedSkills.has(c.skillId));
	if (open.length === 0) return null;
	const theta = mapAbility(input.responses, 0, PRIOR_SD);
	if (input.balanceAreas !== false) {
		const count = new Map<string, number>();
		for (const r of input.responses) count.set(r.area, (count.get(r.area) ?? 0) + 1);
		const fewest = Math.min(...open.map((c) => count.get(c.area) ?? 0));
		open = open.filter((c) => (count.get(c.area) ?? 0) === fewest);
	}
	const rng = makeRng(`${input.seed}:${input.responses.length}`);
	const scored = open.map((c) => ({ c, info: itemInformation(theta, c.difficulty, c.guess ?? 0), tie: rng.next() }));
	scored.sort((a, b) => b.info - a.info || a.tie - b.tie);
	const best = scored[0].c;
	const p = pWithGuess(theta, best.difficulty, best.guess ?? 0);
	return { item: best, predictedSuccess: p, reason: `placement: predicted success ${Math.round(p * 100)} % at the current estimate ${theta.toFixed(2)}, the most informative item left in ${best.area}` };
}

/**
 * Starting abilities per area from placement answers: the overall ability is the MAP estimate under the
 * Rasch model with a N(0, PRIOR_SD²) prior; each area's is the MAP estimate from that area's answers with
 * a N(overall, AREA_SD²) prior, so an area with one or two answers stays near the overall estimate.
 */
export function placementAbilities(responses: readonly PlacementResponse[], areas: readonly string[]): { overall: number; areas: Record<string, Estimate> } {
	const overall = mapAbility(responses, 0, PRIOR_SD);
	const out: Record<string, Estimate> = {};
	for (const area of areas) {
		const mine = responses.filter((r) => r.area === area);
		out[area] = { value: mapAbility(mine, overall, AREA_SD), count: mine.length };
	}
	return { overall, areas: out };
}
