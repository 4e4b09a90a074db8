/**
 * Placement and daily sets: composed on the server with src/lib/learning, stored in `practice_set`
 * (one per learner, kind and learning day) so a closed tab resumes where it stopped.
 */
import { and, eq, sql } from 'drizzle-orm';
import { AREAS } from '$lib/items/blueprint';
import { gradeResponse } from '$lib/items/grade';
import { formatAnswer, formatKey } from './answer-text';
import { composeDailySet, learningDay, nextPlacementItem, placementAbilities, type PlacementResponse, type SkillInfo } from '$lib/learning';
import type { Db } from '../db/client';
import { abilitySnapshot, areaAbility, itemStat, learnerProfile, practiceSet } from '../db/schema';
import { itemForLearner, itemAtVersion, publishedItem, publishedItems, skillPrior, type ItemForLearner, type ItemSummary } from './catalog';
import { LearnError } from './errors';
import { abilitiesOf, cardsOf, ensureProfile, skillDifficulties } from './profile';
import { findByKey, isDuplicate, recordAnswer, type Tx } from './record';
import { populationSuccessOffset } from './first-answers';

export type Learner = { id: string; timeZone: string };

/** One entry of a stored set; `correct` is filled in when it is answered. */
export type SetEntry = {
	itemId: string;
	skillId: string;
	area: string;
	kind: 'placement' | 'review' | 'new';
	predictedSuccess: number;
	reason: string;
	correct?: boolean;
	skipped?: boolean;
	/** Written with the answer: the skill's difficulty (logits) and guessing chance the Rasch update used. */
	difficultyBefore?: number;
	guess?: number;
};

type SetRow = typeof practiceSet.$inferSelect;

export type NextItem = {
	phase: 'placement' | 'daily';
	setId: number | null;
	position: number;
	total: number;
	/** The item to answer, or null when the set is done (or nothing can be served). */
	item: ItemForLearner | null;
	entry: Pick<SetEntry, 'kind' | 'reason'> | null;
	message: string | null;
};

const entriesOf = (s: SetRow) => s.entries as SetEntry[];
const PLACEMENT_LENGTH = 12;

async function placementSet(q: Db | Tx, userId: string, forUpdate = false): Promise<SetRow | null> {
	const base = q.select().from(practiceSet).where(and(eq(practiceSet.userId, userId), eq(practiceSet.kind, 'placement')));
	const [s] = forUpdate ? await base.for('update') : await base;
	return s ?? null;
}

async function dailySet(q: Db | Tx, userId: string, day: string, forUpdate = false): Promise<SetRow | null> {
	const base = q.select().from(practiceSet).where(and(eq(practiceSet.userId, userId), eq(practiceSet.kind, 'daily'), eq(practiceSet.day, day)));
	const [s] = forUpdate ? await base.for('update') : await base;
	return s ?? null;
}

async function insertSet(db: Db, row: { userId: string; kind: 'placement' | 'daily'; day: string; entries: SetEntry[]; createdAt: Date }): Promise<void> {
	try {
		await db.insert(practiceSet).values(row);
	} catch (e) {
		// Two tabs composing at once: the unique (learner, kind, day) index keeps the first.
		if (!isDuplicate(e)) throw e;
	}
}

function placementCandidates(items: ItemSummary[], difficulty: Record<string, number>) {
	return items.map((i) => ({ id: i.id, skillId: i.skill, area: i.area, difficulty: difficulty[i.skill] ?? skillPrior(i.skill), guess: i.guess }));
}

/** The skills of the published bank as the daily set sees them. */
export async function skillInfos(db: Db): Promise<SkillInfo[]> {
	const items = await publishedItems(db);
	const difficulty = await skillDifficulties(db);
	const stats = await db.select({ itemId: itemStat.itemId, n: itemStat.n, sumMs: itemStat.sumMs }).from(itemStat);
	const seconds = new Map(stats.filter((s) => s.n > 0).map((s) => [s.itemId, s.sumMs / s.n / 1000]));
	const bySkill = new Map<string, SkillInfo & { variants: { id: string; medianSeconds: number | null }[]; guesses: number[] }>();
	for (const it of items) {
		let k = bySkill.get(it.skill);
		if (!k) bySkill.set(it.skill, (k = { id: it.skill, area: it.area, difficulty: difficulty[it.skill] ?? skillPrior(it.skill), variants: [], guesses: [] }));
		k.variants.push({ id: it.id, medianSeconds: seconds.get(it.id) ?? null });
		k.guesses.push(it.guess);
	}
	return [...bySkill.values()].map(({ guesses, ...k }) => ({ ...k, guess: guesses.reduce((a, b) => a + b, 0) / guesses.length }));
}

/** Builds today's daily set from the learner's cards, abilities and settings, with the population's new-skill offset. */
export async function composeToday(db: Db, learner: Learner, now: Date) {
	const profile = await ensureProfile(db, learner.id);
	const { cards, lastVariant } = await cardsOf(db, learner.id);
	return composeDailySet({
		now,
		timeZone: learner.timeZone,
		skills: await skillInfos(db),
		cards,
		lastVariant,
		abilities: await abilitiesOf(db, learner.id),
		examDate: profile.examDate,
		settings: { maxItems: profile.dailyItems, maxMinutes: profile.dailyMinutes },
		seed: `${learner.id}:${learningDay(now, learner.timeZone)}`,
		successOffset: await populationSuccessOffset(db, now)
	});
}

/** Appends the next placement item (chosen at the current estimate) when the learner has answered all so far. */
async function growPlacement(db: Db, set: SetRow): Promise<void> {
	const entries = entriesOf(set);
	if (set.position < entries.length || entries.length >= PLACEMENT_LENGTH) return;
	const items = await publishedItems(db);
	const candidates = placementCandidates(items, await skillDifficulties(db));
	const byId = new Map(candidates.map((c) => [c.id, c]));
	const responses: PlacementResponse[] = entries
		.filter((e) => e.correct !== undefined && byId.has(e.itemId))
		.map((e) => ({ ...byId.get(e.itemId)!, correct: e.correct! }));
	const choice = nextPlacementItem({ candidates, responses, length: PLACEMENT_LENGTH, seed: set.userId });
	if (!choice) return;
	const entry: SetEntry = { itemId: choice.item.id, skillId: choice.item.skillId, area: choice.item.area, kind: 'placement', predictedSuccess: choice.predictedSuccess, reason: choice.reason };
	// Only the first of two racing requests appends (the length check makes the update conditional).
	await db
		.update(practiceSet)
		.set({ entries: [...entries, entry] })
		.where(and(eq(practiceSet.id, set.id), sql`JSON_LENGTH(${practiceSet.entries}) = ${entries.length}`));
}

/** The learner's set for now: placement until it is done, then today's daily set (composed on first call). */
async function currentSet(db: Db, learner: Learner, now: Date): Promise<{ phase: 'placement' | 'daily'; set: SetRow | null }> {
	const profile = await ensureProfile(db, learner.id);
	const day = learningDay(now, learner.timeZone);
	if (!profile.placementDoneAt) {
		let set = await placementSet(db, learner.id);
		if (!set) {
			await insertSet(db, { userId: learner.id, kind: 'placement', day, entries: [], createdAt: now });
			set = await placementSet(db, learner.id);
		}
		await growPlacement(db, set!);
		return { phase: 'placement', set: await placementSet(db, learner.id) };
	}
	let set = await dailySet(db, learner.id, day);
	if (!set) {
		const composed = await composeToday(db, learner, now);
		const entries: SetEntry[] = composed.items.map((i) => ({ itemId: i.itemId, skillId: i.skillId, area: i.area, kind: i.kind, predictedSuccess: i.predictedSuccess, reason: i.reason }));
		await insertSet(db, { userId: learner.id, kind: 'daily', day, entries, createdAt: now });
		set = await dailySet(db, learner.id, day);
	}
	return { phase: 'daily', set };
}

/** The next item of the learner's current set, or where the set stands when it is done. */
export async function nextItem(db: Db, learner: Learner, now = new Date()): Promise<NextItem> {
	for (let guard = 0; guard < 50; guard++) {
		const { phase, set } = await currentSet(db, learner, now);
		if (!set) return { phase, setId: null, position: 0, total: 0, item: null, entry: null, message: 'Nothing could be prepared for you yet.' };
		const entries = entriesOf(set);
		const total = phase === 'placement' ? PLACEMENT_LENGTH : entries.length;
		if (set.position >= entries.length) {
			const message =
				phase === 'placement'
					? 'There are no published questions to place you with yet. Please come back once the question bank is open.'
					: entries.length === 0
						? 'Nothing is due today and no new skill fits your level yet. Come back tomorrow, or try the bench.'
						: 'Today’s set is done. Your next reviews are scheduled; come back tomorrow.';
			return { phase, setId: set.id, position: set.position, total: phase === 'placement' ? set.position : total, item: null, entry: null, message };
		}
		const entry = entries[set.position];
		const it = await publishedItem(db, entry.itemId);
		if (!it) {
			// The item was retired since the set was composed: pass over it.
			entries[set.position] = { ...entry, skipped: true };
			await db.update(practiceSet).set({ entries, position: set.position + 1 }).where(and(eq(practiceSet.id, set.id), eq(practiceSet.position, set.position)));
			continue;
		}
		return { phase, setId: set.id, position: set.position, total, item: itemForLearner(it), entry: { kind: entry.kind, reason: entry.reason }, message: null };
	}
	throw new LearnError('set_broken', 'Your set could not be read. Please reload the page.', 500);
}

export type AnswerRequest = { setId: number; itemId: string; idempotencyKey: string; answer: unknown; ms: number };

export type AnswerResult = {
	responseId: number;
	replayed: boolean;
	score: number;
	correct: boolean;
	itemId: string;
	itemVersionId: number;
	feedback: { key: unknown; mistake: string | null; marks?: Record<string, boolean>; off_by?: number };
	explanationHtml: string;
	diagram: { state: string | null; fault: string | null; highlight: string[]; readings: Record<string, { volts: number; reads: string }>; notes: string[] };
	circuitText: string;
	question: ItemForLearner['question'];
	answer: unknown;
	givenText: string;
	expectedText: string;
	placementDone: boolean;
};

/** The feedback of a stored response, recomputed from the version it was given for (grading is deterministic). */
export async function resultOf(db: Db | Tx, r: { id: number; itemVersionId: number; answer: unknown; score: number; correct: boolean }, replayed: boolean, placementDone = false): Promise<AnswerResult> {
	const it = await itemAtVersion(db, r.itemVersionId);
	if (!it) throw new LearnError('item_gone', 'The question of this answer no longer exists.', 404);
	const g = gradeResponse(it, r.answer);
	return {
		responseId: r.id,
		replayed,
		score: r.score,
		correct: r.correct,
		itemId: it.id,
		itemVersionId: it.versionId,
		feedback: g.feedback,
		explanationHtml: it.explanationHtml,
		diagram: it.feedback,
		circuitText: it.circuitText,
		question: it.question,
		answer: r.answer,
		givenText: formatAnswer(it.question, r.answer),
		expectedText: formatKey(it),
		placementDone
	};
}

/** After the last placement answer: starting abilities per area from all placement answers. */
async function finishPlacement(tx: Tx, learner: Learner, entries: SetEntry[], now: Date): Promise<void> {
	const items = new Map((await publishedItems(tx)).map((i) => [i.id, i]));
	const difficulty = await skillDifficulties(tx);
	const responses: PlacementResponse[] = entries
		.filter((e) => e.correct !== undefined)
		.map((e) => ({ id: e.itemId, skillId: e.skillId, area: e.area, difficulty: difficulty[e.skillId] ?? skillPrior(e.skillId), guess: items.get(e.itemId)?.guess ?? 0, correct: e.correct! }));
	const { areas } = placementAbilities(responses, AREAS.map((a) => a.id));
	const day = learningDay(now, learner.timeZone);
	for (const [area, est] of Object.entries(areas)) {
		await tx.insert(areaAbility).values({ userId: learner.id, area, theta: est.value, n: est.count, updatedAt: now }).onDuplicateKeyUpdate({ set: { theta: est.value, n: est.count, updatedAt: now } });
		await tx.insert(abilitySnapshot).values({ userId: learner.id, area, day, theta: est.value }).onDuplicateKeyUpdate({ set: { theta: est.value } });
	}
	await tx.update(learnerProfile).set({ placementDoneAt: now, updatedAt: now }).where(eq(learnerProfile.userId, learner.id));
}

/**
 * Grades and records an answer to the current item of a set. The same idempotency key again returns the
 * first result and writes nothing. An answer to an item that is not the set's current one is refused.
 */
export async function answerInSet(db: Db, learner: Learner, req: AnswerRequest, now = new Date(), afterWrites?: () => Promise<void>): Promise<AnswerResult> {
	const earlier = await findByKey(db, learner.id, req.idempotencyKey);
	if (earlier) return resultOf(db, earlier, true);
	const profile = await ensureProfile(db, learner.id);
	try {
		return await db.transaction(async (tx) => {
			const [set] = await tx.select().from(practiceSet).where(and(eq(practiceSet.id, req.setId), eq(practiceSet.userId, learner.id))).for('update');
			if (!set) throw new LearnError('no_set', 'This set is not yours or no longer exists. Reload the page to get your current set.', 404, { setId: 'unknown set' });
			// A twin request that held the lock first has recorded this answer: return its result.
			const twin = await findByKey(tx, learner.id, req.idempotencyKey);
			if (twin) return resultOf(tx, twin, true);
			const entries = entriesOf(set);
			const entry = entries[set.position];
			if (!entry || entry.itemId !== req.itemId)
				throw new LearnError('not_current', 'This is not the question your set is on now. Reload the page to carry on where you stopped.', 409, { itemId: 'not the current item' });
			const it = await publishedItem(tx, req.itemId);
			if (!it) throw new LearnError('item_gone', 'This question has just been withdrawn. Reload the page for the next one.', 409);
			const rec = await recordAnswer(tx, {
				userId: learner.id,
				timeZone: learner.timeZone,
				examDate: profile.examDate,
				item: it,
				answer: req.answer,
				ms: req.ms,
				idempotencyKey: req.idempotencyKey,
				context: set.kind,
				contextId: set.id,
				now
			});
			entries[set.position] = { ...entry, correct: rec.correct, difficultyBefore: rec.difficultyBefore, guess: rec.guess };
			const position = set.position + 1;
			const done = set.kind === 'placement' ? position >= PLACEMENT_LENGTH : position >= entries.length;
			await tx.update(practiceSet).set({ entries, position, finishedAt: done ? now : null }).where(eq(practiceSet.id, set.id));
			const placementDone = set.kind === 'placement' && done;
			if (placementDone) await finishPlacement(tx, learner, entries, now);
			if (afterWrites) await afterWrites();
			return { ...(await resultOf(tx, { id: rec.responseId, itemVersionId: it.versionId, answer: req.answer, score: rec.score, correct: rec.correct }, false)), placementDone };
		});
	} catch (e) {
		if (isDuplicate(e)) {
			const first = await findByKey(db, learner.id, req.idempotencyKey);
			if (first) return resultOf(db, first, true);
		}
		throw e;
	}
}

/** A practice item of one skill (from the progress page's weakest skills): a variant other than the last one seen. */
export async function practiceItem(db: Db, learner: Learner, skill: string): Promise<NextItem> {
	const all = (await publishedItems(db)).filter((i) => i.skill === skill);
	if (all.length === 0) throw new LearnError('unknown_skill', `There are no published questions for the skill "${skill}". Pick a skill from your progress page.`, 404, { skill: 'unknown skill' });
	const { lastVariant } = await cardsOf(db, learner.id);
	const fresh = all.filter((i) => i.id !== lastVariant[skill]);
	const pick = (fresh.length ? fresh : all)[Math.floor(Math.random() * (fresh.length || all.length))];
	const it = await publishedItem(db, pick.id);
	if (!it) throw new LearnError('item_gone', 'This question has just been withdrawn. Reload the page for another one.', 409);
	return { phase: 'daily', setId: null, position: 0, total: 0, item: itemForLearner(it), entry: { kind: 'review', reason: `extra practice of ${skill}` }, message: null };
}

/** Grades and records a practice answer (outside any set). Idempotent by key like every answer. */
export async function answerPractice(db: Db, learner: Learner, req: Omit<AnswerRequest, 'setId'>, now = new Date()): Promise<AnswerResult> {
	const earlier = await findByKey(db, learner.id, req.idempotencyKey);
	if (earlier) return resultOf(db, earlier, true);
	const profile = await ensureProfile(db, learner.id);
	const it = await publishedItem(db, req.itemId);
	if (!it) throw new LearnError('item_gone', 'This question is not published. Reload the page for another one.', 404, { itemId: 'not a published item' });
	try {
		return await db.transaction(async (tx) => {
			const rec = await recordAnswer(tx, { userId: learner.id, timeZone: learner.timeZone, examDate: profile.examDate, item: it, answer: req.answer, ms: req.ms, idempotencyKey: req.idempotencyKey, context: 'practice', contextId: null, now });
			return resultOf(tx, { id: rec.responseId, itemVersionId: it.versionId, answer: req.answer, score: rec.score, correct: rec.correct }, false);
		});
	} catch (e) {
		if (isDuplicate(e)) {
			const first = await findByKey(db, learner.id, req.idempotencyKey);
			if (first) return resultOf(db, first, true);
		}
		throw e;
	}
}
