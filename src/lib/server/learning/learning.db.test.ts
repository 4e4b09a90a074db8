// The learner's day against the real MariaDB: placement, daily set composition, idempotent and
// server-graded answers in one transaction, resume, and the mock exam's 30-day rule and time limit.
// Items are real builds (buildBank on every circuit family, keyed by the engine), stored as published.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { areaAbility, itemStat, learnerProfile, practiceSet, response, skillCard, skillDifficulty } from '../db/schema';
import { AREAS } from '$lib/items/blueprint';
import { learningDay, newCard, type StoredCard } from '$lib/learning';
import type { BuiltItem, QuestionPayload } from '$lib/items/types';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { publishItems, rightAnswer, storedKey, wrongAnswer } from '../../../../tests/helpers/learning-items';
import { answerSchema } from '../../../routes/api/learn/answer/schema';
import { answerInSet, nextItem, type Learner, type SetEntry } from './sets';
import { answerExam, examState, finishExam, startExam, GRACE_SECONDS } from './exam';
import { answerHistory } from './history';
import { progressOf } from './progress';
import { successOffsetAt } from './first-answers';
import { LearnError } from './errors';

const ZONE = 'America/Chicago';
let items: BuiltItem[] = [];

beforeAll(async () => {
	items = await publishItems(getDb());
}, 120_000);
afterAll(closeDb);

async function newLearner(label: string): Promise<Learner> {
	const u = await createAccount({ email: uniqueEmail(label), name: 'Rowan Testfield', password: 'a long test password', timeZone: ZONE, roles: ['learner'] });
	return { id: u.id, timeZone: ZONE };
}

async function rowCount(userId: string): Promise<number> {
	const [r] = await getDb().select({ n: sql<number>`count(*)` }).from(response).where(eq(response.userId, userId));
	return Number(r.n);
}

async function answerCurrent(l: Learner, right: boolean, now = new Date()) {
	const next = await nextItem(getDb(), l, now);
	expect(next.item, next.message ?? '').not.toBeNull();
	const key = await storedKey(getDb(), next.item!.id);
	const answer = right ? rightAnswer(key) : wrongAnswer(key, next.item!.question as QuestionPayload & { options?: { id: string }[] });
	return { next, result: await answerInSet(getDb(), l, { setId: next.setId!, itemId: next.item!.id, idempotencyKey: randomUUID(), answer, ms: 20_000 }, now) };
}

async function finishPlacementDirectly(userId: string, thetas: Record<string, number>) {
	const db = getDb();
	await db.insert(learnerProfile).values({ userId, placementDoneAt: new Date() }).onDuplicateKeyUpdate({ set: { placementDoneAt: new Date() } });
	for (const [area, theta] of Object.entries(thetas)) await db.insert(areaAbility).values({ userId, area, theta, n: 5 }).onDuplicateKeyUpdate({ set: { theta } });
}

describe('placement', () => {
	it('serves about 12 items near 50 % predicted success, then sets a starting ability for every area', async () => {
		const l = await newLearner('placement');
		const first = await nextItem(getDb(), l);
		expect(first.phase).toBe('placement');
		expect(first.total).toBe(12);
		// The answer key never reaches the client.
		expect(JSON.stringify(first.item)).not.toContain('"key"');
		for (let i = 0; i < 12; i++) await answerCurrent(l, i % 2 === 0);
		const [set] = await getDb().select().from(practiceSet).where(and(eq(practiceSet.userId, l.id), eq(practiceSet.kind, 'placement')));
		const entries = set.entries as SetEntry[];
		expect(entries).toHaveLength(12);
		expect(set.finishedAt).not.toBeNull();
		// Maximum Fisher information of a Rasch item is at p = 0.5 (Lord 1980, Applications of IRT, ch. 5);
		// a choice item's guessing floor moves its best point up (Birnbaum 1968), hence the band's top.
		// Each area offers only its own skills' difficulties, so single items stray; the set centres near 50 %.
		const mean = entries.reduce((s, e) => s + e.predictedSuccess, 0) / entries.length;
		expect(mean).toBeGreaterThan(0.4);
		expect(mean).toBeLessThan(0.65);
		for (const e of entries) expect(e.predictedSuccess).toBeGreaterThan(0.15), expect(e.predictedSuccess).toBeLessThan(0.9);
		// Balanced across areas: the first nine items come from nine different areas (one per area first).
		expect(new Set(entries.slice(0, AREAS.length).map((e) => e.area)).size).toBe(AREAS.length);
		const [profile] = await getDb().select().from(learnerProfile).where(eq(learnerProfile.userId, l.id));
		expect(profile.placementDoneAt).not.toBeNull();
		const abilities = await getDb().select().from(areaAbility).where(eq(areaAbility.userId, l.id));
		expect(abilities.map((a) => a.area).sort()).toEqual(AREAS.map((a) => a.id).sort());
		// After placement the learner is on the daily set.
		expect((await nextItem(getDb(), l)).phase).toBe('daily');
	}, 60_000);
});

describe('the daily set', () => {
	it('puts due reviews first, each a fresh variant, then new skills from the weakest area', async () => {
		const db = getDb();
		const l = await newLearner('daily');
		const weakest = 'meters-basics';
		await finishPlacementDirectly(l.id, Object.fromEntries(AREAS.map((a) => [a.id, a.id === weakest ? 1.2 : 3])));
		// Two skills due yesterday, each last seen on one of its variants.
		const now = new Date();
		const dueSkills = ['relay-operation', 'lamp-circuits'];
		const lastSeen: Record<string, string> = {};
		for (const skill of dueSkills) {
			const variant = items.find((i) => i.skill === skill)!;
			lastSeen[skill] = variant.id;
			const card: StoredCard = { ...newCard(new Date(now.getTime() - 5 * 86_400_000)), state: 2, stability: 3, reps: 2, due: new Date(now.getTime() - 86_400_000).toISOString(), last_review: new Date(now.getTime() - 4 * 86_400_000).toISOString() };
			await db.insert(skillCard).values({ userId: l.id, skill, card, due: new Date(card.due), lastItemId: variant.id });
		}
		const first = await nextItem(db, l, now);
		expect(first.phase).toBe('daily');
		const [set] = await db.select().from(practiceSet).where(and(eq(practiceSet.userId, l.id), eq(practiceSet.kind, 'daily')));
		expect(set.day).toBe(learningDay(now, ZONE));
		const entries = set.entries as SetEntry[];
		const kinds = entries.map((e) => e.kind);
		// Reviews before new items (the rule of the issue: due reviews first).
		expect(kinds.slice(0, 2)).toEqual(['review', 'review']);
		expect(kinds.slice(2).every((k) => k === 'new')).toBe(true);
		expect(entries.slice(0, 2).map((e) => e.skillId).sort()).toEqual([...dueSkills].sort());
		for (const e of entries.slice(0, 2)) expect(e.itemId).not.toBe(lastSeen[e.skillId]);
		// New skills: from the weakest area first; predicted success by the Rasch model with the guessing
		// floor (Birnbaum 1968, p = g + (1 − g) / (1 + e^−(θ − b))), recomputed here from the stored values.
		const news = entries.filter((e) => e.kind === 'new');
		expect(news.length).toBeGreaterThan(0);
		expect(news[0].area).toBe(weakest);
		const [sd] = await db.select().from(skillDifficulty).where(eq(skillDifficulty.skill, news[0].skillId));
		const { skillPrior } = await import('./catalog');
		const b = sd?.beta ?? skillPrior(news[0].skillId);
		const variants = items.filter((i) => i.skill === news[0].skillId);
		expect(variants.length).toBeGreaterThan(0);
		expect(news[0].predictedSuccess).toBeGreaterThanOrEqual(0.75);
		expect(news[0].reason).toContain('80 %–85 %');
		// The population's new-skill offset δ shifts the logit (p = g + (1 − g)·σ(θ − b + δ)).
		const delta = await successOffsetAt(db, now);
		const noGuess = 1 / (1 + Math.exp(-(1.2 - b + delta)));
		expect(news[0].predictedSuccess).toBeGreaterThanOrEqual(noGuess - 1e-9);
		// Closing the tab loses nothing: the same set comes back.
		const again = await nextItem(db, l, now);
		expect(again.setId).toBe(first.setId);
		expect(again.item!.id).toBe(entries[0].itemId);
	});

	it('resumes after a dropped connection: three answered, the fourth comes next', async () => {
		const l = await newLearner('resume');
		await finishPlacementDirectly(l.id, Object.fromEntries(AREAS.map((a) => [a.id, 3])));
		const first = await nextItem(getDb(), l);
		const [set] = await getDb().select().from(practiceSet).where(eq(practiceSet.id, first.setId!));
		const entries = set.entries as SetEntry[];
		expect(entries.length).toBeGreaterThanOrEqual(4);
		for (let i = 0; i < 3; i++) await answerCurrent(l, true);
		await closeDb(); // the pool goes away as a dropped connection would; the next call opens a new one
		const next = await nextItem(getDb(), l);
		expect(next.position).toBe(3);
		expect(next.item!.id).toBe(entries[3].itemId);
	});
});

describe('answers', () => {
	async function dailyLearner(label: string) {
		const l = await newLearner(label);
		await finishPlacementDirectly(l.id, Object.fromEntries(AREAS.map((a) => [a.id, 3])));
		const next = await nextItem(getDb(), l);
		return { l, next, key: await storedKey(getDb(), next.item!.id) };
	}

	it('count once per idempotency key, with the same result, also when sent twice at once', async () => {
		const { l, next, key } = await dailyLearner('idem');
		const req = { setId: next.setId!, itemId: next.item!.id, idempotencyKey: randomUUID(), answer: rightAnswer(key), ms: 15_000 };
		const a = await answerInSet(getDb(), l, req);
		const b = await answerInSet(getDb(), l, req);
		expect(a.correct).toBe(true);
		expect(b.replayed).toBe(true);
		expect(b.responseId).toBe(a.responseId);
		expect(b.score).toBe(a.score);
		expect(await rowCount(l.id)).toBe(1);
		const second = await nextItem(getDb(), l);
		const key2 = await storedKey(getDb(), second.item!.id);
		const req2 = { setId: second.setId!, itemId: second.item!.id, idempotencyKey: randomUUID(), answer: rightAnswer(key2), ms: 15_000 };
		const both = await Promise.all([answerInSet(getDb(), l, req2), answerInSet(getDb(), l, req2)]);
		expect(both[0].responseId).toBe(both[1].responseId);
		expect(await rowCount(l.id)).toBe(2);
		const [set] = await getDb().select().from(practiceSet).where(eq(practiceSet.id, next.setId!));
		expect(set.position).toBe(2);
	});

	it('are graded on the server only: a forged correct or score is refused or ignored and changes nothing', async () => {
		const { l, next, key } = await dailyLearner('forged');
		// Top-level forged fields: the request schema refuses them.
		const forged = { setId: next.setId!, itemId: next.item!.id, idempotencyKey: randomUUID(), answer: rightAnswer(key), ms: 1000, correct: true, score: 1 };
		expect(answerSchema.safeParse(forged).success).toBe(false);
		// Inside the answer: a wrong value claiming to be right is graded wrong by the stored key.
		const [before] = await getDb().select().from(itemStat).where(eq(itemStat.itemId, next.item!.id));
		const wrong = { ...wrongAnswer(key, next.item!.question as QuestionPayload & { options?: { id: string }[] }), correct: true, score: 1 };
		let result;
		try {
			result = await answerInSet(getDb(), l, { setId: next.setId!, itemId: next.item!.id, idempotencyKey: randomUUID(), answer: wrong, ms: 1000 });
		} catch (e) {
			// Kinds that check every key of the answer refuse the extra fields outright.
			expect(e).toBeInstanceOf(LearnError);
			expect(await rowCount(l.id)).toBe(0);
			return;
		}
		expect(result.correct).toBe(false);
		const [after] = await getDb().select().from(itemStat).where(eq(itemStat.itemId, next.item!.id));
		expect(after.sumCorrect).toBe(before?.sumCorrect ?? 0);
		const [row] = await getDb().select().from(response).where(eq(response.userId, l.id));
		expect(row.correct).toBe(false);
	});

	it('change the response, skill card, ability, difficulty and item statistics in one transaction', async () => {
		const { l, next, key } = await dailyLearner('tx');
		const db = getDb();
		const it = next.item!;
		const snapshot = async () => ({
			responses: await rowCount(l.id),
			card: (await db.select().from(skillCard).where(and(eq(skillCard.userId, l.id), eq(skillCard.skill, it.skill))))[0] ?? null,
			ability: (await db.select().from(areaAbility).where(and(eq(areaAbility.userId, l.id), eq(areaAbility.area, it.area))))[0] ?? null,
			difficulty: (await db.select().from(skillDifficulty).where(eq(skillDifficulty.skill, it.skill)))[0] ?? null,
			stat: (await db.select().from(itemStat).where(eq(itemStat.itemId, it.id)))[0] ?? null,
			position: (await db.select().from(practiceSet).where(eq(practiceSet.id, next.setId!)))[0].position
		});
		const before = await snapshot();
		const req = { setId: next.setId!, itemId: it.id, idempotencyKey: randomUUID(), answer: rightAnswer(key), ms: 9000 };
		await expect(
			answerInSet(db, l, req, new Date(), async () => {
				throw new Error('the connection dropped mid-way');
			})
		).rejects.toThrow('mid-way');
		expect(await snapshot()).toEqual(before);
		// The same request again succeeds and writes each of them.
		await answerInSet(db, l, req);
		const after = await snapshot();
		expect(after.responses).toBe(before.responses + 1);
		expect(after.card).not.toBeNull();
		expect(after.ability!.n).toBe(before.ability!.n + 1);
		expect(after.stat!.n).toBe((before.stat?.n ?? 0) + 1);
		expect(after.difficulty!.n).toBe((before.difficulty?.n ?? 0) + 1);
		expect(after.position).toBe(before.position + 1);
	});

	it('to an item that is not the current one are refused', async () => {
		const { l, next } = await dailyLearner('order');
		const other = items.find((i) => i.id !== next.item!.id)!;
		await expect(answerInSet(getDb(), l, { setId: next.setId!, itemId: other.id, idempotencyKey: randomUUID(), answer: { value: 1 }, ms: 1 })).rejects.toMatchObject({ code: 'not_current', status: 409 });
		expect(await rowCount(l.id)).toBe(0);
	});

	it('are listed in the history with the given and expected answers', async () => {
		const { l, next, key } = await dailyLearner('history');
		await answerInSet(getDb(), l, { setId: next.setId!, itemId: next.item!.id, idempotencyKey: randomUUID(), answer: rightAnswer(key), ms: 4000 });
		const rows = await answerHistory(getDb(), l.id);
		expect(rows).toHaveLength(1);
		expect(rows[0].itemId).toBe(next.item!.id);
		expect(rows[0].correct).toBe(true);
		expect(rows[0].given.length).toBeGreaterThan(0);
		expect(rows[0].expected.length).toBeGreaterThan(0);
		const p = await progressOf(getDb(), l);
		expect(p.perDay.at(-1)!.answers).toBe(1);
		expect(p.streak).toBe(1);
	});
});

describe('the mock exam', () => {
	it('leaves out items seen in the last 30 days', async () => {
		const db = getDb();
		const l = await newLearner('exam30');
		const recent = items[0];
		const old = items[1];
		const day = 86_400_000;
		const versionOf = async (id: string) => (await db.execute(sql`select published_version_id as v from item where id = ${id}`))[0] as unknown as { v: number }[];
		for (const [it, ago] of [
			[recent, 29],
			[old, 31]
		] as const) {
			const [{ v }] = await versionOf(it.id);
			await db.insert(response).values({ userId: l.id, itemId: it.id, itemVersionId: v, idempotencyKey: randomUUID(), context: 'practice', answer: {}, score: 1, correct: true, ms: 1000, createdAt: new Date(Date.now() - ago * day) });
		}
		const [{ n }] = (await db.execute(sql`select count(*) as n from item where status = 'published'`))[0] as unknown as { n: number }[];
		const exam = await startExam(db, l, { count: Number(n), minutes: 60 });
		const ids = (exam.itemIds as { id: string }[]).map((e) => e.id);
		expect(ids).not.toContain(recent.id);
		expect(ids).toContain(old.id);
		expect(ids.length).toBe(Number(n) - 1);
	});

	it('refuses answers after the end time and reports by area with a readiness estimate', async () => {
		const db = getDb();
		const l = await newLearner('examtime');
		const t0 = new Date();
		const exam = await startExam(db, l, { count: 5, minutes: 5 }, t0);
		expect(exam.minutes).toBe(5);
		const s1 = await examState(db, l, new Date(t0.getTime() + 10_000));
		if (!s1.running) throw new Error('the exam should be running');
		expect(s1.total).toBe(5);
		const key = await storedKey(db, s1.item.id);
		const ok = await answerExam(db, l, { examId: exam.id, itemId: s1.item.id, idempotencyKey: randomUUID(), answer: rightAnswer(key), ms: 5000 }, new Date(t0.getTime() + 20_000));
		expect(ok.recorded).toBe(true);
		const s2 = await examState(db, l, new Date(t0.getTime() + 30_000));
		if (!s2.running) throw new Error('the exam should still be running');
		expect(s2.position).toBe(1);
		const late = new Date(exam.endsAt.getTime() + (GRACE_SECONDS + 1) * 1000);
		const key2 = await storedKey(db, s2.item.id);
		await expect(answerExam(db, l, { examId: exam.id, itemId: s2.item.id, idempotencyKey: randomUUID(), answer: rightAnswer(key2), ms: 5000 }, late)).rejects.toMatchObject({ code: 'time_up' });
		expect(await rowCount(l.id)).toBe(1);
		const report = await finishExam(db, l.id, exam.id, late);
		expect(report.items).toBe(5);
		expect(report.answered).toBe(1);
		expect(report.right).toBe(1);
		expect(report.byArea.reduce((s, a) => s + a.total, 0)).toBe(5);
		expect(report.readiness.label).toBe('estimate');
		expect(report.readiness.probability).toBeGreaterThanOrEqual(0);
		expect(report.readiness.probability).toBeLessThanOrEqual(1);
		expect(report.method).toContain('Poisson-binomial');
		expect((await examState(db, l, late)).running).toBe(false);
	});
});
