/**
 * The published item bank as the learner's side reads it: `item.status = 'published'` joined to the
 * version learners are served (`item.published_version_id`). Light rows for choosing items; the full
 * built item (with its key) only when grading or showing feedback, and never sent whole to a client.
 */
import { and, eq, inArray } from 'drizzle-orm';
import type { BuiltItem, FeedbackData, QuestionPayload } from '$lib/items/types';
import { findSkill } from '$lib/items/blueprint';
import type { Q as Db } from './q';
import { item, itemVersion } from '../db/schema';

export type ItemSummary = { id: string; versionId: number; skill: string; area: string; kind: string; difficulty: number; guess: number };

/** Chance of guessing a choice item right (1 / options); 0 for kinds that cannot be guessed. */
export function guessOf(question: QuestionPayload): number {
	if (question.kind === 'choose-one') return question.options.length > 0 ? 1 / question.options.length : 0;
	return 0;
}

/** The prior difficulty of a skill from the blueprint (logits), 0 for a skill it does not list. */
export function skillPrior(skill: string): number {
	return findSkill(skill)?.difficulty ?? 0;
}

/** Every published item, light columns only. */
export async function publishedItems(db: Db): Promise<ItemSummary[]> {
	const rows = await db
		.select({ id: item.id, versionId: itemVersion.id, skill: item.skill, area: item.area, kind: item.kind, difficulty: itemVersion.difficulty, question: itemVersion.question })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId))
		.where(eq(item.status, 'published'));
	return rows.map((r) => ({ id: r.id, versionId: r.versionId, skill: r.skill, area: r.area, kind: r.kind, difficulty: r.difficulty, guess: guessOf(r.question as QuestionPayload) }));
}

export type ServedItem = BuiltItem & { versionId: number };

const fullColumns = {
	id: item.id,
	versionId: itemVersion.id,
	version: itemVersion.version,
	contentHash: itemVersion.contentHash,
	keyHash: itemVersion.keyHash,
	area: item.area,
	skill: item.skill,
	kind: item.kind,
	family: item.familyId,
	difficulty: itemVersion.difficulty,
	circuitText: itemVersion.circuitText,
	circuitRef: itemVersion.circuitRef,
	stemHtml: itemVersion.stemHtml,
	explanationHtml: itemVersion.explanationHtml,
	ask: itemVersion.ask,
	question: itemVersion.question,
	key: itemVersion.key,
	distractors: itemVersion.distractors,
	cautions: itemVersion.cautions,
	feedback: itemVersion.feedback,
	tags: itemVersion.tags
};

type FullRow = { [K in keyof typeof fullColumns]: unknown };

function toServed(r: FullRow): ServedItem {
	return { ...(r as unknown as BuiltItem), origin: String(r.circuitRef), versionId: r.versionId as number };
}

/** The published version of one item, or null when it is not published. */
export async function publishedItem(db: Db, id: string): Promise<ServedItem | null> {
	const [r] = await db
		.select(fullColumns)
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId))
		.where(and(eq(item.id, id), eq(item.status, 'published')));
	return r ? toServed(r) : null;
}

/** A given version of an item (published or since replaced): grading and feedback stay tied to what was asked. */
export async function itemAtVersion(db: Db, versionId: number): Promise<ServedItem | null> {
	const [r] = await db.select(fullColumns).from(itemVersion).innerJoin(item, eq(item.id, itemVersion.itemId)).where(eq(itemVersion.id, versionId));
	return r ? toServed(r) : null;
}

export async function itemsAtVersions(db: Db, versionIds: number[]): Promise<Map<number, ServedItem>> {
	if (versionIds.length === 0) return new Map();
	const rows = await db.select(fullColumns).from(itemVersion).innerJoin(item, eq(item.id, itemVersion.itemId)).where(inArray(itemVersion.id, versionIds));
	return new Map(rows.map((r) => [r.versionId as number, toServed(r)]));
}

/** What a client may see of an item before it answers: never the key, the ask, distractors or feedback. */
export type ItemForLearner = {
	id: string;
	area: string;
	skill: string;
	kind: string;
	stemHtml: string;
	question: QuestionPayload;
	circuitText: string;
	cautions: { id: string; text: string }[];
};

export function itemForLearner(it: BuiltItem): ItemForLearner {
	return { id: it.id, area: it.area, skill: it.skill, kind: it.kind, stemHtml: it.stemHtml, question: it.question, circuitText: it.circuitText, cautions: it.cautions };
}

/** What the feedback screen gets after an answer. */
export type FeedbackForLearner = { explanationHtml: string; feedback: FeedbackData; key: unknown };
