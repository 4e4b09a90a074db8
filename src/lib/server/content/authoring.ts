/**
 * Authoring items in the app: preview (the build of one markdown item, keyed by the engine), drafts,
 * and submitting for review. An author edits only their own items: drafts, items sent back with changes
 * requested, and published items (as a new draft version); the id in the front matter is the item's id
 * and cannot change once saved.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { and, desc, eq, type SQL } from 'drizzle-orm';
import { getDb, type Db } from '../db/client';
import { item, itemVersion, review } from '../db/schema';
import { buildBank } from '../../items/bank';
import { versionRow } from './bank-store';
import type { BuildError, BuiltItem } from '../../items/types';
import { layoutCircuit, readDiagramCircuit, renderSvg } from '../../diagram';

export type Actor = { id: string; roles: readonly string[] };

export class AuthoringError extends Error {
	constructor(
		message: string,
		readonly code: 'forbidden' | 'not_found' | 'wrong_state' | 'invalid' | 'id_taken',
		readonly errors: BuildError[] = []
	) {
		super(message);
	}
}

let circuitCache: Record<string, string> | null = null;

/** The project's circuit files by path (`content/circuits/x.yaml`), read once. */
export function contentCircuits(root = process.cwd()): Record<string, string> {
	if (circuitCache) return circuitCache;
	const dir = path.join(root, 'content/circuits');
	const out: Record<string, string> = {};
	try {
		for (const n of readdirSync(dir).sort()) if (n.endsWith('.yaml')) out[`content/circuits/${n}`] = readFileSync(path.join(dir, n), 'utf8');
	} catch {
		// No circuits folder: items must then carry their circuit inline.
	}
	circuitCache = out;
	return out;
}

export type Preview = { item: BuiltItem | null; errors: BuildError[] };

/**
 * Builds one markdown item as the bank build would (never throws on bad content). When `expectedId`
 * is given, an item whose front matter names another id is refused.
 */
export function previewMarkdown(source: string, expectedId?: string): Preview {
	const file = 'draft.md';
	let r;
	try {
		r = buildBank({ files: { [file]: source }, circuits: contentCircuits(), families: [] });
	} catch (e) {
		return { item: null, errors: [{ file, line: 1, message: `the item could not be built: ${(e as Error).message}`, fix: 'check the ask and the circuit' }] };
	}
	const it = r.items[0] ?? null;
	if (it && expectedId && it.id !== expectedId)
		return { item: null, errors: [{ file, line: 2, message: `this item's id is "${expectedId}"; the front matter says "${it.id}"`, fix: `write id: ${expectedId}, or start a new item for a new id` }] };
	return { item: it, errors: r.errors };
}

/** The circuit of a built item as SVG, in the ask's state; null when it cannot be drawn. */
export function previewSvg(it: BuiltItem): string | null {
	try {
		const { diagram } = readDiagramCircuit(it.circuitText);
		return renderSvg(layoutCircuit(diagram, { state: it.feedback.state ?? undefined }));
	} catch {
		return null;
	}
}

function canAuthor(actor: Actor): void {
	if (!actor.roles.includes('author')) throw new AuthoringError('Writing items is for the author role. Ask a site admin if you need it.', 'forbidden');
}

/** Version states an author can submit for review. */
const EDITABLE = new Set(['draft', 'changes_requested']);
/**
 * Version states an author can save over: a published version too, whose save starts a new draft version
 * while learners keep being served the published one until a reviewer approves the new one.
 */
const SAVABLE = new Set([...EDITABLE, 'published']);

export type MyItem = { id: string; area: string; kind: string; status: string; versionStatus: string; updatedAt: Date };

/** The author's own items, newest first, with optional filters. */
export async function listMyItems(actor: Actor, filters: { status?: string; area?: string; kind?: string } = {}, db: Db = getDb()): Promise<MyItem[]> {
	canAuthor(actor);
	const conds: SQL[] = [eq(item.authorId, actor.id)];
	if (filters.area) conds.push(eq(item.area, filters.area));
	if (filters.kind) conds.push(eq(item.kind, filters.kind));
	if (filters.status) conds.push(eq(itemVersion.status, filters.status as 'draft'));
	return db
		.select({ id: item.id, area: item.area, kind: item.kind, status: item.status, versionStatus: itemVersion.status, updatedAt: item.updatedAt })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.where(and(...conds))
		.orderBy(desc(item.updatedAt), item.id)
		.limit(500);
}

export type MyItemDetail = { id: string; status: string; versionStatus: string; source: string; editable: boolean; comments: { comment: string; at: Date }[] };

/** One of the author's own items with its newest source; null when it is not theirs or does not exist. */
export async function loadMyItem(actor: Actor, itemId: string, db: Db = getDb()): Promise<MyItemDetail | null> {
	canAuthor(actor);
	const [row] = await db
		.select({ id: item.id, status: item.status, authorId: item.authorId, versionStatus: itemVersion.status, source: itemVersion.source })
		.from(item)
		.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
		.where(eq(item.id, itemId));
	if (!row || row.authorId !== actor.id) return null;
	const comments = await db
		.select({ comment: review.comment, at: review.createdAt })
		.from(review)
		.innerJoin(itemVersion, eq(itemVersion.id, review.itemVersionId))
		.where(and(eq(itemVersion.itemId, itemId), eq(review.decision, 'request_changes')))
		.orderBy(desc(review.id))
		.limit(10);
	return {
		id: row.id,
		status: row.status,
		versionStatus: row.versionStatus,
		source: row.source ?? '',
		editable: row.status !== 'retired' && SAVABLE.has(row.versionStatus),
		comments: comments.filter((c): c is { comment: string; at: Date } => !!c.comment)
	};
}

function versionValues(it: BuiltItem, source: string, actor: Actor) {
	return { ...versionRow(it, source, 'draft'), createdBy: actor.id };
}

/**
 * Saves markdown as a draft. Without `itemId` it creates the item named by the front matter (refused
 * when that id is taken); with it, it updates the author's own draft (or starts a new draft version of
 * an item sent back or published; a published version keeps being served until the new one is approved).
 * Saving the same text again changes nothing. Returns the item id.
 */
export async function saveDraft(actor: Actor, source: string, itemId?: string, db: Db = getDb()): Promise<string> {
	canAuthor(actor);
	const p = previewMarkdown(source, itemId);
	if (!p.item || p.errors.length) throw new AuthoringError('The item does not build yet: fix the lines listed below, then save again.', 'invalid', p.errors);
	const it = p.item;
	return db.transaction(async (tx) => {
		const [existing] = await tx
			.select({ id: item.id, status: item.status, authorId: item.authorId, latestVersionId: item.latestVersionId, publishedVersionId: item.publishedVersionId, versionStatus: itemVersion.status, version: itemVersion.version })
			.from(item)
			.leftJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
			.where(eq(item.id, it.id))
			.for('update');
		if (!itemId) {
			if (existing) {
				if (existing.authorId === actor.id) throw new AuthoringError(`You already have an item "${it.id}": open it from your items to change it.`, 'id_taken');
				throw new AuthoringError(`The id "${it.id}" is taken by another item: choose another id in the front matter.`, 'id_taken');
			}
			await tx.insert(item).values({ id: it.id, area: it.area, skill: it.skill, kind: it.kind, authorId: actor.id, status: 'draft' });
			await tx.insert(itemVersion).values(versionValues(it, source, actor));
			const [v] = await tx.select({ id: itemVersion.id }).from(itemVersion).where(and(eq(itemVersion.itemId, it.id), eq(itemVersion.version, it.version)));
			await tx.update(item).set({ latestVersionId: v.id }).where(eq(item.id, it.id));
			return it.id;
		}
		if (!existing || existing.authorId !== actor.id) throw new AuthoringError('You can only change items you wrote.', existing ? 'forbidden' : 'not_found');
		if (existing.status === 'retired') throw new AuthoringError('This item is retired: it cannot be changed. Start a new item instead.', 'wrong_state');
		if (!existing.versionStatus || !SAVABLE.has(existing.versionStatus))
			throw new AuthoringError(`This item is ${existing.versionStatus?.replace('_', ' ')}; you can change it while it is a draft, sent back with changes requested, or published.`, 'wrong_state');
		if (existing.version === it.version) return it.id;
		// Another stored version with exactly this text (the published one, say) must not be overwritten.
		const [same] = await tx.select({ status: itemVersion.status }).from(itemVersion).where(and(eq(itemVersion.itemId, it.id), eq(itemVersion.version, it.version)));
		if (same && same.status !== 'draft')
			throw new AuthoringError(`This text is the same as the item's ${same.status.replace('_', ' ')} version: change something to save a new draft, or leave the item as it is.`, 'invalid');
		const meta = { area: it.area, skill: it.skill, kind: it.kind, updatedAt: new Date() };
		if (existing.versionStatus === 'draft') {
			await tx.update(itemVersion).set(versionValues(it, source, actor)).where(eq(itemVersion.id, existing.latestVersionId!));
			await tx.update(item).set(meta).where(eq(item.id, it.id));
		} else {
			// Sent back or published: that version stays as it was (learners keep the published one, and the
			// next review diffs against it); the change is a new draft version.
			await tx.insert(itemVersion).values(versionValues(it, source, actor)).onDuplicateKeyUpdate({ set: { status: 'draft', source } });
			const [v] = await tx.select({ id: itemVersion.id }).from(itemVersion).where(and(eq(itemVersion.itemId, it.id), eq(itemVersion.version, it.version)));
			await tx
				.update(item)
				.set({ ...meta, latestVersionId: v.id, status: existing.publishedVersionId ? 'published' : 'draft' })
				.where(eq(item.id, it.id));
		}
		return it.id;
	});
}

/** Sends the author's draft to the review queue. Submitting an item already in review changes nothing. */
export async function submitForReview(actor: Actor, itemId: string, db: Db = getDb()): Promise<void> {
	canAuthor(actor);
	await db.transaction(async (tx) => {
		const [row] = await tx
			.select({ authorId: item.authorId, publishedVersionId: item.publishedVersionId, versionId: itemVersion.id, status: itemVersion.status, source: itemVersion.source })
			.from(item)
			.innerJoin(itemVersion, eq(itemVersion.id, item.latestVersionId))
			.where(eq(item.id, itemId))
			.for('update');
		if (!row || row.authorId !== actor.id) throw new AuthoringError('You can only submit items you wrote.', row ? 'forbidden' : 'not_found');
		if (row.status === 'in_review') return;
		if (row.status === 'published') throw new AuthoringError('This item is published and has no new draft: change it and save, then submit the new version.', 'wrong_state');
		if (!EDITABLE.has(row.status)) throw new AuthoringError(`This item is ${row.status.replace('_', ' ')}; only a draft can be submitted.`, 'wrong_state');
		const p = previewMarkdown(row.source ?? '', itemId);
		if (!p.item || p.errors.length) throw new AuthoringError('The item no longer builds: open it, fix the lines listed, and save again.', 'invalid', p.errors);
		await tx.update(itemVersion).set({ status: 'in_review' }).where(eq(itemVersion.id, row.versionId));
		if (!row.publishedVersionId) await tx.update(item).set({ status: 'in_review', updatedAt: new Date() }).where(eq(item.id, itemId));
		await tx.insert(review).values({ itemVersionId: row.versionId, reviewerId: actor.id, decision: 'submit' });
	});
}

/** The key in words, for the preview and the review screen. */
export function keySummary(key: BuiltItem['key'], question: BuiltItem['question']): string {
	const label = (id: string) => ('options' in question ? question.options.find((o) => o.id === id)?.label : undefined) ?? id;
	switch (key.kind) {
		case 'numeric':
			return `${key.value} ${key.unit} (within ±${key.tolerance} ${key.unit})${key.reads ? `, reads ${key.reads}` : ''}`;
		case 'choose-one':
			return label(key.choice);
		case 'choose-all':
			return key.choices.length ? key.choices.map(label).join('; ') : 'none of the options';
		case 'select-diagram':
			return key.elements.length ? key.elements.join(', ') : 'nothing to select';
		case 'predict-works':
			return Object.entries(key.loads)
				.map(([l, s]) => `${l} ${s}`)
				.join(', ');
		case 'claim-check':
			return key.verdicts.map((v, i) => `statement ${i + 1}: ${v ? 'true' : 'false'}`).join(', ');
		case 'next-test':
			return `measure ${key.point} in state ${key.state}`;
	}
}

export type PreviewPayload = {
	ok: boolean;
	id: string | null;
	kind: string | null;
	stemHtml: string;
	explanationHtml: string;
	circuitText: string | null;
	state: string | null;
	svg: string | null;
	key: string | null;
	distractors: { tag: string; label: string }[];
	cautions: string[];
	errors: { line: number; message: string; fix: string }[];
};

/** The preview as the editor shows it: rendered (sanitized) stem, diagram, computed key, tagged distractors, errors. */
export function previewPayload(source: string, expectedId?: string): PreviewPayload {
	const p = previewMarkdown(source, expectedId);
	const it = p.item;
	return {
		ok: !!it && p.errors.length === 0,
		id: it?.id ?? null,
		kind: it?.kind ?? null,
		stemHtml: it?.stemHtml ?? '',
		explanationHtml: it?.explanationHtml ?? '',
		circuitText: it?.circuitText ?? null,
		state: it?.feedback.state ?? null,
		svg: it ? previewSvg(it) : null,
		key: it ? keySummary(it.key, it.question) : null,
		distractors: it ? it.distractors.map((d) => ({ tag: d.tag, label: d.label })) : [],
		cautions: it ? it.cautions.map((c) => c.text) : [],
		errors: p.errors.map((e) => ({ line: e.line, message: e.message, fix: e.fix }))
	};
}
