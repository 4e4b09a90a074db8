/**
 * Ability and difficulty on one logit scale (the Rasch model, Rasch 1960), updated answer by answer with
 * the Elo rule for adaptive learning systems (Pelánek 2016). Formulas in docs/learning.md.
 */

/** Rasch probability that a learner of ability `theta` answers an item of difficulty `b` right. */
export function pSuccess(theta: number, b: number): number {
	return 1 / (1 + Math.exp(-(theta - b)));
}

/** The difficulty at which a learner of ability `theta` succeeds with probability `p` (0 < p < 1). */
export function difficultyFor(theta: number, p: number): number {
	return theta - Math.log(p / (1 - p));
}

/** An estimate with the number of answers behind it; plain data the server stores. */
export type Estimate = { value: number; count: number };

/** The uncertainty function K(n) = ALPHA / (1 + BETA·n) (Pelánek 2016, values from Papoušek et al. 2014). */
export const ELO_ALPHA = 1;
export const ELO_BETA = 0.05;

/** The Elo step size after `count` answers. */
export function eloStep(count: number): number {
	return ELO_ALPHA / (1 + ELO_BETA * count);
}

/**
 * One answer: the learner's area ability moves by K(n_a)·(correct − p), the skill's difficulty by
 * −K(n_s)·(correct − p), where p is the predicted success before the answer: pSuccess(ability,
 * difficulty), or with a guessing chance g, g + (1 − g)·pSuccess (Pelánek 2016, multiple-choice items).
 */
export function updateAbility(ability: Estimate, difficulty: number, correct: boolean, guess = 0): Estimate {
	const p = pWithGuess(ability.value, difficulty, guess);
	return { value: ability.value + eloStep(ability.count) * ((correct ? 1 : 0) - p), count: ability.count + 1 };
}

/** The skill's side of the same answer (shared by all variants of the skill). */
export function updateDifficulty(difficulty: Estimate, ability: number, correct: boolean, guess = 0): Estimate {
	const p = pWithGuess(ability, difficulty.value, guess);
	return { value: difficulty.value - eloStep(difficulty.count) * ((correct ? 1 : 0) - p), count: difficulty.count + 1 };
}

/** A starting difficulty from the generator's prior. */
export function priorDifficulty(prior: number): Estimate {
	return { value: prior, count: 0 };
}

/**
 * Probability of a right answer when a guess succeeds with chance `guess` (1 / options for a choice
 * item, 0 otherwise): guess + (1 − guess)·pSuccess (the three-parameter logistic model with unit
 * discrimination, Birnbaum 1968).
 */
export function pWithGuess(theta: number, b: number, guess = 0): number {
	return guess + (1 - guess) * pSuccess(theta, b);
}

/** Fisher information of one item at `theta` (unit discrimination; with guessing, Birnbaum 1968). */
export function itemInformation(theta: number, b: number, guess = 0): number {
	const p = pWithGuess(theta, b, guess);
	const q = pSuccess(theta, b);
	return guess === 0 ? q * (1 - q) : ((1 - p) / p) * ((p - guess) / (1 - guess)) ** 2;
}

/**
 * Maximum a posteriori ability with a normal prior N(mean, sd²), by Newton's method (Fisher scoring).
 * `responses` pair an item difficulty (and an optional guessing chance) with the outcome.
 */
export function mapAbility(responses: readonly { difficulty: number; correct: boolean; guess?: number }[], mean = 0, sd = 1.5): number {
	let theta = mean;
	for (let it = 0; it < 100; it++) {
		let grad = -(theta - mean) / (sd * sd);
		let info = 1 / (sd * sd);
		for (const r of responses) {
			const c = r.guess ?? 0;
			const q = pSuccess(theta, r.difficulty);
			const p = c + (1 - c) * q;
			// d log L / d theta for the 3PL with unit discrimination: (x − p)·(p − c) / (p·(1 − c)).
			grad += ((r.correct ? 1 : 0) - p) * (c === 0 ? 1 : (p - c) / (p * (1 - c)));
			info += itemInformation(theta, r.difficulty, c);
		}
		const step = Math.max(-1, Math.min(1, grad / info));
		theta += step;
		if (Math.abs(step) < 1e-9) break;
	}
	return theta;
}

/** The ability for an area from a stored map; an area with none counts as 0 (the population mean). */
export function abilityOf(abilities: Readonly<Record<string, Estimate | number>>, area: string): number {
	const a = abilities[area];
	return a == null ? 0 : typeof a === 'number' ? a : a.value;
}
