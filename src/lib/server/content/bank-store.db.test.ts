// storeBank against the real MariaDB: idempotency, versions, key changes, families.
// The items are real builds (buildBank on the shipped content, keyed by the engine), under ids unique
// to this run so other test files never see them.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { eq, inArray, sql } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { item, itemFamily, itemVersion, response, review } from '../db/schema';
import { buildBank } from '../../items/bank';
import { FAMILIES } from '../../items/families';
import { hashText } from '../../items/hash';
import type { BuiltItem } from '../../items/types';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { readContent } from '../seed/bank';
import { familyHash, storeBank } from './bank-store';
import { approveFamily, approveItem, ReviewError } from './review';

afterAll(closeDb);

const tag = () => `t${randomBytes(3).toString('hex')}`;

/** The shipped hand-written items, with ids (and sources) renamed for this run. */
function handItems(prefix: string): { items: BuiltItem[]; sources: Record<string, string> } {
	const { files, circuits } = readContent();
	const renamed: Record<string, string> = {};
	for (const [p, text] of Object.entries(files)) renamed[p] = text.replace(/^id: (.+)$/m, `id: ${prefix}-$1`);
	const r = buildBank({ files: renamed, circuits, families: [] });
	expect(r.errors).toEqual([]);
	return { items: r.items, sources: renamed };
}

/** One real family under a new id, a few variants. */
function familyItems(prefix: string): BuiltItem[] {
	const fam = { ...FAMILIES[0], id: `${prefix}-${FAMILIES[0].id}` };
	const r = buildBank({ files: {}, circuits: {}, families: [fam], variantsPerFamily: 1 });
	expect(r.errors).toEqual([]);
	expect(r.items.length).toBeGreaterThan(3);
	return r.items;
}

/** The same item with changed content (a new stem) or only a changed key hash. */
function withNewStem(it: BuiltItem): BuiltItem {
	const stemHtml = it.stemHtml + '<p>Read the meter with the key off.</p>';
	const contentHash = hashText(it.contentHash + stemHtml);
	return { ...it, stemHtml, contentHash, version: hashText(contentHash + it.keyHash) };
}
function withNewKeyHash(it: BuiltItem, key = it.key): BuiltItem {
	const keyHash = hashText(it.keyHash + 'engine changed');
	return { ...it, key, keyHash, version: hashText(it.contentHash + keyHash) };
}

async function counts(ids: string[]) {
	const db = getDb();
	const [v] = await db.select({ n: sql<number>`count(*)` }).from(itemVersion).where(inArray(itemVersion.itemId, ids));
	const [i] = await db.select({ n: sql<number>`count(*)`, latest: sql<string>`max(updated_at)` }).from(item).where(inArray(item.id, ids));
	return { versions: Number(v.n), items: Number(i.n), latest: String(i.latest) };
}

let reviewer: { id: string; roles: string[] };
let learnerId: string;

beforeAll(async () => {
	const r = await createAccount({ email: uniqueEmail('bank-reviewer'), name: 'Bank Reviewer', password: 'continuity tester lead', timeZone: 'UTC', roles: ['reviewer'] });
	reviewer = { id: r.id, roles: ['reviewer'] };
	const l = await createAccount({ email: uniqueEmail('bank-learner'), name: 'Bank Learner', password: 'continuity tester lead', timeZone: 'UTC', roles: ['learner'] });
	learnerId = l.id;
});

describe('storeBank (MariaDB)', () => {
	it('writes every item once, and a second run with the same items writes nothing', async () => {
		const prefix = tag();
		const items = [...handItems(prefix).items, ...familyItems(prefix)];
		const ids = items.map((i) => i.id);
		const progress: number[] = [];
		const first = await storeBank(items, { onProgress: (p) => progress.push(p.done) });
		expect(first.newItems).toBe(items.length);
		expect(first.newFamilies).toBe(1);
		expect(progress.at(-1)).toBe(items.length);
		const after1 = await counts(ids);
		expect(after1).toMatchObject({ versions: items.length, items: items.length });

		const second = await storeBank(items);
		expect(second).toEqual({ newItems: 0, newVersions: 0, keyChanges: 0, unchanged: items.length, newFamilies: 0, familiesBackToReview: 0, retired: 0 });
		expect(await counts(ids)).toEqual(after1);
		const fams = await getDb().select().from(itemFamily).where(eq(itemFamily.id, items.at(-1)!.family!));
		expect(fams).toHaveLength(1);
		expect(fams[0].sourceHash).toBe(familyHash(items.filter((i) => i.family)));
	});

	it('makes a changed item a new version; answers stay linked to the version they were given for', async () => {
		const prefix = tag();
		const { items, sources } = handItems(prefix);
		await storeBank(items, { sources });
		const target = items[0];
		await approveItem(reviewer, target.id);
		const [before] = await getDb().select().from(item).where(eq(item.id, target.id));
		const oldVersion = before.publishedVersionId!;
		await getDb().insert(response).values({
			userId: learnerId,
			itemId: target.id,
			itemVersionId: oldVersion,
			idempotencyKey: `store-${prefix}`,
			context: 'practice',
			answer: { value: 1 },
			score: 0,
			correct: false,
			ms: 4000
		});

		const report = await storeBank([withNewStem(target), ...items.slice(1)], { sources });
		expect(report).toMatchObject({ newItems: 0, newVersions: 1, keyChanges: 0, unchanged: items.length - 1 });
		const versions = await getDb().select().from(itemVersion).where(eq(itemVersion.itemId, target.id));
		expect(versions).toHaveLength(2);
		const [after] = await getDb().select().from(item).where(eq(item.id, target.id));
		expect(after.latestVersionId).not.toBe(oldVersion);
		expect(after.publishedVersionId).toBe(oldVersion);
		const [answer] = await getDb().select().from(response).where(eq(response.idempotencyKey, `store-${prefix}`));
		expect(answer.itemVersionId).toBe(oldVersion);
	});

	it('sends an item whose key changed back to review, serving the old version until a reviewer approves', async () => {
		const prefix = tag();
		const { items, sources } = handItems(prefix);
		await storeBank(items, { sources });
		const target = items[1];
		await approveItem(reviewer, target.id);
		const [published] = await getDb().select().from(item).where(eq(item.id, target.id));

		const report = await storeBank([withNewKeyHash(target)], { sources });
		expect(report).toMatchObject({ newVersions: 1, keyChanges: 1 });
		const [now] = await getDb()
			.select({ status: item.status, publishedVersionId: item.publishedVersionId, versionStatus: itemVersion.status, versionId: itemVersion.id })
			.from(item)
			.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
			.where(eq(item.id, target.id));
		expect(now.versionStatus).toBe('in_review');
		expect(now.status).toBe('published');
		expect(now.publishedVersionId).toBe(published.publishedVersionId);

		await approveItem(reviewer, target.id);
		const [approved] = await getDb().select().from(item).where(eq(item.id, target.id));
		expect(approved.publishedVersionId).toBe(now.versionId);
		const [old] = await getDb().select().from(itemVersion).where(eq(itemVersion.id, published.publishedVersionId!));
		expect(old.status).toBe('retired');
	});

	it('refuses to approve a version whose stored key the engine no longer gives', async () => {
		const prefix = tag();
		const { items, sources } = handItems(prefix);
		const numeric = items.find((i) => i.key.kind === 'numeric')!;
		const k = numeric.key as Extract<BuiltItem['key'], { kind: 'numeric' }>;
		await storeBank([withNewKeyHash(numeric, { ...k, value: k.value + 3 })], { sources });
		const err = await approveItem(reviewer, numeric.id).catch((e) => e);
		expect(err).toBeInstanceOf(ReviewError);
		expect((err as ReviewError).code).toBe('key_mismatch');
		const [row] = await getDb().select().from(item).where(eq(item.id, numeric.id));
		expect(row.publishedVersionId).toBeNull();
	});

	it('publishes a family\'s items when the family is approved as a whole', async () => {
		const items = familyItems(tag());
		const famId = items[0].family!;
		await storeBank(items);
		const ids = items.map((i) => i.id);
		const before = await getDb().select().from(item).where(inArray(item.id, ids));
		expect(before.every((r) => r.status === 'in_review' && r.publishedVersionId === null)).toBe(true);
		await expect(approveItem(reviewer, ids[0])).rejects.toBeInstanceOf(ReviewError);

		const { published } = await approveFamily(reviewer, famId);
		expect(published).toBe(items.length);
		const after = await getDb().select().from(item).where(inArray(item.id, ids));
		expect(after.every((r) => r.status === 'published' && r.publishedVersionId === r.latestVersionId)).toBe(true);
		const [fam] = await getDb().select().from(itemFamily).where(eq(itemFamily.id, famId));
		expect(fam).toMatchObject({ status: 'approved', approvedHash: fam.sourceHash, approvedBy: reviewer.id });
		const decisions = await getDb().select().from(review).where(eq(review.familyId, famId));
		expect(decisions.map((d) => d.decision)).toEqual(['approve']);
		// Approving again changes nothing.
		expect((await approveFamily(reviewer, famId)).published).toBe(0);
	});

	it('sends a family back to review when its hash changes; its published items stay served', async () => {
		const items = familyItems(tag());
		const famId = items[0].family!;
		await storeBank(items);
		await approveFamily(reviewer, famId);
		const [approved] = await getDb().select().from(itemFamily).where(eq(itemFamily.id, famId));

		const changed = [withNewStem(items[0]), ...items.slice(1)];
		const report = await storeBank(changed);
		expect(report).toMatchObject({ familiesBackToReview: 1, newVersions: 1 });
		const [fam] = await getDb().select().from(itemFamily).where(eq(itemFamily.id, famId));
		expect(fam.status).toBe('in_review');
		expect(fam.sourceHash).not.toBe(approved.sourceHash);
		const [first] = await getDb().select().from(item).where(eq(item.id, items[0].id));
		expect(first.status).toBe('published');
		expect(first.publishedVersionId).not.toBe(first.latestVersionId);

		expect((await approveFamily(reviewer, famId)).published).toBe(1);
		const [served] = await getDb().select().from(item).where(eq(item.id, items[0].id));
		expect(served.publishedVersionId).toBe(served.latestVersionId);
	});

	it('retires the items of a complete family that a build no longer makes, and only those', async () => {
		const items = familyItems(tag());
		const other = familyItems(tag());
		const famId = items[0].family!;
		await storeBank([...items, ...other]);
		await approveFamily(reviewer, famId);
		const gone = items.at(-1)!;
		const kept = items.slice(0, -1);

		// A build of the first family without its last item, stored as that family's full build.
		const report = await storeBank(kept, { completeFamilies: [famId] });
		expect(report).toMatchObject({ retired: 1, unchanged: kept.length, newItems: 0 });
		const rows = await getDb().select({ id: item.id, status: item.status }).from(item).where(inArray(item.id, [...items, ...other].map((i) => i.id)));
		const status = Object.fromEntries(rows.map((r) => [r.id, r.status]));
		expect(status[gone.id]).toBe('retired');
		for (const it of kept) expect(status[it.id]).toBe('published');
		// The other family was not part of this build's complete families: untouched although absent.
		for (const it of other) expect(status[it.id]).toBe('in_review');
		const versions = await getDb().select({ status: itemVersion.status }).from(itemVersion).where(eq(itemVersion.itemId, gone.id));
		expect(versions.map((v) => v.status)).toEqual(['retired']);

		// Without completeFamilies (part of a bank) nothing is retired, and a repeat run retires nothing more.
		expect((await storeBank(kept.slice(0, 1))).retired).toBe(0);
		expect((await storeBank(kept, { completeFamilies: [famId] })).retired).toBe(0);
	});
});
