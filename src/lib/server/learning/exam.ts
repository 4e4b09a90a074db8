/**
 * Mock exams: drawn by the blueprint's weights from items the learner has not seen in 30 days, timed on
 * the server (an answer after the end is refused), no feedback until the end, then a score report by
 * content area and a readiness estimate at our own cut score.
 */
import { and, desc, eq, isNull, max, sql } from 'drizzle-orm';
import { AREAS } from '$lib/items/blueprint';
import { assembleMockExam, CUT_SCORE, examMixFromWeights, readiness, type Readiness } from '$lib/learning';
import type { Db } from '../db/client';
import { mockExam, response } from '../db/schema';
import { itemForLearner, publishedItem, publishedItems, skillPrior, type ItemForLearner } from './catalog';
import { LearnError } from './errors';
import { abilitiesOf, ensureProfile, skillDifficulties } from './profile';
import { findByKey, isDuplicate, recordAnswer, type Q } from './record';
import type { Learner } from './sets';

/** Seconds after the end an answer sent before it may take to arrive. */
export const GRACE_SECONDS = 5;
export const MOCK_DEFAULTS = { count: 50, minutes: 60 };
export const WEIGHTS: Record<string, number> = Object.fromEntries(AREAS.map((a) => [a.id, a.weight]));

type ExamRow = typeof mockExam.$inferSelect;
type ExamEntry = { id: string; skill: string; area: string };

export type AreaScore = { area: string; title: string; right: number; total: number; score: number };
export type ExamReport = {
	items: number;
	answered: number;
	right: number;
	score: number;
	byArea: AreaScore[];
	readiness: Readiness;
	method: string;
	notes: string[];
};

export const READINESS_METHOD =
	'Each item of a full 50-item exam mixed by our area weights gets a predicted chance of a right answer from your ability in its area and the skill’s difficulty (the Rasch model, with the chance of a lucky guess on choice items). The exact distribution of the total (Poisson-binomial) gives the probability of reaching our cut score of ' +
	`${Math.round(CUT_SCORE * 100)} %. It is our own estimate, not a prediction from any testing body.`;

async function activeExam(db: Db, userId: string, now: Date): Promise<ExamRow | null> {
	const [e] = await db.select().from(mockExam).where(and(eq(mockExam.userId, userId), isNull(mockExam.finishedAt))).orderBy(desc(mockExam.id)).limit(1);
	if (!e) return null;
	if (now.getTime() > e.endsAt.getTime() + GRACE_SECONDS * 1000) {
		await finishExam(db, e.userId, e.id, now);
		return null;
	}
	return e;
}

/** Starts a mock exam (or returns the one running). */
export async function startExam(db: Db, learner: Learner, opts: { count: number; minutes: number }, now = new Date()): Promise<ExamRow> {
	const running = await activeExam(db, learner.id, now);
	if (running) return running;
	const items = await publishedItems(db);
	if (items.length === 0) throw new LearnError('no_items', 'There are no published questions yet, so a mock exam cannot be drawn. Please come back later.', 409);
	const seen = await db
		.select({ itemId: response.itemId, last: max(response.createdAt) })
		.from(response)
		.where(eq(response.userId, learner.id))
		.groupBy(response.itemId);
	const lastSeen: Record<string, number> = {};
	for (const s of seen) if (s.last) lastSeen[s.itemId] = new Date(s.last).getTime();
	const drawn = assembleMockExam({
		candidates: items.map((i) => ({ id: i.id, skillId: i.skill, area: i.area })),
		weights: WEIGHTS,
		lastSeen,
		now,
		count: opts.count,
		minutes: opts.minutes,
		seed: `${learner.id}:${now.getTime()}`
	});
	if (drawn.items.length === 0) throw new LearnError('no_fresh_items', 'You have seen every published question in the last 30 days; a fair mock exam cannot be drawn yet.', 409);
	const entries: ExamEntry[] = drawn.items.map((i) => ({ id: i.id, skill: i.skillId, area: i.area }));
	const minutes = Math.max(1, drawn.minutes);
	const startedAt = new Date(Math.floor(now.getTime() / 1000) * 1000);
	const [ins] = await db.insert(mockExam).values({ userId: learner.id, itemIds: entries, minutes, startedAt, endsAt: new Date(startedAt.getTime() + minutes * 60_000) });
	const [row] = await db.select().from(mockExam).where(eq(mockExam.id, ins.insertId));
	return row!;
}

async function answeredIds(db: Q, userId: string, examId: number): Promise<string[]> {
	const rows = await db
		.select({ itemId: response.itemId })
		.from(response)
		.where(and(eq(response.userId, userId), eq(response.context, 'mock'), eq(response.contextId, examId)))
		.orderBy(response.id);
	return rows.map((r) => r.itemId);
}

export type ExamState =
	| { running: true; examId: number; endsAt: string; secondsLeft: number; position: number; total: number; item: ItemForLearner }
	| { running: false; lastReportId: number | null };

/** Where the learner's mock exam stands; a run-out or completed exam is finished here. */
export async function examState(db: Db, learner: Learner, now = new Date()): Promise<ExamState> {
	for (let guard = 0; guard < 60; guard++) {
		const e = await activeExam(db, learner.id, now);
		if (!e) {
			const [last] = await db.select({ id: mockExam.id }).from(mockExam).where(eq(mockExam.userId, learner.id)).orderBy(desc(mockExam.id)).limit(1);
			return { running: false, lastReportId: last?.id ?? null };
		}
		const entries = e.itemIds as ExamEntry[];
		const done = await answeredIds(db, learner.id, e.id);
		if (done.length >= entries.length) {
			await finishExam(db, learner.id, e.id, now);
			continue;
		}
		const it = await publishedItem(db, entries[done.length].id);
		if (!it) {
			// Withdrawn since the draw: it counts as not answered and the exam goes on.
			entries.splice(done.length, 1);
			await db.update(mockExam).set({ itemIds: entries }).where(eq(mockExam.id, e.id));
			continue;
		}
		return {
			running: true,
			examId: e.id,
			endsAt: e.endsAt.toISOString(),
			secondsLeft: Math.max(0, Math.round((e.endsAt.getTime() - now.getTime()) / 1000)),
			position: done.length,
			total: entries.length,
			item: itemForLearner(it)
		};
	}
	throw new LearnError('exam_broken', 'Your mock exam could not be read. Please reload the page.', 500);
}

/** Records an exam answer (graded, no feedback). Refused after the end time. */
export async function answerExam(
	db: Db,
	learner: Learner,
	req: { examId: number; itemId: string; idempotencyKey: string; answer: unknown; ms: number },
	now = new Date()
): Promise<{ recorded: true; replayed: boolean }> {
	if (await findByKey(db, learner.id, req.idempotencyKey)) return { recorded: true, replayed: true };
	const [e] = await db.select().from(mockExam).where(and(eq(mockExam.id, req.examId), eq(mockExam.userId, learner.id)));
	if (!e) throw new LearnError('no_exam', 'This mock exam is not yours or does not exist.', 404, { examId: 'unknown exam' });
	if (e.finishedAt || now.getTime() > e.endsAt.getTime() + GRACE_SECONDS * 1000) {
		if (!e.finishedAt) await finishExam(db, learner.id, e.id, now);
		throw new LearnError('time_up', 'The time for this mock exam is over; this answer was not counted. Your report is ready.', 409);
	}
	const entries = e.itemIds as ExamEntry[];
	const profile = await ensureProfile(db, learner.id);
	try {
		await db.transaction(async (tx) => {
			// Lock the exam row so two answers cannot both take the same position.
			await tx.select({ id: mockExam.id }).from(mockExam).where(eq(mockExam.id, e.id)).for('update');
			if (await findByKey(tx, learner.id, req.idempotencyKey)) return;
			const done = await answeredIds(tx, learner.id, e.id);
			if (entries[done.length]?.id !== req.itemId)
				throw new LearnError('not_current', 'This is not the question your mock exam is on now. Reload the page to carry on.', 409, { itemId: 'not the current item' });
			const it = await publishedItem(tx, req.itemId);
			if (!it) throw new LearnError('item_gone', 'This question has just been withdrawn. Reload the page for the next one.', 409);
			await recordAnswer(tx, { userId: learner.id, timeZone: learner.timeZone, examDate: profile.examDate, item: it, answer: req.answer, ms: req.ms, idempotencyKey: req.idempotencyKey, context: 'mock', contextId: e.id, now });
		});
	} catch (err) {
		if (isDuplicate(err) && (await findByKey(db, learner.id, req.idempotencyKey))) return { recorded: true, replayed: true };
		throw err;
	}
	return { recorded: true, replayed: false };
}

/** The readiness estimate from the learner's current abilities, for a full exam mixed by our weights. */
export async function readinessOf(db: Db, userId: string): Promise<Readiness> {
	const abilities = await abilitiesOf(db, userId);
	const difficulty = await skillDifficulties(db);
	const items = await publishedItems(db);
	const skills = new Map<string, { area: string; difficulty: number; guess: number }>();
	for (const i of items) if (!skills.has(i.skill)) skills.set(i.skill, { area: i.area, difficulty: difficulty[i.skill] ?? skillPrior(i.skill), guess: i.guess });
	const list = [...skills.values()];
	const weights = Object.fromEntries(Object.entries(WEIGHTS).filter(([a]) => list.some((s) => s.area === a)));
	if (list.length === 0) return readiness({ abilities, items: [{ area: 'none', difficulty: 0 }] });
	return readiness({ abilities, items: examMixFromWeights(weights, list, 50) });
}

/** Scores the exam (unanswered items count as wrong), stores the report and marks it finished. Idempotent. */
export async function finishExam(db: Db, userId: string, examId: number, now = new Date()): Promise<ExamReport> {
	const [e] = await db.select().from(mockExam).where(and(eq(mockExam.id, examId), eq(mockExam.userId, userId)));
	if (!e) throw new LearnError('no_exam', 'This mock exam is not yours or does not exist.', 404);
	if (e.finishedAt && e.report) return e.report as ExamReport;
	const entries = e.itemIds as ExamEntry[];
	const rows = await db
		.select({ itemId: response.itemId, correct: response.correct })
		.from(response)
		.where(and(eq(response.userId, userId), eq(response.context, 'mock'), eq(response.contextId, examId)));
	const right = new Map(rows.map((r) => [r.itemId, r.correct]));
	const byArea: AreaScore[] = AREAS.map((a) => {
		const mine = entries.filter((x) => x.area === a.id);
		const r = mine.filter((x) => right.get(x.id) === true).length;
		return { area: a.id, title: a.title, right: r, total: mine.length, score: mine.length ? r / mine.length : 0 };
	}).filter((a) => a.total > 0);
	const totalRight = rows.filter((r) => r.correct).length;
	const report: ExamReport = {
		items: entries.length,
		answered: rows.length,
		right: totalRight,
		score: entries.length ? totalRight / entries.length : 0,
		byArea,
		readiness: await readinessOf(db, userId),
		method: READINESS_METHOD,
		notes: rows.length < entries.length ? [`${entries.length - rows.length} item(s) were not answered before the end and count as wrong.`] : []
	};
	await db.update(mockExam).set({ finishedAt: now, report }).where(and(eq(mockExam.id, examId), isNull(mockExam.finishedAt)));
	const [after] = await db.select({ report: mockExam.report }).from(mockExam).where(eq(mockExam.id, examId));
	return (after?.report as ExamReport) ?? report;
}

/** The learner's active exam id, if any (for finishing it early). */
export async function activeExamId(db: Db, userId: string, now = new Date()): Promise<number | null> {
	return (await activeExam(db, userId, now))?.id ?? null;
}

export async function examReport(db: Db, userId: string, examId: number): Promise<{ report: ExamReport; startedAt: Date; minutes: number } | null> {
	const [e] = await db.select().from(mockExam).where(and(eq(mockExam.id, examId), eq(mockExam.userId, userId)));
	if (!e || !e.finishedAt) return null;
	return { report: e.report as ExamReport, startedAt: e.startedAt, minutes: e.minutes };
}

export async function pastExams(db: Db, userId: string) {
	return db
		.select({ id: mockExam.id, startedAt: mockExam.startedAt, minutes: mockExam.minutes, finishedAt: mockExam.finishedAt, score: sql<number | null>`JSON_EXTRACT(${mockExam.report}, '$.score')` })
		.from(mockExam)
		.where(eq(mockExam.userId, userId))
		.orderBy(desc(mockExam.id))
		.limit(20);
}

