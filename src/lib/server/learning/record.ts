/**
 * One graded answer and everything it changes, in ONE transaction: the response row, the skill card
 * (ts-fsrs through src/lib/learning), the area ability, the skill difficulty, the item's statistics and
 * the day's ability snapshot. Grading happens here only, with the stored key; nothing the client says
 * about correctness is read. A retried request (same idempotency key) never counts twice.
 */
import { and, eq, sql } from 'drizzle-orm';
import { gradeResponse, ResponseError, type Grade } from '$lib/items/grade';
import { learningDay, rateAnswer, scheduleReview, updateAbility, updateDifficulty, type StoredCard } from '$lib/learning';
import { abilitySnapshot, areaAbility, itemStat, response, skillCard, skillDifficulty } from '../db/schema';
import { skillPrior, type ServedItem } from './catalog';
import { LearnError } from './errors';

export type { Q, Tx } from './q';
import type { Q, Tx } from './q';

export type AnswerContext = 'placement' | 'daily' | 'mock' | 'practice';

export type AnswerInput = {
	userId: string;
	timeZone: string;
	examDate: string | null;
	item: ServedItem;
	answer: unknown;
	ms: number;
	idempotencyKey: string;
	context: AnswerContext;
	contextId: number | null;
	now: Date;
};

/** What an answer changed; `abilityBefore`, `difficultyBefore` and `guess` are what the Rasch update used. */
export type Recorded = { responseId: number; score: number; correct: boolean; grade: Grade; abilityBefore: number; abilityAfter: number; difficultyBefore: number; guess: number };

/** Grades with the stored key; a response of the wrong shape is a 400 naming what to send. */
export function gradeOnServer(it: ServedItem, answer: unknown): Grade {
	try {
		return gradeResponse(it, answer);
	} catch (e) {
		if (e instanceof ResponseError) throw new LearnError('bad_answer', `This answer cannot be graded: ${e.message}.`, 400, { answer: e.message });
		throw e;
	}
}

export function isDuplicate(e: unknown): boolean {
	for (let x: unknown = e; x && typeof x === 'object'; x = (x as { cause?: unknown }).cause) if ((x as { code?: unknown }).code === 'ER_DUP_ENTRY') return true;
	return false;
}

/** The response already stored under this idempotency key, or null. */
export async function findByKey(q: Q, userId: string, key: string) {
	const [r] = await q.select().from(response).where(and(eq(response.userId, userId), eq(response.idempotencyKey, key)));
	return r ?? null;
}

/**
 * Writes one answer inside the caller's transaction. `afterWrites` runs after every write and before
 * the commit; tests use it to fail mid-way and check that nothing is left behind.
 */
export async function recordAnswer(tx: Tx, input: AnswerInput, afterWrites?: () => Promise<void>): Promise<Recorded> {
	const { userId, item: it, now } = input;
	const grade = gradeOnServer(it, input.answer);
	const correct = grade.correct;
	const day = learningDay(now, input.timeZone);

	const [ab] = await tx.select().from(areaAbility).where(and(eq(areaAbility.userId, userId), eq(areaAbility.area, it.area))).for('update');
	const ability = { value: ab?.theta ?? 0, count: ab?.n ?? 0 };
	const [sd] = await tx.select().from(skillDifficulty).where(eq(skillDifficulty.skill, it.skill)).for('update');
	const difficulty = { value: sd?.beta ?? skillPrior(it.skill), count: sd?.n ?? 0 };
	const guess = it.question.kind === 'choose-one' && it.question.options.length > 0 ? 1 / it.question.options.length : 0;

	const [ins] = await tx.insert(response).values({
		userId,
		itemId: it.id,
		itemVersionId: it.versionId,
		idempotencyKey: input.idempotencyKey,
		context: input.context,
		contextId: input.contextId,
		answer: input.answer as object,
		score: grade.score,
		correct,
		ms: input.ms,
		abilityBefore: ability.value,
		createdAt: now
	});
	const responseId = ins.insertId;

	const [stat] = await tx.select().from(itemStat).where(eq(itemStat.itemId, it.id)).for('update');
	// The mean time stands in for the median until per-item time distributions are kept.
	const medianSeconds = stat && stat.n > 0 ? stat.sumMs / stat.n / 1000 : null;
	const [cardRow] = await tx.select().from(skillCard).where(and(eq(skillCard.userId, userId), eq(skillCard.skill, it.skill))).for('update');
	const rating = rateAnswer({ correct, seconds: input.ms / 1000, medianSeconds });
	const next = scheduleReview((cardRow?.card as StoredCard | undefined) ?? null, rating, now, { timeZone: input.timeZone, examDate: input.examDate });
	await tx
		.insert(skillCard)
		.values({ userId, skill: it.skill, card: next.card, due: new Date(next.card.due), lastItemId: it.id, updatedAt: now })
		.onDuplicateKeyUpdate({ set: { card: next.card, due: new Date(next.card.due), lastItemId: it.id, updatedAt: now } });

	const newAbility = updateAbility(ability, difficulty.value, correct, guess);
	const newDifficulty = updateDifficulty(difficulty, ability.value, correct, guess);
	await tx
		.insert(areaAbility)
		.values({ userId, area: it.area, theta: newAbility.value, n: newAbility.count, updatedAt: now })
		.onDuplicateKeyUpdate({ set: { theta: newAbility.value, n: newAbility.count, updatedAt: now } });
	await tx
		.insert(skillDifficulty)
		.values({ skill: it.skill, beta: newDifficulty.value, n: newDifficulty.count })
		.onDuplicateKeyUpdate({ set: { beta: newDifficulty.value, n: newDifficulty.count } });
	await tx
		.insert(abilitySnapshot)
		.values({ userId, area: it.area, day, theta: newAbility.value })
		.onDuplicateKeyUpdate({ set: { theta: newAbility.value } });

	const t = ability.value;
	await tx
		.insert(itemStat)
		.values({ itemId: it.id, n: 1, sumScore: grade.score, sumCorrect: correct ? 1 : 0, sumTheta: t, sumTheta2: t * t, sumThetaCorrect: correct ? t : 0, sumMs: input.ms })
		.onDuplicateKeyUpdate({
			set: {
				n: sql`${itemStat.n} + 1`,
				sumScore: sql`${itemStat.sumScore} + ${grade.score}`,
				sumCorrect: sql`${itemStat.sumCorrect} + ${correct ? 1 : 0}`,
				sumTheta: sql`${itemStat.sumTheta} + ${t}`,
				sumTheta2: sql`${itemStat.sumTheta2} + ${t * t}`,
				sumThetaCorrect: sql`${itemStat.sumThetaCorrect} + ${correct ? t : 0}`,
				sumMs: sql`${itemStat.sumMs} + ${input.ms}`
			}
		});
	if (afterWrites) await afterWrites();
	return { responseId, score: grade.score, correct, grade, abilityBefore: ability.value, abilityAfter: newAbility.value, difficultyBefore: difficulty.value, guess };
}
