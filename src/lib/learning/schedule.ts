/**
 * Review scheduling per (learner, skill) with ts-fsrs (FSRS, Ye et al. 2022), in whole learning days of
 * the learner's time zone, aimed at the learner's exam day. Rules and constants in docs/learning.md.
 */
import { createEmptyCard, forgetting_curve, fsrs, generatorParameters, Rating, State, type Card, type Grade } from 'ts-fsrs';
import { addDays, checkDay, daysBetween, learningDay, learningDayStart, toMs } from './learning-day';

/** The card the server stores: ts-fsrs's Card fields, dates as ISO 8601 strings. */
export type StoredCard = {
	due: string;
	stability: number;
	difficulty: number;
	elapsed_days: number;
	scheduled_days: number;
	learning_steps: number;
	reps: number;
	lapses: number;
	/** ts-fsrs State: 0 New, 1 Learning, 2 Review, 3 Relearning. */
	state: number;
	last_review: string | null;
};

/** ts-fsrs ratings we give: 1 Again, 2 Hard, 3 Good. We never give 4 Easy (see rateAnswer). */
export type ReviewRating = 1 | 2 | 3 | 4;
export const RATING = { again: Rating.Again, hard: Rating.Hard, good: Rating.Good, easy: Rating.Easy } as const;

/** A right answer slower than this multiple of the item's median time is rated Hard. */
export const SLOW_FACTOR = 1.5;

/**
 * The rating rule: wrong → Again; right but slower than SLOW_FACTOR × the item's median time → Hard;
 * otherwise right → Good. Easy is never given: one right answer to a generated item does not show that a
 * skill is over-learned, and a fast guess on a choice item would look the same. With no median time
 * (or no time) a right answer is Good.
 */
export function rateAnswer(answer: { correct: boolean; seconds?: number | null; medianSeconds?: number | null }): ReviewRating {
	if (!answer.correct) return RATING.again;
	const { seconds, medianSeconds } = answer;
	if (seconds != null && medianSeconds != null && medianSeconds > 0 && seconds > SLOW_FACTOR * medianSeconds) return RATING.hard;
	return RATING.good;
}

/** Desired retention far from the exam, at the exam, and the number of days over which it rises. */
export const BASE_RETENTION = 0.92;
export const PEAK_RETENTION = 0.95;
export const RAMP_DAYS = 21;
/** A skill whose predicted retention on exam day falls below this gets a last review before the exam. */
export const EXAM_TARGET = 0.98;
/** How many days before the exam that last review falls. */
export const FINAL_LEAD_DAYS = 1;
export const MAXIMUM_INTERVAL = 365;
/**
 * The learning step: after the first answer on a skill and after a lapse (Again) the next review comes
 * this many learning days later, when FSRS's interval is longer (0 turns the step off).
 */
export const LEARNING_STEP_DAYS = 1;

export type ScheduleOptions = {
	/** The learner's IANA time zone; days start at 04:00 local. */
	timeZone: string;
	/** The learner's exam day ('YYYY-MM-DD'), or null when none is set. */
	examDate?: string | null;
	/** Desired retention far from the exam and on it (defaults BASE_RETENTION, PEAK_RETENTION). */
	baseRetention?: number;
	peakRetention?: number;
	/** The learner's memory speed against FSRS's defaults, from calibrateMemoryFactor (default 1). */
	memoryFactor?: number;
	/** Exam-day retention below which a last review is placed before the exam (default EXAM_TARGET). */
	examTarget?: number;
	/** Days to the review after a first answer or a lapse, at most (default LEARNING_STEP_DAYS; 0: off). */
	learningStepDays?: number;
};

/** The desired retention for a review `daysToExam` days before the exam (null: no exam set). */
export function desiredRetention(daysToExam: number | null, base = BASE_RETENTION, peak = PEAK_RETENTION): number {
	if (!(base > 0 && base < 1 && peak > 0 && peak < 1)) throw new RangeError(`Desired retention must lie between 0 and 1 (got ${base} and ${peak}).`);
	if (daysToExam == null || daysToExam <= 0 || daysToExam >= RAMP_DAYS) return base;
	return base + (Math.max(base, peak) - base) * (1 - daysToExam / RAMP_DAYS);
}

const schedulers = new Map<number, ReturnType<typeof fsrs>>();
function schedulerFor(retention: number) {
	const key = Math.round(retention * 1000) / 1000;
	let s = schedulers.get(key);
	if (!s) {
		// Whole days only (no same-day learning steps), no fuzz: one session a day, deterministic dates.
		s = fsrs(generatorParameters({ request_retention: key, maximum_interval: MAXIMUM_INTERVAL, enable_fuzz: false, enable_short_term: false }));
		schedulers.set(key, s);
	}
	return s;
}
const W = generatorParameters().w;

/** Days until FSRS's forgetting curve falls to `retention` for a card of `stability` days. */
export function intervalFor(stability: number, retention: number): number {
	// Invert R = (1 + FACTOR·t/S)^DECAY (FSRS-6; computeDecayFactor gives DECAY < 0 and FACTOR).
	let lo = 0;
	let hi = MAXIMUM_INTERVAL * 2;
	for (let i = 0; i < 60; i++) {
		const mid = (lo + hi) / 2;
		if (forgetting_curve(W, mid, stability) > retention) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

/** Limits on the memory factor: a learner is taken as at most 5 × faster or 2 × slower to forget. */
export const MEMORY_FACTOR_MIN = 0.2;
export const MEMORY_FACTOR_MAX = 2;

export type ReviewRecord = {
	/** Days since the previous answer on the skill. */
	elapsedDays: number;
	/** The card's FSRS stability before this answer. */
	stability: number;
	correct: boolean;
	/** The chance of guessing the item right (1 / options on a choice item; 0 otherwise). */
	guess?: number;
	/** The predicted chance of knowing the skill when it is remembered (e.g. Rasch success); fixes k for this review. */
	ceiling?: number;
};

const FACTOR_GRID = Array.from({ length: 16 }, (_, i) => MEMORY_FACTOR_MIN * Math.pow(MEMORY_FACTOR_MAX / MEMORY_FACTOR_MIN, i / 15));
const CEILING_GRID = Array.from({ length: 11 }, (_, i) => 0.5 + i * 0.05);

/**
 * The learner's memory factor m: the multiple of FSRS's stabilities that best explains their review
 * answers. A review is right with probability g + (1 − g)·k·R(t, m·S): a guess, or knowing the skill and
 * remembering it (FSRS's curve with the scaled stability). k is the review's `ceiling` when given, else 1,
 * or with `fitCeiling` a free value from 0.5 to 1 (m and k then trade off, so m is less certain). m is
 * the maximum-likelihood value on a log grid from 0.2 to 2 over the last `window` reviews; with fewer
 * than `minReviews` it is 1 (FSRS's defaults).
 */
export function calibrateMemoryFactor(reviews: readonly ReviewRecord[], options: { minReviews?: number; window?: number; fitCeiling?: boolean } = {}): number {
	const { minReviews = 30, window = 300, fitCeiling = false } = options;
	const usable = reviews.filter((r) => r.stability > 0 && r.elapsedDays >= 0).slice(-window);
	if (usable.length < minReviews) return 1;
	let best = { m: 1, ll: -Infinity };
	for (const m of FACTOR_GRID) {
		const recall = usable.map((r) => forgetting_curve(W, r.elapsedDays, r.stability * m));
		for (const k of fitCeiling ? CEILING_GRID : [1]) {
			let ll = 0;
			for (let i = 0; i < usable.length; i++) {
				const g = usable[i].guess ?? 0;
				const ki = usable[i].ceiling ?? k;
				const p = Math.min(1 - 1e-9, Math.max(1e-9, g + (1 - g) * ki * recall[i]));
				ll += usable[i].correct ? Math.log(p) : Math.log(1 - p);
			}
			if (ll > best.ll) best = { m, ll };
		}
	}
	return best.m;
}

/** A ts-fsrs Card as plain data (ISO dates). */
export function toStoredCard(card: Card): StoredCard {
	return {
		due: card.due.toISOString(),
		stability: card.stability,
		difficulty: card.difficulty,
		elapsed_days: card.elapsed_days,
		scheduled_days: card.scheduled_days,
		learning_steps: card.learning_steps,
		reps: card.reps,
		lapses: card.lapses,
		state: card.state,
		last_review: card.last_review ? card.last_review.toISOString() : null
	};
}

/** The ts-fsrs Card of a stored card. */
export function fromStoredCard(card: StoredCard): Card {
	return {
		...card,
		due: new Date(toMs(card.due)),
		state: card.state as State,
		last_review: card.last_review ? new Date(toMs(card.last_review)) : undefined
	};
}

/** A card for a skill the learner has not yet reviewed. */
export function newCard(now: Date | string | number): StoredCard {
	return toStoredCard(createEmptyCard(new Date(toMs(now))));
}

/** The probability of recall `days` after the last review under FSRS's forgetting curve. */
export function predictedRetention(card: StoredCard, days: number): number {
	if (card.state === State.New || card.stability <= 0) return 0;
	return forgetting_curve(W, Math.max(0, days), card.stability);
}

export type ScheduledReview = { card: StoredCard; retention: number; dueDay: string; reason: string };

/**
 * Schedules the next review of a skill after an answer rated `rating` at `now`. The interval is FSRS's
 * at a desired retention that rises as the exam nears, at most LEARNING_STEP_DAYS after a first answer
 * or a lapse; the due date is the start (04:00 local) of the learning day that many days on. If that day is on or after the exam and FSRS predicts the skill would
 * then be below EXAM_TARGET, the review moves to FINAL_LEAD_DAYS before the exam.
 * Throws a RangeError naming a bad time zone, instant or exam date.
 */
export function scheduleReview(card: StoredCard | null, rating: ReviewRating, now: Date | string | number, options: ScheduleOptions): ScheduledReview {
	const nowMs = toMs(now);
	if (![1, 2, 3, 4].includes(rating)) throw new RangeError(`Not a rating: ${rating}. Use 1 (Again), 2 (Hard), 3 (Good) or 4 (Easy).`);
	const today = learningDay(nowMs, options.timeZone);
	const exam = options.examDate ? checkDay(options.examDate) : null;
	const daysToExam = exam ? daysBetween(today, exam) : null;
	const retention = desiredRetention(daysToExam, options.baseRetention, options.peakRetention);
	const next = schedulerFor(retention).next(card ? fromStoredCard(card) : createEmptyCard(new Date(nowMs)), new Date(nowMs), rating as Grade).card;
	const m = options.memoryFactor ?? 1;
	if (!(m > 0)) throw new RangeError(`The memory factor must be a positive number (got ${m}).`);
	// The card keeps FSRS's own stability; the learner's factor scales it only to place the due date.
	const effective = next.stability * m;
	let days = Math.max(1, Math.min(MAXIMUM_INTERVAL, Math.round(m === 1 ? next.scheduled_days : intervalFor(effective, retention))));
	let reason = `FSRS interval of ${days} day${days === 1 ? '' : 's'} at desired retention ${retention.toFixed(3)}${m === 1 ? '' : ` and memory factor ${m.toFixed(2)}`}`;
	const step = options.learningStepDays ?? LEARNING_STEP_DAYS;
	if (!(step >= 0) || !Number.isInteger(step)) throw new RangeError(`The learning step must be a whole number of days, 0 or more (got ${step}).`);
	const first = !card || card.state === State.New;
	if (step > 0 && (first || rating === RATING.again) && days > step) {
		days = step;
		reason = `learning step: ${first ? 'first answer on this skill' : 'forgotten'}, review again in ${step} day${step === 1 ? '' : 's'}`;
	}
	if (exam && daysToExam != null && daysToExam > 0 && days >= daysToExam) {
		const atExam = forgetting_curve(W, daysToExam, effective);
		if (atExam < (options.examTarget ?? EXAM_TARGET)) {
			days = Math.max(1, daysToExam - FINAL_LEAD_DAYS);
			reason = `last review before the exam on ${exam}: FSRS predicts ${(atExam * 100).toFixed(0)} % retention on exam day without it`;
		} else reason += `; predicted ${(atExam * 100).toFixed(0)} % on exam day, no review needed before it`;
	}
	const dueDay = addDays(today, days);
	next.due = learningDayStart(dueDay, options.timeZone);
	next.scheduled_days = days;
	return { card: toStoredCard(next), retention, dueDay, reason };
}
