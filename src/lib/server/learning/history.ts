/** The learner's answer history: every answer with its item, the given and expected answers, and the time. */
import { desc, eq } from 'drizzle-orm';
import { formatAnswer, formatKey } from './answer-text';
import type { Db } from '../db/client';
import { response } from '../db/schema';
import { itemsAtVersions } from './catalog';

export type HistoryRow = {
	id: number;
	itemId: string;
	/** The question's opening words, as plain text (at most about 140 characters). */
	question: string;
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

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'", nbsp: ' ' };

/** A stem's text without markup, cut at a word near `max` characters with an ellipsis. */
export function stemExcerpt(html: string, max = 140): string {
	const text = html
		.replace(/<[^>]*>/g, ' ')
		.replace(/&(amp|lt|gt|quot|#39|nbsp);/g, (_, e: string) => ENTITIES[e])
		.replace(/\s+/g, ' ')
		.trim();
	if (text.length <= max) return text;
	const cut = text.slice(0, max);
	const space = cut.lastIndexOf(' ');
	return `${(space > max * 0.6 ? cut.slice(0, space) : cut).replace(/[\s,;:]+$/, '')}…`;
}

export async function answerHistory(db: Db, userId: string, limit = 200): Promise<HistoryRow[]> {
	const rows = await db.select().from(response).where(eq(response.userId, userId)).orderBy(desc(response.id)).limit(limit);
	const items = await itemsAtVersions(db, [...new Set(rows.map((r) => r.itemVersionId))]);
	return rows.map((r) => {
		const it = items.get(r.itemVersionId);
		return {
			id: r.id,
			itemId: r.itemId,
			question: it ? stemExcerpt(it.stemHtml) : '',
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
