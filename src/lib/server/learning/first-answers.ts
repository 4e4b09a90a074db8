/**
 * The new-skill success offset from the population's first answers on skills (calibrateSuccessOffset).
 *
 * A first answer is an answer to a daily-set entry of kind `new`. What the Rasch update used is kept in
 * two places: the area ability before the answer in `response.ability_before`, and the skill's difficulty
 * and guessing chance before the answer in the set entry (`difficultyBefore`, `guess`, written when the
 * entry is answered). Answers given before the entry kept those two fields carry no difficulty from that
 * moment and are left out rather than guessed from today's difficulty.
 */
import { sql } from 'drizzle-orm';
import { calibrateSuccessOffset, type FirstAnswer } from '$lib/learning';
import type { Q } from './q';

/** How many of the latest first answers calibrate the offset (the window calibrateSuccessOffset documents). */
export const OFFSET_WINDOW = 300;
/** How long one process reuses a computed offset. */
export const OFFSET_CACHE_MS = 5 * 60_000;

type Row = { correct: number | boolean; ability: number; dg: string | { d: number; g: number | null } };

/**
 * All learners' latest first answers recorded at or before `asOf` (oldest first), at most `limit`.
 * One query: the responses to daily sets read backwards along the primary key (no sort), each joined
 * to its set by primary key, the set's entry for the same item read with JSON_TABLE; the scan stops
 * at `limit` rows.
 */
export async function firstAnswers(q: Q, asOf: Date = new Date(), limit = OFFSET_WINDOW): Promise<FirstAnswer[]> {
	const [rows] = (await q.execute(sql`
		SELECT r.correct AS correct, r.ability_before AS ability,
			(SELECT JSON_OBJECT('d', e.difficulty, 'g', e.guess)
				FROM JSON_TABLE(s.entries, '$[*]' COLUMNS (
					item_id VARCHAR(160) PATH '$.itemId',
					kind VARCHAR(16) PATH '$.kind',
					difficulty DOUBLE PATH '$.difficultyBefore',
					guess DOUBLE PATH '$.guess'
				)) e
				WHERE e.item_id = r.item_id AND e.kind = 'new' AND e.difficulty IS NOT NULL) AS dg
		FROM response r FORCE INDEX (PRIMARY)
		JOIN practice_set s ON s.id = r.context_id
		WHERE r.context = 'daily' AND r.created_at <= ${asOf}
			AND JSON_CONTAINS(s.entries, JSON_OBJECT('itemId', r.item_id, 'kind', 'new'))
		HAVING dg IS NOT NULL
		ORDER BY r.id DESC
		LIMIT ${limit}`)) as unknown as [Row[]];
	return rows.reverse().map((r) => {
		const dg = typeof r.dg === 'string' ? (JSON.parse(r.dg) as { d: number; g: number | null }) : r.dg;
		return { ability: Number(r.ability), difficulty: Number(dg.d), guess: Number(dg.g ?? 0), correct: Boolean(Number(r.correct)) };
	});
}

/** The offset (logits) the population's first answers give as of `asOf`; 0 with fewer than 20 of them. */
export async function successOffsetAt(q: Q, asOf: Date = new Date()): Promise<number> {
	return calibrateSuccessOffset(await firstAnswers(q, asOf), { window: OFFSET_WINDOW });
}

let cached: { at: number; value: number } | null = null;

/**
 * successOffsetAt, reused for OFFSET_CACHE_MS within one process: a few minutes of new first answers
 * barely move an estimate over 300 of them, and composing a set should not scan the history each time.
 */
export async function populationSuccessOffset(q: Q, now: Date = new Date()): Promise<number> {
	const t = now.getTime();
	if (cached && t >= cached.at && t - cached.at < OFFSET_CACHE_MS) return cached.value;
	const value = await successOffsetAt(q, now);
	cached = { at: t, value };
	return value;
}
