/** The learner's answer history: every answer with its item, the given and expected answers, and the time. */
import { desc, eq } from 'drizzle-orm';
import { formatAnswer, formatKey } from './answer-text';
import type { Db } from '../db/client';
import { response } from '../db/schema';
import { itemsAtVersions } from './catalog';

export type HistoryRow = {
	id: number;
	itemId: string;
	area: string;
	skill: string;
	context: string;
	given: string;
	expected: string;
	score: number;
	correct: boolean;
	seconds: number;
	at: string;
};

export async function answerHistory(db: Db, userId: string, limit = 200): Promise<HistoryRow[]> {
	const rows = await db.select().from(response).where(eq(response.userId, userId)).orderBy(desc(response.id)).limit(limit);
	const items = await itemsAtVersions(db, [...new Set(rows.map((r) => r.itemVersionId))]);
	return rows.map((r) => {
		const it = items.get(r.itemVersionId);
		return {
			id: r.id,
			itemId: r.itemId,
			area: it?.area ?? '',
			skill: it?.skill ?? '',
			context: r.context,
			given: it ? formatAnswer(it.question, r.answer) : JSON.stringify(r.answer),
			expected: it ? formatKey(it) : '',
			score: r.score,
			correct: r.correct,
			seconds: Math.round(r.ms / 100) / 10,
			at: r.createdAt.toISOString()
		};
	});
}
