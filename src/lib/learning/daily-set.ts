/**
 * The daily set: due reviews first (each a fresh variant of its skill), then new skills from the
 * learner's weakest content area at a difficulty where the predicted success is 80–85 %.
 */
import { makeRng, type Rng } from './rng';
import { abilityOf, mapAbility, pWithGuess, type Estimate } from './rasch';
import { checkDay, daysBetween, learningDay, toMs } from './learning-day';
import { predictedRetention, type StoredCard } from './schedule';

export type Variant = { id: string; medianSeconds?: number | null };
/** A skill as the set sees it: its area, its calibrated difficulty (shared by its variants), its variants. */
/** `guess`: the chance of guessing one of its items right (1 / options for choice items; 0 or absent otherwise). */
export type SkillInfo = { id: string; area: string; difficulty: number; guess?: number; variants: readonly Variant[] };

export type DailySettings = {
	maxItems: number;
	maxMinutes: number;
	/** At most this many new skills a day. */
	maxNew: number;
	/** The predicted-success band new skills are chosen in. */
	band: readonly [number, number];
	/** A new skill predicted below this is held back for another day (too hard yet). */
	newFloor: number;
	/** No new skills within this many days of the exam: the last days consolidate. */
	noNewWithinDays: number;
};

export const DEFAULT_DAILY: DailySettings = { maxItems: 15, maxMinutes: 10, maxNew: 5, band: [0.8, 0.85], newFloor: 0.75, noNewWithinDays: 7 };
/** Seconds assumed for an item with no median time yet. */
export const DEFAULT_SECONDS = 40;

export type DailySetInput = {
	now: Date | string | number;
	timeZone: string;
	skills: readonly SkillInfo[];
	/** The learner's card per skill id; a skill without one has not been started. */
	cards: Readonly<Record<string, StoredCard>>;
	/** The variant (item id) the learner saw last, per skill id. */
	lastVariant: Readonly<Record<string, string>>;
	/** Ability per area id; an area without one counts as 0. */
	abilities: Readonly<Record<string, Estimate | number>>;
	/** The learner's exam day ('YYYY-MM-DD'), or null. */
	examDate?: string | null;
	settings?: Partial<DailySettings>;
	seed: number | string;
	/**
	 * Logit shift added to the Rasch prediction of a new (never answered) skill, from
	 * calibrateSuccessOffset over earlier first answers; 0 (the default) leaves the prediction as it is.
	 */
	successOffset?: number;
};

/** A first answer on a skill with what was known before it: the area ability and the skill difficulty then. */
export type FirstAnswer = { ability: number; difficulty: number; guess?: number; correct: boolean };

/** The prior spread (logits) of the new-skill offset, and the answers below which it stays 0. */
export const OFFSET_PRIOR_SD = 0.5;
export const OFFSET_MIN_ANSWERS = 20;

/**
 * The logit offset δ that makes first answers on new skills match their prediction:
 * P(right) = g + (1 − g)·σ(θ − b + δ), θ and b the estimates before the answer. δ is the maximum a
 * posteriori value with a N(0, priorSd²) prior (the same Newton solver as mapAbility: δ plays the
 * learner's part against items of difficulty b − θ). The Elo ability also moves on review answers,
 * which are helped by earlier study, so it overstates the chance of a first answer; δ corrects that.
 * With fewer than `minAnswers` answers it is 0.
 */
export function calibrateSuccessOffset(answers: readonly FirstAnswer[], options: { priorSd?: number; minAnswers?: number; window?: number } = {}): number {
	const { priorSd = OFFSET_PRIOR_SD, minAnswers = OFFSET_MIN_ANSWERS, window = 300 } = options;
	if (answers.length < minAnswers) return 0;
	return mapAbility(
		answers.slice(-window).map((a) => ({ difficulty: a.difficulty - a.ability, correct: a.correct, guess: a.guess ?? 0 })),
		0,
		priorSd
	);
}

export type DailyItem = {
	itemId: string;
	skillId: string;
	area: string;
	kind: 'review' | 'new';
	/** Predicted probability of a right answer: Rasch from the area ability and the skill difficulty, with the skill's guessing chance. */
	predictedSuccess: number;
	/** FSRS probability of recall now (reviews only). */
	retention: number | null;
	seconds: number;
	reason: string;
};

export type DailySet = { day: string; items: DailyItem[]; minutes: number; skipped: { skillId: string; reason: string }[] };

function pick<T>(rng: Rng, list: readonly T[]): T {
	return list[rng.int(list.length)];
}

function secondsOf(v: Variant): number {
	return v.medianSeconds && v.medianSeconds > 0 ? v.medianSeconds : DEFAULT_SECONDS;
}

/** Distance of p from the band (0 inside it). */
function bandDistance(p: number, band: readonly [number, number]): number {
	return p < band[0] ? band[0] - p : p > band[1] ? p - band[1] : 0;
}

/**
 * Composes one learning day's set, in order, each item with the reason it is there. Deterministic for
 * a given seed. Stops at `maxItems` or when the next item would pass `maxMinutes` (the first item always
 * fits); when due reviews fill it, no new skill is added. A due skill with no variant other than the
 * last one seen is skipped and listed in `skipped`.
 */
export function composeDailySet(input: DailySetInput): DailySet {
	const s: DailySettings = { ...DEFAULT_DAILY, ...input.settings };
	const rng = makeRng(input.seed);
	const nowMs = toMs(input.now);
	const day = learningDay(nowMs, input.timeZone);
	const items: DailyItem[] = [];
	const skipped: DailySet['skipped'] = [];
	let seconds = 0;
	const fits = (sec: number) => items.length < s.maxItems && (items.length === 0 || seconds + sec <= s.maxMinutes * 60);

	const due = input.skills
		.filter((k) => input.cards[k.id] && toMs(input.cards[k.id].due) <= nowMs)
		.sort((a, b) => toMs(input.cards[a.id].due) - toMs(input.cards[b.id].due) || (a.id < b.id ? -1 : 1));
	let full = false;
	for (const k of due) {
		const card = input.cards[k.id];
		const fresh = k.variants.filter((v) => v.id !== input.lastVariant[k.id]);
		if (fresh.length === 0) {
			skipped.push({ skillId: k.id, reason: 'due, but it has no variant other than the one seen last' });
			continue;
		}
		const v = pick(rng, fresh);
		if (!fits(secondsOf(v))) {
			full = true;
			break;
		}
		const lastMs = card.last_review ? toMs(card.last_review) : nowMs;
		const overdue = daysBetween(learningDay(toMs(card.due), input.timeZone), day);
		const ability = abilityOf(input.abilities, k.area);
		items.push({
			itemId: v.id,
			skillId: k.id,
			area: k.area,
			kind: 'review',
			predictedSuccess: pWithGuess(ability, k.difficulty, k.guess ?? 0),
			retention: predictedRetention(card, (nowMs - lastMs) / 86_400_000),
			seconds: secondsOf(v),
			reason: overdue > 0 ? `review due ${overdue} day${overdue === 1 ? '' : 's'} ago` : 'review due today'
		});
		seconds += secondsOf(v);
	}

	const unstarted = input.skills.filter((k) => !input.cards[k.id]);
	const chosen = new Set<string>();
	const offset = input.successOffset ?? 0;
	if (!Number.isFinite(offset)) throw new RangeError(`The success offset must be a finite number of logits (got ${offset}).`);
	const predict = (k: SkillInfo) => pWithGuess(abilityOf(input.abilities, k.area) + offset, k.difficulty, k.guess ?? 0);
	const exam = input.examDate ? checkDay(input.examDate) : null;
	const closeToExam = exam != null && daysBetween(day, exam) >= 0 && daysBetween(day, exam) <= s.noNewWithinDays;
	let added = 0;
	// A set with no review due and no skill at or above the floor would be empty, and the learner would
	// be told to come back tomorrow with nothing learned: then the floor is dropped for this set and the
	// one skill nearest to the band is started (the reason says so).
	const relaxed =
		items.length === 0 && !unstarted.some((k) => k.variants.length > 0 && predict(k) >= s.newFloor);
	const maxNew = relaxed ? Math.min(1, s.maxNew) : s.maxNew;
	// New skills only once every due review is in: reviews come first.
	while (!full && !closeToExam && added < maxNew && items.length < s.maxItems) {
		const open = unstarted.filter((k) => !chosen.has(k.id) && k.variants.length > 0 && (relaxed || predict(k) >= s.newFloor));
		if (open.length === 0) break;
		const areas = [...new Set(open.map((k) => k.area))].sort((a, b) => abilityOf(input.abilities, a) - abilityOf(input.abilities, b) || (a < b ? -1 : 1));
		const area = areas[0];
		const centre = (s.band[0] + s.band[1]) / 2;
		const inArea = open
			.filter((k) => k.area === area)
			.map((k) => ({ k, p: predict(k) }))
			.sort((a, b) => bandDistance(a.p, s.band) - bandDistance(b.p, s.band) || Math.abs(a.p - centre) - Math.abs(b.p - centre) || (a.k.id < b.k.id ? -1 : 1));
		const { k, p } = inArea[0];
		const v = pick(rng, k.variants);
		if (!fits(secondsOf(v))) break;
		const pct = (x: number) => `${Math.round(x * 100)} %`;
		const where =
			bandDistance(p, s.band) === 0
				? `inside the ${pct(s.band[0])}–${pct(s.band[1])} band`
				: relaxed && p < s.newFloor
					? `below the usual ${pct(s.newFloor)} floor, the nearest to the ${pct(s.band[0])}–${pct(s.band[1])} band, since nothing easier is left to start`
					: `the nearest to the ${pct(s.band[0])}–${pct(s.band[1])} band available`;
		items.push({
			itemId: v.id,
			skillId: k.id,
			area,
			kind: 'new',
			predictedSuccess: p,
			retention: null,
			seconds: secondsOf(v),
			reason: `new skill from your weakest area (${area}); predicted success ${pct(p)}, ${where}`
		});
		seconds += secondsOf(v);
		chosen.add(k.id);
		added++;
	}
	return { day, items, minutes: seconds / 60, skipped };
}
