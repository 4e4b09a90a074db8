// For the learner's db tests: real published items (buildBank on every circuit family, keyed by the
// engine) stored straight into item/item_version as published, under ids unique to the run.
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { buildBank } from '../../src/lib/items/bank';
import type { BuiltItem, Key } from '../../src/lib/items/types';
import type { Db } from '../../src/lib/server/db/client';
import { item, itemVersion } from '../../src/lib/server/db/schema';

let built: BuiltItem[] | undefined;

/** Two variants of each family: every kind and area, a few hundred items. */
export function builtItems(): BuiltItem[] {
	built ??= buildBank({ files: {}, circuits: {}, variantsPerFamily: 2 }).items;
	return built;
}

/** Stores the built items as published under `prefix-` ids; returns the stored items with their new ids. */
export async function publishItems(db: Db, prefix = `lt${randomBytes(3).toString('hex')}`, items = builtItems()): Promise<BuiltItem[]> {
	const out: BuiltItem[] = [];
	for (const b of items) {
		const id = `${prefix}-${b.id}`.slice(0, 160);
		await db.insert(item).values({ id, area: b.area, skill: b.skill, kind: b.kind, status: 'published' });
		const [v] = await db.insert(itemVersion).values({
			itemId: id,
			version: b.version,
			contentHash: b.contentHash,
			keyHash: b.keyHash,
			circuitText: b.circuitText,
			circuitRef: b.circuitRef,
			stemHtml: b.stemHtml,
			explanationHtml: b.explanationHtml,
			ask: b.ask,
			question: b.question,
			key: b.key,
			distractors: b.distractors,
			cautions: b.cautions,
			feedback: b.feedback,
			tags: b.tags,
			difficulty: b.difficulty,
			status: 'published',
			publishedAt: new Date()
		});
		await db.update(item).set({ publishedVersionId: v.insertId, latestVersionId: v.insertId }).where(eq(item.id, id));
		out.push({ ...b, id });
	}
	return out;
}

/** The stored key of a published item, read from the database as the server would. */
export async function storedKey(db: Db, itemId: string): Promise<Key> {
	const [r] = await db.select({ key: itemVersion.key }).from(item).innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId)).where(eq(item.id, itemId));
	return r!.key as Key;
}

/** A response that matches the key exactly. */
export function rightAnswer(k: Key): Record<string, unknown> {
	switch (k.kind) {
		case 'numeric':
			return { value: k.value };
		case 'choose-one':
			return { choice: k.choice };
		case 'choose-all':
			return { choices: k.choices };
		case 'select-diagram':
			return { elements: k.elements };
		case 'predict-works':
			return { loads: k.loads };
		case 'claim-check':
			return { verdicts: k.verdicts };
		case 'next-test':
			return { state: k.state, point: k.point };
	}
}

/** A response of the right shape that is not the key (the server decides what it scores). */
export function wrongAnswer(k: Key, question: { kind: string; options?: { id: string }[] }): Record<string, unknown> {
	switch (k.kind) {
		case 'numeric':
			return { value: k.value + 100 * (k.tolerance + 1) };
		case 'choose-one':
			return { choice: question.options!.find((o) => o.id !== k.choice)!.id };
		case 'choose-all':
			return { choices: question.options!.filter((o) => !k.choices.includes(o.id)).map((o) => o.id) };
		case 'select-diagram':
			return { elements: [] };
		case 'predict-works':
			return { loads: Object.fromEntries(Object.entries(k.loads).map(([id, s]) => [id, s === 'off' ? 'on' : 'off'])) };
		case 'claim-check':
			return { verdicts: k.verdicts.map((v) => !v) };
		case 'next-test': {
			// The test that leaves the most candidates: the least useful one.
			const [worst] = Object.entries(k.expectedLeft).sort((a, b) => b[1] - a[1])[0];
			const [state, point] = worst.split('/');
			return { state, point };
		}
	}
}
