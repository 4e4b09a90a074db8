/**
 * Review of the item bank: the queue, an item's review (keys recomputed on the server, a diff against
 * the previous version, statistics from responses), and the decisions. Only reviewers publish or retire.
 */
import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import { diffLines } from 'diff';
import { getDb, type Db } from '../db/client';
import { item, itemFamily, itemVersion, response, review, user } from '../db/schema';
import { publishVersions } from './bank-store';
import { previewMarkdown } from './authoring';
import { stableJson } from '../../items/hash';

export type Actor = { id: string; roles: readonly string[] };

/** A decision the actor's roles do not allow, or on something in the wrong state; the message says what to do. */
export class ReviewError extends Error {
	constructor(
		message: string,
		readonly code: 'forbidden' | 'not_found' | 'wrong_state' | 'key_mismatch'
	) {
		super(message);
	}
}

function requireReviewer(actor: Actor): void {
	if (!actor.roles.includes('reviewer')) throw new ReviewError('Only reviewers publish, send back or retire items.', 'forbidden');
}

/** Statistics need at least this many responses. */
export const MIN_RESPONSES_FOR_STATS = 30;

export type ItemStats = { n: number; pCorrect: number; discrimination: number | null; medianMs: number };

/**
 * Proportion correct, point-biserial discrimination of `correct` against `abilityBefore`, and median
 * time. r_pb = (M1 − M0) / s · √(p·q), with s the population standard deviation of ability; it equals
 * Pearson's r between the 0/1 score and ability. Null when every answer is right, or every one wrong,
 * or the abilities do not vary.
 */
export function itemStatistics(rows: readonly { correct: boolean; abilityBefore: number; ms: number }[]): ItemStats | null {
	const n = rows.length;
	if (n === 0) return null;
	const right = rows.filter((r) => r.correct);
	const p = right.length / n;
	const mean = rows.reduce((s, r) => s + r.abilityBefore, 0) / n;
	const sd = Math.sqrt(rows.reduce((s, r) => s + (r.abilityBefore - mean) ** 2, 0) / n);
	let discrimination: number | null = null;
	if (p > 0 && p < 1 && sd > 0) {
		const m1 = right.reduce((s, r) => s + r.abilityBefore, 0) / right.length;
		const wrong = rows.filter((r) => !r.correct);
		const m0 = wrong.reduce((s, r) => s + r.abilityBefore, 0) / wrong.length;
		discrimination = ((m1 - m0) / sd) * Math.sqrt(p * (1 - p));
	}
	const times = rows.map((r) => r.ms).sort((a, b) => a - b);
	const mid = Math.floor(n / 2);
	const medianMs = n % 2 ? times[mid] : (times[mid - 1] + times[mid]) / 2;
	return { n, pCorrect: p, discrimination, medianMs };
}

/** Statistics of each item with at least MIN_RESPONSES_FOR_STATS responses. */
export async function statsFor(itemIds: string[], db: Db = getDb()): Promise<Map<string, ItemStats>> {
	const out = new Map<string, ItemStats>();
	if (!itemIds.length) return out;
	const counts = await db
		.select({ itemId: response.itemId, n: sql<number>`count(*)` })
		.from(response)
		.where(inArray(response.itemId, itemIds))
		.groupBy(response.itemId);
	const enough = counts.filter((c) => Number(c.n) >= MIN_RESPONSES_FOR_STATS).map((c) => c.itemId);
	if (!enough.length) return out;
	const rows = await db
		.select({ itemId: response.itemId, correct: response.correct, abilityBefore: response.abilityBefore, ms: response.ms })
		.from(response)
		.where(inArray(response.itemId, enough));
	const by = new Map<string, typeof rows>();
	for (const r of rows) by.set(r.itemId, [...(by.get(r.itemId) ?? []), r]);
	for (const [id, rs] of by) {
		const s = itemStatistics(rs);
		if (s) out.set(id, s);
	}
	return out;
}

export type QueueItem = {
	id: string;
	area: string;
	kind: string;
	versionId: number;
	submittedAt: Date;
	authorName: string | null;
	replacesPublished: boolean;
	stats: ItemStats | null;
};
export type QueueFamily = { id: string; title: string; items: number; updatedAt: Date; previouslyApproved: boolean };

/** Items whose newest version waits for review (outside families), and families in review. */
export async function reviewQueue(db: Db = getDb()): Promise<{ items: QueueItem[]; families: QueueFamily[]; flagged: QueueItem[] }> {
	const rows = await db
		.select({
			id: item.id,
			area: item.area,
			kind: item.kind,
			versionId: itemVersion.id,
			submittedAt: itemVersion.createdAt,
			authorName: user.name,
			publishedVersionId: item.publishedVersionId
		})
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.leftJoin(user, eq(user.id, item.authorId))
		.where(and(eq(itemVersion.status, 'in_review'), isNull(item.familyId)))
		.orderBy(asc(itemVersion.createdAt))
		.limit(500);
	const stats = await statsFor(rows.map((r) => r.id), db);
	const items = rows.map((r) => ({
		id: r.id,
		area: r.area,
		kind: r.kind,
		versionId: r.versionId,
		submittedAt: r.submittedAt,
		authorName: r.authorName,
		replacesPublished: r.publishedVersionId !== null,
		stats: stats.get(r.id) ?? null
	}));
	const fams = await db
		.select({ id: itemFamily.id, title: itemFamily.title, updatedAt: itemFamily.updatedAt, approvedHash: itemFamily.approvedHash, items: sql<number>`count(${item.id})` })
		.from(itemFamily)
		.leftJoin(item, eq(item.familyId, itemFamily.id))
		.where(eq(itemFamily.status, 'in_review'))
		.groupBy(itemFamily.id)
		.orderBy(asc(itemFamily.id));
	// Published items with negative discrimination are flagged for a second look.
	const published = await db
		.select({ id: item.id, area: item.area, kind: item.kind, versionId: item.publishedVersionId, submittedAt: item.updatedAt, authorName: user.name })
		.from(item)
		.leftJoin(user, eq(user.id, item.authorId))
		.where(and(eq(item.status, 'published'), sql`${item.id} IN (SELECT item_id FROM response GROUP BY item_id HAVING count(*) >= ${MIN_RESPONSES_FOR_STATS})`))
		.limit(2000);
	const pstats = await statsFor(published.map((p) => p.id), db);
	const flagged = published
		.map((p) => ({ ...p, versionId: p.versionId ?? 0, replacesPublished: true, stats: pstats.get(p.id) ?? null }))
		.filter((p) => p.stats?.discrimination !== null && p.stats?.discrimination !== undefined && p.stats.discrimination < 0);
	for (const it of items) if (it.stats?.discrimination !== null && it.stats && it.stats.discrimination! < 0 && !flagged.some((f) => f.id === it.id)) flagged.push(it);
	return {
		items,
		families: fams.map((f) => ({ id: f.id, title: f.title, items: Number(f.items), updatedAt: f.updatedAt, previouslyApproved: f.approvedHash !== null })),
		flagged
	};
}

type VersionRow = typeof itemVersion.$inferSelect;

export type KeyCheck = { ok: boolean; recomputed: boolean; message: string; stored: unknown; computed: unknown | null };

/** Recomputes the key of a version from its markdown source and compares it with the stored key. */
export function checkKey(v: VersionRow, itemId: string): KeyCheck {
	if (!v.source) {
		return { ok: true, recomputed: false, message: 'Generated item: its key is recomputed when its family is built (npm run content:build).', stored: v.key, computed: null };
	}
	const p = previewMarkdown(v.source, itemId);
	if (!p.item) return { ok: false, recomputed: true, message: `The source no longer builds: ${p.errors.map((e) => `line ${e.line}: ${e.message}`).join('; ')}`, stored: v.key, computed: null };
	const same = stableJson(p.item.key) === stableJson(v.key) && stableJson(p.item.distractors) === stableJson(v.distractors);
	return {
		ok: same,
		recomputed: true,
		message: same ? 'The engine gives the same key and distractors as stored.' : 'The engine now gives a different key or distractors than stored. Send it back, or have the author save it again.',
		stored: v.key,
		computed: p.item.key
	};
}

function versionText(v: VersionRow): string {
	if (v.source) return v.source;
	return [`circuit: ${v.circuitRef}`, v.circuitText, `stem: ${v.stemHtml}`, `key: ${stableJson(v.key)}`, `distractors: ${stableJson(v.distractors)}`].join('\n');
}

export type DiffPart = { kind: 'same' | 'added' | 'removed'; text: string };

export type ItemReview = {
	item: typeof item.$inferSelect;
	version: VersionRow;
	previous: VersionRow | null;
	diff: DiffPart[] | null;
	key: KeyCheck;
	stats: ItemStats | null;
	history: { decision: string; comment: string | null; at: Date; by: string | null }[];
};

/** Everything a reviewer needs to decide on an item's newest version; null when there is no such item. */
export async function loadItemReview(itemId: string, db: Db = getDb()): Promise<ItemReview | null> {
	const [it] = await db.select().from(item).where(eq(item.id, itemId));
	if (!it || !it.latestVersionId) return null;
	const versions = await db.select().from(itemVersion).where(eq(itemVersion.itemId, itemId)).orderBy(desc(itemVersion.id)).limit(20);
	const version = versions.find((v) => v.id === it.latestVersionId)!;
	const previous =
		(it.publishedVersionId && it.publishedVersionId !== version.id ? versions.find((v) => v.id === it.publishedVersionId) : undefined) ??
		versions.find((v) => v.id < version.id) ??
		null;
	const diff = previous
		? diffLines(versionText(previous), versionText(version)).map((d) => ({ kind: d.added ? ('added' as const) : d.removed ? ('removed' as const) : ('same' as const), text: d.value }))
		: null;
	const stats = (await statsFor([itemId], db)).get(itemId) ?? null;
	const history = await db
		.select({ decision: review.decision, comment: review.comment, at: review.createdAt, by: user.name })
		.from(review)
		.innerJoin(itemVersion, eq(itemVersion.id, review.itemVersionId))
		.leftJoin(user, eq(user.id, review.reviewerId))
		.where(eq(itemVersion.itemId, itemId))
		.orderBy(desc(review.id))
		.limit(30);
	return { item: it, version, previous, diff, key: checkKey(version, itemId), stats, history };
}

async function latestVersion(db: Db, itemId: string) {
	const [row] = await db
		.select({ item: item, version: itemVersion })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.where(eq(item.id, itemId));
	if (!row) throw new ReviewError(`There is no item "${itemId}". Go back to the review queue.`, 'not_found');
	return row;
}

/**
 * Publishes the item's newest version. The key is recomputed first; a mismatch refuses the approval.
 * Approving a version that is already published changes nothing.
 */
export async function approveItem(actor: Actor, itemId: string, comment: string | null = null, db: Db = getDb()): Promise<void> {
	requireReviewer(actor);
	const { item: it, version } = await latestVersion(db, itemId);
	if (version.status === 'published') return;
	if (version.status !== 'in_review') throw new ReviewError(`This version is ${version.status.replace('_', ' ')}, not in review; only an item in review can be approved.`, 'wrong_state');
	if (it.familyId) throw new ReviewError(`This item belongs to the family "${it.familyId}": approve the family as a whole.`, 'wrong_state');
	const check = checkKey(version, itemId);
	if (!check.ok) throw new ReviewError(check.message, 'key_mismatch');
	await db.transaction(async (tx) => {
		await publishVersions(tx, [version.id]);
		await tx.insert(review).values({ itemVersionId: version.id, reviewerId: actor.id, decision: 'approve', comment });
	});
}

/** Sends the newest version back to its author with a comment. Repeating it changes nothing. */
export async function requestChanges(actor: Actor, itemId: string, comment: string, db: Db = getDb()): Promise<void> {
	requireReviewer(actor);
	if (!comment.trim()) throw new ReviewError('Say what should change: the comment is empty.', 'wrong_state');
	const { item: it, version } = await latestVersion(db, itemId);
	if (version.status === 'changes_requested') return;
	if (version.status !== 'in_review') throw new ReviewError(`This version is ${version.status.replace('_', ' ')}, not in review; only an item in review can be sent back.`, 'wrong_state');
	await db.transaction(async (tx) => {
		await tx.update(itemVersion).set({ status: 'changes_requested' }).where(eq(itemVersion.id, version.id));
		if (!it.publishedVersionId) await tx.update(item).set({ status: 'changes_requested', updatedAt: new Date() }).where(eq(item.id, itemId));
		await tx.insert(review).values({ itemVersionId: version.id, reviewerId: actor.id, decision: 'request_changes', comment });
	});
}

/** Retires an item: learners are no longer served it. Retiring a retired item changes nothing. */
export async function retireItem(actor: Actor, itemId: string, comment: string | null = null, db: Db = getDb()): Promise<void> {
	requireReviewer(actor);
	const { item: it, version } = await latestVersion(db, itemId);
	if (it.status === 'retired') return;
	await db.transaction(async (tx) => {
		await tx.update(item).set({ status: 'retired', updatedAt: new Date() }).where(eq(item.id, itemId));
		await tx.insert(review).values({ itemVersionId: version.id, reviewerId: actor.id, decision: 'retire', comment });
	});
}

export type FamilyReview = {
	family: typeof itemFamily.$inferSelect;
	items: number;
	waiting: number;
	sample: { id: string; kind: string; stemHtml: string; key: unknown; question: unknown; circuitText: string }[];
};

/** A family with a sample of its variants (one item per kind, then the first few). */
export async function loadFamilyReview(familyId: string, db: Db = getDb()): Promise<FamilyReview | null> {
	const [family] = await db.select().from(itemFamily).where(eq(itemFamily.id, familyId));
	if (!family) return null;
	const rows = await db
		.select({ id: item.id, kind: item.kind, stemHtml: itemVersion.stemHtml, key: itemVersion.key, question: itemVersion.question, circuitText: itemVersion.circuitText, status: itemVersion.status })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.where(eq(item.familyId, familyId))
		.orderBy(asc(item.id));
	const sample: FamilyReview['sample'] = [];
	const kinds = new Set<string>();
	for (const r of rows) if (!kinds.has(r.kind) && sample.length < 8) (kinds.add(r.kind), sample.push(r));
	return { family, items: rows.length, waiting: rows.filter((r) => r.status === 'in_review').length, sample };
}

/** Approves a family as a whole: it and every item of it waiting for review are published. */
export async function approveFamily(actor: Actor, familyId: string, db: Db = getDb()): Promise<{ published: number }> {
	requireReviewer(actor);
	const [family] = await db.select().from(itemFamily).where(eq(itemFamily.id, familyId));
	if (!family) throw new ReviewError(`There is no family "${familyId}". Go back to the review queue.`, 'not_found');
	if (family.status === 'approved' && family.approvedHash === family.sourceHash) return { published: 0 };
	if (family.status === 'retired') throw new ReviewError('This family is retired; it cannot be approved.', 'wrong_state');
	const waiting = await db
		.select({ id: itemVersion.id })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.where(and(eq(item.familyId, familyId), eq(itemVersion.status, 'in_review')));
	await db.transaction(async (tx) => {
		await publishVersions(tx, waiting.map((w) => w.id));
		await tx
			.update(itemFamily)
			.set({ status: 'approved', approvedHash: family.sourceHash, approvedBy: actor.id, approvedAt: new Date(), updatedAt: new Date() })
			.where(eq(itemFamily.id, familyId));
		await tx.insert(review).values({ familyId, reviewerId: actor.id, decision: 'approve' });
	});
	return { published: waiting.length };
}
