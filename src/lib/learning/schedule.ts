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
export const BASE_RETENTION = 0.85;
export const PEAK_RETENTION = 0.95;
export const RAMP_DAYS = 21;
/** A skill whose predicted retention on exam day falls below this gets a last review before the exam. */
export const EXAM_TARGET = 0.93;
/** How many days before the exam that last review falls. */
export const FINAL_LEAD_DAYS = 1;
export const MAXIMUM_INTERVAL = 365;

export type ScheduleOptions = {
	/** The learner's IANA time zone; days start at 04:00 local. */
	timeZone: string;
	/** The learner's exam day ('YYYY-MM-DD'), or null when none is set. */
	examDate?: string | null;
};

/** The desired retention for a review `daysToExam` days before the exam (null: no exam set). */
export function desiredRetention(daysToExam: number | null): number {
	if (daysToExam == null || daysToExam <= 0 || daysToExam >= RAMP_DAYS) return BASE_RETENTION;
	return BASE_RETENTION + (PEAK_RETENTION - BASE_RETENTION) * (1 - daysToExam / RAMP_DAYS);
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
 * at a desired retention that rises as the exam nears; the due date is the start (04:00 local) of the
 * learning day that many days on. If that day is on or after the exam and FSRS predicts the skill would
 * then be below EXAM_TARGET, the review moves to FINAL_LEAD_DAYS before the exam.
 * Throws a RangeError naming a bad time zone, instant or exam date.
 */
export function scheduleReview(card: StoredCard | null, rating: ReviewRating, now: Date | string | number, options: ScheduleOptions): ScheduledReview {
	const nowMs = toMs(now);
	if (![1, 2, 3, 4].includes(rating)) throw new RangeError(`Not a rating: ${rating}. Use 1 (Again), 2 (Hard), 3 (Good) or 4 (Easy).`);
	const today = learningDay(nowMs, options.timeZone);
	const exam = options.examDate ? checkDay(options.examDate) : null;
	const daysToExam = exam ? daysBetween(today, exam) : null;
	const retention = desiredRetention(daysToExam);
	const next = schedulerFor(retention).next(card ? fromStoredCard(card) : createEmptyCard(new Date(nowMs)), new Date(nowMs), rating as Grade).card;
	let days = Math.max(1, Math.round(next.scheduled_days));
	let reason = `FSRS interval of ${days} day${days === 1 ? '' : 's'} at desired retention ${retention.toFixed(3)}`;
	if (exam && daysToExam != null && daysToExam > 0 && days >= daysToExam) {
		const atExam = forgetting_curve(W, daysToExam, next.stability);
		if (atExam < EXAM_TARGET) {
			days = Math.max(1, daysToExam - FINAL_LEAD_DAYS);
			reason = `last review before the exam on ${exam}: FSRS predicts ${(atExam * 100).toFixed(0)} % retention on exam day without it`;
		} else reason += `; predicted ${(atExam * 100).toFixed(0)} % on exam day, no review needed before it`;
	}
	const dueDay = addDays(today, days);
	next.due = learningDayStart(dueDay, options.timeZone);
	next.scheduled_days = days;
	return { card: toStoredCard(next), retention, dueDay, reason };
}
