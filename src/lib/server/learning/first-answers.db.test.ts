// The new-skill success offset on the server, against the real MariaDB: first answers (daily-set entries
// of kind `new`) recorded through answerInSet, read back by one query, and passed to the next set.
//
// Other test files answer in the same database at the real time. This file answers at instants of its own,
// days before the oldest answer stored so far, and reads the history "as of" them, so the rows it counts
// are its own: first the right answers on a later day, read before anything earlier exists, then the
// mostly wrong ones on an earlier day, which the as-of bound keeps apart from the later ones. Afterwards
// its learners (and with them their answers and sets) are deleted and the shared skill difficulties are
// put back, so the files that run later see the same population as without it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { and, eq, inArray, notInArray, sql } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { areaAbility, learnerProfile, practiceSet, response, skillDifficulty, user } from '../db/schema';
import { AREAS } from '$lib/items/blueprint';
import { calibrateSuccessOffset, pWithGuess, type FirstAnswer } from '$lib/learning';
import type { QuestionPayload } from '$lib/items/types';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { publishItems, rightAnswer, storedKey, wrongAnswer } from '../../../../tests/helpers/learning-items';
import { skillPrior } from './catalog';
import { firstAnswers, populationSuccessOffset, successOffsetAt } from './first-answers';
import { answerInSet, nextItem, skillInfos, type Learner, type SetEntry } from './sets';

const ZONE = 'UTC';
const MIN = 60_000;
// Able in every area, so each daily set starts several new skills whatever the shared difficulties are now.
const THETA = 2.5;
const DAY = 86_400_000;
let LATER = 0;
let EARLIER = 0;
const made: string[] = [];
let difficulties: (typeof skillDifficulty.$inferSelect)[] = [];

beforeAll(async () => {
	const [{ first }] = await getDb().select({ first: sql<string | Date | null>`min(${response.createdAt})` }).from(response);
	const stored = first == null ? Date.now() : first instanceof Date ? first.getTime() : Date.parse(`${String(first).replace(' ', 'T')}Z`);
	const oldest = Math.min(stored, Date.UTC(1990, 0, 1));
	// 10:00 UTC, well inside one learning day (04:00 to 04:00), two days before the oldest stored answer.
	LATER = Math.floor(oldest / DAY) * DAY - 2 * DAY + 10 * 60 * MIN;
	EARLIER = LATER - 40 * DAY;
	difficulties = await getDb().select().from(skillDifficulty);
	await publishItems(getDb());
}, 120_000);
afterAll(async () => {
	const db = getDb();
	if (made.length) await db.delete(user).where(inArray(user.id, made));
	const kept = difficulties.map((d) => d.skill);
	await (kept.length ? db.delete(skillDifficulty).where(notInArray(skillDifficulty.skill, kept)) : db.delete(skillDifficulty));
	for (const d of difficulties) await db.update(skillDifficulty).set({ beta: d.beta, n: d.n }).where(eq(skillDifficulty.skill, d.skill));
	await closeDb();
});

async function placedLearner(label: string): Promise<Learner> {
	const u = await createAccount({ email: uniqueEmail(label), name: 'Tamsin Larkford', password: 'a long test password', timeZone: ZONE, roles: ['learner'] });
	made.push(u.id);
	const db = getDb();
	await db.insert(learnerProfile).values({ userId: u.id, placementDoneAt: new Date(EARLIER - DAY) });
	for (const a of AREAS) await db.insert(areaAbility).values({ userId: u.id, area: a.id, theta: THETA, n: 5 });
	return { id: u.id, timeZone: ZONE };
}

/**
 * Answers every new entry of one learner's daily set at `start` (one a minute), right when `right(i)`,
 * and returns what this test read from the database before each answer: the area ability, the skill
 * difficulty (the blueprint prior while the skill has no row yet) and the guessing chance (1 / options).
 */
async function answerNewSkills(l: Learner, start: number, right: (i: number) => boolean, counter: { i: number }) {
	const db = getDb();
	const seen: (FirstAnswer & { at: number; responseAbility?: number })[] = [];
	for (let k = 0; k < 20; k++) {
		const at = start + k * MIN;
		const next = await nextItem(db, l, new Date(at));
		if (!next.item) break;
		const [set] = await db.select().from(practiceSet).where(eq(practiceSet.id, next.setId!));
		const entry = (set.entries as SetEntry[])[next.position];
		expect(entry.kind).toBe('new'); // no card yet, so nothing is due: the set is all new skills
		const [ab] = await db.select().from(areaAbility).where(and(eq(areaAbility.userId, l.id), eq(areaAbility.area, entry.area)));
		const [sd] = await db.select().from(skillDifficulty).where(eq(skillDifficulty.skill, entry.skillId));
		const q = next.item.question as QuestionPayload & { options?: { id: string }[] };
		const guess = q.kind === 'choose-one' ? 1 / q.options!.length : 0;
		const key = await storedKey(db, next.item.id);
		const answer = right(counter.i++) ? rightAnswer(key) : wrongAnswer(key, q);
		const res = await answerInSet(db, l, { setId: next.setId!, itemId: next.item.id, idempotencyKey: randomUUID(), answer, ms: 20_000 }, new Date(at));
		seen.push({ ability: ab.theta, difficulty: sd?.beta ?? skillPrior(entry.skillId), guess, correct: res.correct, at });
	}
	return seen;
}

async function answerAsPopulation(label: string, start: number, learners: number, right: (i: number) => boolean) {
	const all: (FirstAnswer & { at: number })[] = [];
	const counter = { i: 0 };
	for (let n = 0; n < learners; n++) all.push(...(await answerNewSkills(await placedLearner(`${label}${n}`), start + n * 20 * MIN, right, counter)));
	return all;
}

describe('the new-skill success offset', () => {
	it('is 0 below 20 first answers, rises when they are all right and falls when mostly wrong', async () => {
		const db = getDb();
		// Nothing recorded as of the later day yet (the other files answer at today's date).
		expect(await firstAnswers(db, new Date(LATER))).toEqual([]);

		// Right: every answer (the sets are chosen for 80–85 % success, so anything less may be no surprise).
		const right = await answerAsPopulation('offset-right', LATER, 6, () => true);
		expect(right.length).toBeGreaterThanOrEqual(20);
		const rightEnd = new Date(right[right.length - 1].at);
		// The query returns this test's answers, oldest first, with the values the Rasch update used.
		const read = await firstAnswers(db, rightEnd);
		expect(read).toHaveLength(right.length);
		read.forEach((r, i) => {
			expect(r.correct).toBe(right[i].correct);
			expect(r.ability).toBeCloseTo(right[i].ability, 9);
			expect(r.difficulty).toBeCloseTo(right[i].difficulty, 9);
			expect(r.guess).toBeCloseTo(right[i].guess!, 9);
		});
		// The 19th answer is not enough, the 20th is (the documented minimum of calibrateSuccessOffset).
		expect(await successOffsetAt(db, new Date(right[18].at))).toBe(0);
		expect(await successOffsetAt(db, new Date(right[19].at))).not.toBe(0);
		const share = right.filter((a) => a.correct).length / right.length;
		const predicted = right.reduce((s, a) => s + pWithGuess(a.ability, a.difficulty, a.guess), 0) / right.length;
		// The maximum a posteriori shift has the sign of (observed − predicted) share right: the score
		// equation of the Rasch model sums x − P (Rasch 1960; Baker 2001, ch. 5).
		expect(share).toBeGreaterThan(predicted);
		const up = await successOffsetAt(db, rightEnd);
		expect(up).toBeGreaterThan(0.1);
		expect(up).toBeCloseTo(calibrateSuccessOffset(right), 9);

		// Mostly wrong, on an earlier day: only each fifth right.
		const wrong = await answerAsPopulation('offset-wrong', EARLIER, 6, (i) => i % 5 === 4);
		const wrongEnd = new Date(wrong[wrong.length - 1].at);
		expect(await firstAnswers(db, wrongEnd)).toHaveLength(wrong.length);
		const wrongShare = wrong.filter((a) => a.correct).length / wrong.length;
		expect(wrongShare).toBeLessThan(wrong.reduce((s, a) => s + pWithGuess(a.ability, a.difficulty, a.guess), 0) / wrong.length);
		const down = await successOffsetAt(db, wrongEnd);
		expect(down).toBeLessThan(-0.1);
		expect(down).toBeCloseTo(calibrateSuccessOffset(wrong), 9);
		// Only daily-set answers of kind `new` count: the responses of these learners hold no other context.
		const rows = await db.select({ context: response.context }).from(response).where(eq(response.createdAt, wrongEnd));
		expect(rows.every((r) => r.context === 'daily')).toBe(true);
	}, 180_000);

	it('is what the next daily set predicts new skills with', async () => {
		const db = getDb();
		// As of the end of the wrong day plus an hour (past the cache's few minutes): the offset is negative.
		const at = EARLIER + 6 * 20 * MIN + 60 * MIN;
		const delta = await successOffsetAt(db, new Date(at));
		expect(delta).toBeLessThan(0);
		expect(await populationSuccessOffset(db, new Date(at))).toBeCloseTo(delta, 12);
		const l = await placedLearner('offset-set');
		const next = await nextItem(db, l, new Date(at));
		const [set] = await db.select().from(practiceSet).where(eq(practiceSet.id, next.setId!));
		const news = (set.entries as SetEntry[]).filter((e) => e.kind === 'new');
		expect(news.length).toBeGreaterThan(0);
		const skills = new Map((await skillInfos(db)).map((k) => [k.id, k]));
		for (const e of news) {
			const k = skills.get(e.skillId)!;
			// Birnbaum's three-parameter form with unit slope and the offset: p = g + (1 − g)·σ(θ − b + δ) (Birnbaum 1968).
			expect(e.predictedSuccess).toBeCloseTo(pWithGuess(THETA + delta, k.difficulty, k.guess), 9);
			expect(Math.abs(e.predictedSuccess - pWithGuess(THETA, k.difficulty, k.guess))).toBeGreaterThan(1e-3);
		}
	}, 60_000);
});
