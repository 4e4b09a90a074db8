/**
 * Writes a built item bank (`buildBank` in src/lib/items/bank.ts) to MariaDB in one idempotent pass.
 *
 * Versioning rules (see .tmp/bank-guide.md):
 * - An item is a stable id; each new `version` hash (content hash + key hash) is a new item_version row,
 *   so answers stay linked to the version they were given for. An unchanged item writes nothing.
 * - A new version starts `in_review`. The item's own status stays `published` while an older published
 *   version exists: learners keep being served that one until a reviewer approves the new one.
 * - Generator families: one item_family row per family, whose hash covers the versions of all its items.
 *   A new or changed hash puts the family (back) in review; approving the family publishes its items.
 */
import { and, eq, inArray, notInArray, sql } from 'drizzle-orm';
import { getDb, type Db } from '../db/client';
import { item, itemFamily, itemVersion } from '../db/schema';
import { hashText } from '../../items/hash';
import type { BuiltItem } from '../../items/types';

/** Rows per multi-row insert and per transaction. */
const BATCH = 400;

export type StoreProgress = { done: number; total: number };

export type StoreOptions = {
	db?: Db;
	onProgress?: (p: StoreProgress) => void;
	/** Family titles by id (default: the family id). */
	familyTitles?: Record<string, string>;
	/** Markdown sources by origin path, stored with hand-written items so reviewers can recompute them. */
	sources?: Record<string, string>;
	/**
	 * Families this build made in full (the shipped build passes every family id). Their stored items that
	 * the build no longer makes (fewer variants, a changed generator, a family taken out of the list) are
	 * retired: learners are no longer served them, and their answers stay linked to their versions.
	 * Leave it out when storing part of a bank.
	 */
	completeFamilies?: readonly string[];
};

export type StoreReport = {
	/** Items seen for the first time. */
	newItems: number;
	/** New versions of items already stored (changed content or changed key). */
	newVersions: number;
	/** Of those, versions whose content is the same but whose key changed (the engine changed). */
	keyChanges: number;
	unchanged: number;
	newFamilies: number;
	/** Families whose hash changed: back in review. */
	familiesBackToReview: number;
	/** Items of a complete family (`completeFamilies`) that the build no longer makes, retired by this run. */
	retired: number;
};

/** The hash of a family: every version hash of its items, in id order. */
export function familyHash(items: readonly BuiltItem[]): string {
	const parts = items.map((it) => `${it.id}:${it.version}`).sort();
	return hashText(parts.join('\n'));
}

type Existing = { id: string; status: string; publishedVersionId: number | null; version: string | null; contentHash: string | null };

/** The item_version row of a built item: everything the build computed, with the given status. */
export function versionRow(it: BuiltItem, source: string | null, status: 'draft' | 'in_review' = 'in_review') {
	return {
		itemId: it.id,
		version: it.version,
		contentHash: it.contentHash,
		keyHash: it.keyHash,
		source,
		circuitText: it.circuitText,
		circuitRef: it.circuitRef,
		stemHtml: it.stemHtml,
		explanationHtml: it.explanationHtml,
		ask: it.ask,
		question: it.question,
		key: it.key,
		distractors: it.distractors,
		cautions: it.cautions,
		feedback: it.feedback,
		tags: it.tags,
		difficulty: it.difficulty,
		status
	};
}

/**
 * Stores the built items and their families. Idempotent: a second run with the same items writes
 * nothing. Items are written in batches of multi-row inserts, each batch in one transaction.
 */
export async function storeBank(items: readonly BuiltItem[], options: StoreOptions = {}): Promise<StoreReport> {
	const db = options.db ?? getDb();
	const report: StoreReport = { newItems: 0, newVersions: 0, keyChanges: 0, unchanged: 0, newFamilies: 0, familiesBackToReview: 0, retired: 0 };
	const total = items.length;
	options.onProgress?.({ done: 0, total });

	// Families first: items reference them.
	const byFamily = new Map<string, BuiltItem[]>();
	for (const it of items) if (it.family) byFamily.set(it.family, [...(byFamily.get(it.family) ?? []), it]);
	if (byFamily.size) {
		const ids = [...byFamily.keys()];
		const found = await db.select({ id: itemFamily.id, sourceHash: itemFamily.sourceHash }).from(itemFamily).where(inArray(itemFamily.id, ids));
		const known = new Map(found.map((f) => [f.id, f.sourceHash]));
		await db.transaction(async (tx) => {
			for (const [id, members] of byFamily) {
				const h = familyHash(members);
				const title = options.familyTitles?.[id] ?? id;
				if (!known.has(id)) {
					await tx.insert(itemFamily).values({ id, title, sourceHash: h, status: 'in_review' });
					report.newFamilies++;
				} else if (known.get(id) !== h) {
					await tx.update(itemFamily).set({ sourceHash: h, status: 'in_review', updatedAt: new Date() }).where(eq(itemFamily.id, id));
					report.familiesBackToReview++;
				}
			}
		});
	}

	for (let start = 0; start < total; start += BATCH) {
		const chunk = items.slice(start, start + BATCH);
		const ids = chunk.map((it) => it.id);
		const rows = await db
			.select({
				id: item.id,
				status: item.status,
				publishedVersionId: item.publishedVersionId,
				version: itemVersion.version,
				contentHash: itemVersion.contentHash
			})
			.from(item)
			.leftJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
			.where(inArray(item.id, ids));
		const existing = new Map<string, Existing>(rows.map((r) => [r.id, r]));
		const fresh: BuiltItem[] = [];
		const changed: BuiltItem[] = [];
		for (const it of chunk) {
			const e = existing.get(it.id);
			if (!e) fresh.push(it);
			else if (e.version === it.version) report.unchanged++;
			else {
				changed.push(it);
				if (e.contentHash === it.contentHash) report.keyChanges++;
			}
		}
		const toWrite = [...fresh, ...changed];
		if (toWrite.length) {
			await db.transaction(async (tx) => {
				if (fresh.length)
					await tx.insert(item).values(
						fresh.map((it) => ({ id: it.id, area: it.area, skill: it.skill, kind: it.kind, familyId: it.family, status: 'in_review' as const }))
					);
				// ignore: a version row left by an earlier, interrupted run is reused rather than refused.
				await tx
					.insert(itemVersion)
					.values(toWrite.map((it) => versionRow(it, it.family ? null : (options.sources?.[it.origin] ?? null))))
					.onDuplicateKeyUpdate({ set: { itemId: sql`item_id` } });
				// The rows just written are the newest version of each item.
				await tx.execute(sql`UPDATE item i JOIN item_version v ON v.item_id = i.id SET i.latest_version_id = v.id, i.updated_at = CURRENT_TIMESTAMP WHERE (v.item_id, v.version) IN (${sql.join(
					toWrite.map((it) => sql`(${it.id}, ${it.version})`),
					sql`, `
				)})`);
				// A published item stays published (its old version served) until the new one is approved.
				if (changed.length)
					await tx
						.update(item)
						.set({ status: 'in_review' })
						.where(and(inArray(item.id, changed.map((it) => it.id)), notInArray(item.status, ['published', 'retired'])));
			});
			report.newItems += fresh.length;
			report.newVersions += changed.length;
		}
		options.onProgress?.({ done: Math.min(total, start + chunk.length), total });
	}
	if (options.completeFamilies?.length) report.retired = await retireUnbuilt(db, options.completeFamilies, items);
	return report;
}

/** Retires the stored items of the given families that `items` does not contain; returns how many. */
async function retireUnbuilt(db: Db, families: readonly string[], items: readonly BuiltItem[]): Promise<number> {
	const built = new Set(items.map((it) => it.id));
	const stored = await db
		.select({ id: item.id })
		.from(item)
		.where(and(inArray(item.familyId, [...families]), notInArray(item.status, ['retired'])));
	const gone = stored.map((r) => r.id).filter((id) => !built.has(id));
	for (let i = 0; i < gone.length; i += BATCH) {
		const ids = gone.slice(i, i + BATCH);
		await db.transaction(async (tx) => {
			await tx.update(itemVersion).set({ status: 'retired' }).where(and(inArray(itemVersion.itemId, ids), notInArray(itemVersion.status, ['retired'])));
			await tx.update(item).set({ status: 'retired', updatedAt: new Date() }).where(inArray(item.id, ids));
		});
	}
	return gone.length;
}

/**
 * Publishes a version: the item serves it from now on, and the version it replaces is retired.
 * Runs inside the caller's transaction.
 */
export async function publishVersions(tx: Db, versionIds: number[], at = new Date()): Promise<void> {
	if (!versionIds.length) return;
	for (let i = 0; i < versionIds.length; i += BATCH) {
		const ids = versionIds.slice(i, i + BATCH);
		const vs = await tx.select({ id: itemVersion.id, itemId: itemVersion.itemId }).from(itemVersion).where(inArray(itemVersion.id, ids));
		const itemIds = vs.map((v) => v.itemId);
		await tx
			.update(itemVersion)
			.set({ status: 'retired' })
			.where(and(inArray(itemVersion.itemId, itemIds), eq(itemVersion.status, 'published')));
		await tx.update(itemVersion).set({ status: 'published', publishedAt: at }).where(inArray(itemVersion.id, ids));
		await tx
			.update(item)
			.set({ status: 'published', publishedVersionId: sql`latest_version_id`, updatedAt: at })
			.where(and(inArray(item.id, itemIds), inArray(item.latestVersionId, ids)));
	}
}
