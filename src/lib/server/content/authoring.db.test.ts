// Authoring and review rules against the real MariaDB: an author edits only their own drafts (and
// items sent back), only reviewers publish or retire, and statistics from responses.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { item, itemVersion, response } from '../db/schema';
import { createAccount } from '../users/accounts';
import { uniqueEmail } from '../../../../tests/helpers/db';
import { AuthoringError, listMyItems, loadMyItem, saveDraft, submitForReview } from './authoring';
import { approveItem, loadItemReview, requestChanges, retireItem, reviewQueue, ReviewError } from './review';

afterAll(closeDb);

type Actor = { id: string; roles: string[] };
const person = async (label: string, roles: ('author' | 'reviewer' | 'learner')[]): Promise<Actor> => {
	const u = await createAccount({ email: uniqueEmail(label), name: label, password: 'continuity tester lead', timeZone: 'UTC', roles });
	return { id: u.id, roles };
};

// cooling-fan-relay.yaml: with S1 open (cold) no coil current flows, so B reads battery volts, 12.6 V
// (the same hand-worked case as docs/item-format.md; common practice).
const draft = (id: string, stem = 'With the engine cold, what does a meter read from point B to ground?') => `---
id: ${id}
area: diagrams-paths
skill: point-readings
kind: numeric
circuit: content/circuits/cooling-fan-relay.yaml
ask: { volts: B, state: cold }
stated_key: 12.6
---
${stem}
`;

const code = async (p: Promise<unknown>) => {
	const e = await p.then(() => null, (x) => x);
	expect(e, 'expected a refusal').not.toBeNull();
	return (e as AuthoringError | ReviewError).code;
};

let author: Actor, otherAuthor: Actor, reviewer: Actor, learner: Actor;
const newId = () => `ta-${randomBytes(4).toString('hex')}`;

beforeAll(async () => {
	author = await person('author-a', ['author']);
	otherAuthor = await person('author-b', ['author']);
	reviewer = await person('reviewer-a', ['reviewer']);
	learner = await person('learner-a', ['learner']);
});

describe('authoring (MariaDB)', () => {
	it('saves a draft keyed by the engine, and saving the same text again changes nothing', async () => {
		const id = newId();
		expect(await saveDraft(author, draft(id))).toBe(id);
		const [v] = await getDb().select().from(itemVersion).where(eq(itemVersion.itemId, id));
		expect(v.status).toBe('draft');
		expect((v.key as { value: number }).value).toBeCloseTo(12.6, 3);
		await saveDraft(author, draft(id), id);
		expect(await getDb().select().from(itemVersion).where(eq(itemVersion.itemId, id))).toHaveLength(1);
		expect((await listMyItems(author)).map((i) => i.id)).toContain(id);
		expect((await listMyItems(author, { status: 'in_review' })).map((i) => i.id)).not.toContain(id);
	});

	it('refuses markdown that does not build, with the line of each problem', async () => {
		const bad = draft(newId()).replace('ask: { volts: B, state: cold }', 'ask: { volts: Q9, state: cold }');
		const e = await saveDraft(author, bad).catch((x) => x);
		expect(e).toBeInstanceOf(AuthoringError);
		expect((e as AuthoringError).errors.length).toBeGreaterThan(0);
		expect((e as AuthoringError).errors[0].line).toBeGreaterThan(1);
	});

	it('lets an author edit only their own drafts', async () => {
		const id = newId();
		await saveDraft(author, draft(id));
		expect(await code(saveDraft(otherAuthor, draft(id, 'Changed by someone else?'), id))).toBe('forbidden');
		expect(await code(saveDraft(otherAuthor, draft(id)))).toBe('id_taken');
		expect(await code(submitForReview(otherAuthor, id))).toBe('forbidden');
		expect(await loadMyItem(otherAuthor, id)).toBeNull();
		expect(await code(saveDraft(learner, draft(newId())))).toBe('forbidden');
		expect(await code(listMyItems(reviewer))).toBe('forbidden');
	});

	it('locks an item under review, and opens it again when changes are requested', async () => {
		const id = newId();
		await saveDraft(author, draft(id));
		await submitForReview(author, id);
		await submitForReview(author, id);
		expect(await code(saveDraft(author, draft(id, 'Edited while in review?'), id))).toBe('wrong_state');
		expect((await reviewQueue()).items.map((i) => i.id)).toContain(id);

		await requestChanges(reviewer, id, 'Say which meter lead goes where.');
		const mine = await loadMyItem(author, id);
		expect(mine).toMatchObject({ editable: true, versionStatus: 'changes_requested' });
		expect(mine!.comments[0].comment).toBe('Say which meter lead goes where.');
		await saveDraft(author, draft(id, 'With the engine cold, red lead on B and black on ground: what does the meter read?'), id);
		await submitForReview(author, id);
		const r = await loadItemReview(id);
		expect(r!.version.status).toBe('in_review');
		expect(r!.diff!.some((d) => d.kind === 'added' && d.text.includes('red lead on B'))).toBe(true);
		expect(r!.key).toMatchObject({ ok: true, recomputed: true });
	});
});

describe('review decisions (MariaDB)', () => {
	it('only a reviewer publishes or retires', async () => {
		const id = newId();
		await saveDraft(author, draft(id));
		await submitForReview(author, id);
		expect(await code(approveItem(author, id))).toBe('forbidden');
		expect(await code(retireItem(author, id))).toBe('forbidden');
		expect(await code(requestChanges(learner, id, 'no'))).toBe('forbidden');
		const [still] = await getDb().select().from(item).where(eq(item.id, id));
		expect(still.status).toBe('in_review');

		await approveItem(reviewer, id);
		await approveItem(reviewer, id);
		const [published] = await getDb().select().from(item).where(eq(item.id, id));
		expect(published.status).toBe('published');
		expect(published.publishedVersionId).toBe(published.latestVersionId);

		await retireItem(reviewer, id, 'Covered by another item.');
		const [retired] = await getDb().select().from(item).where(eq(item.id, id));
		expect(retired.status).toBe('retired');
		expect(await code(saveDraft(author, draft(id, 'Edit a retired item?'), id))).toBe('wrong_state');
	});

	it('starts a new version of a published item; learners keep the published one until it is approved', async () => {
		const id = newId();
		await saveDraft(author, draft(id));
		await submitForReview(author, id);
		await approveItem(reviewer, id);
		const [v1] = await getDb().select().from(item).where(eq(item.id, id));
		expect(await loadMyItem(author, id)).toMatchObject({ editable: true, versionStatus: 'published' });
		// Nothing new to review yet.
		expect(await code(submitForReview(author, id))).toBe('wrong_state');
		// Someone else's published item stays closed to this author.
		expect(await code(saveDraft(otherAuthor, draft(id, 'Not mine'), id))).toBe('forbidden');

		const edited = draft(id, 'With the engine cold, red lead on B and black on ground: what does the meter read?');
		await saveDraft(author, edited, id);
		const [v2] = await getDb().select().from(item).where(eq(item.id, id));
		expect(v2.status).toBe('published');
		expect(v2.publishedVersionId).toBe(v1.publishedVersionId);
		expect(v2.latestVersionId).not.toBe(v1.latestVersionId);
		expect(await loadMyItem(author, id)).toMatchObject({ editable: true, versionStatus: 'draft' });
		// Going back to the published text would overwrite the served version: refused with a reason.
		expect(await code(saveDraft(author, draft(id), id))).toBe('invalid');

		await submitForReview(author, id);
		const [waiting] = await getDb().select().from(item).where(eq(item.id, id));
		expect(waiting).toMatchObject({ status: 'published', publishedVersionId: v1.publishedVersionId });
		const r = await loadItemReview(id);
		expect(r!.diff!.some((d) => d.kind === 'added' && d.text.includes('red lead on B'))).toBe(true);

		await approveItem(reviewer, id);
		const [served] = await getDb().select().from(item).where(eq(item.id, id));
		expect(served.publishedVersionId).toBe(v2.latestVersionId);
		const versions = await getDb().select({ id: itemVersion.id, status: itemVersion.status }).from(itemVersion).where(eq(itemVersion.itemId, id));
		expect(Object.fromEntries(versions.map((v) => [v.id, v.status]))).toEqual({ [v1.publishedVersionId!]: 'retired', [v2.latestVersionId!]: 'published' });
	});

	it('shows statistics once an item has 30 responses, and flags negative discrimination', async () => {
		const id = newId();
		await saveDraft(author, draft(id));
		await submitForReview(author, id);
		await approveItem(reviewer, id);
		const [row] = await getDb().select().from(item).where(eq(item.id, id));
		// 30 answers where the weaker learners get it right: discrimination must come out negative.
		const rows = Array.from({ length: 30 }, (_, k) => ({
			userId: learner.id,
			itemId: id,
			itemVersionId: row.publishedVersionId!,
			idempotencyKey: `${id}-${k}`,
			context: 'practice' as const,
			answer: { value: 12.6 },
			score: k < 10 ? 1 : 0,
			correct: k < 10,
			ms: 1000 * (k + 1),
			abilityBefore: k / 10 - 1.5
		}));
		await getDb().insert(response).values(rows.slice(0, 29));
		expect((await loadItemReview(id))!.stats).toBeNull();
		await getDb().insert(response).values(rows.slice(29));
		const stats = (await loadItemReview(id))!.stats!;
		expect(stats.n).toBe(30);
		expect(stats.pCorrect).toBeCloseTo(1 / 3, 6);
		expect(stats.medianMs).toBe(15500);
		expect(stats.discrimination!).toBeLessThan(0);
		expect((await reviewQueue()).flagged.map((f) => f.id)).toContain(id);
	});
});
