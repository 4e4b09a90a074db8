import {
	bigint,
	boolean,
	datetime,
	double,
	index,
	int,
	json,
	mediumtext,
	mysqlEnum,
	mysqlTable,
	text,
	uniqueIndex,
	varchar
} from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';
import { user } from './user';

// The item bank. An item is a stable id; each change of its source or of its computed key is a new
// item_version, and answers stay linked to the version they were given for.

export const ITEM_STATUSES = ['draft', 'in_review', 'changes_requested', 'published', 'retired'] as const;
export type ItemStatus = (typeof ITEM_STATUSES)[number];

const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey();
const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true });
const createdAt = () =>
	datetime('created_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`);

/** A generator family, approved as a whole; a changed family (new hash) goes back to review. */
export const itemFamily = mysqlTable('item_family', {
	id: varchar('id', { length: 64 }).primaryKey(),
	title: varchar('title', { length: 200 }).notNull(),
	sourceHash: varchar('source_hash', { length: 64 }).notNull(),
	status: mysqlEnum('status', ['in_review', 'approved', 'retired']).notNull().default('in_review'),
	approvedHash: varchar('approved_hash', { length: 64 }),
	approvedBy: varchar('approved_by', { length: 32 }).references(() => user.id, { onDelete: 'set null' }),
	approvedAt: datetime('approved_at', { mode: 'date' }),
	updatedAt: datetime('updated_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`)
});

export const item = mysqlTable(
	'item',
	{
		id: varchar('id', { length: 160 }).primaryKey(),
		area: varchar('area', { length: 48 }).notNull(),
		skill: varchar('skill', { length: 64 }).notNull(),
		kind: varchar('kind', { length: 24 }).notNull(),
		familyId: varchar('family_id', { length: 64 }).references(() => itemFamily.id, { onDelete: 'set null' }),
		/** Null for generated items; the author of a markdown item written in the app or uploaded. */
		authorId: varchar('author_id', { length: 32 }).references(() => user.id, { onDelete: 'set null' }),
		status: mysqlEnum('status', ITEM_STATUSES).notNull().default('draft'),
		/** The version learners are served; null until first published. */
		publishedVersionId: ref('published_version_id'),
		/** The newest version (a draft or under review, or the published one). */
		latestVersionId: ref('latest_version_id'),
		createdAt: createdAt(),
		updatedAt: datetime('updated_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`)
	},
	(t) => [
		index('item_status_area_idx').on(t.status, t.area),
		index('item_skill_idx').on(t.skill),
		index('item_author_idx').on(t.authorId)
	]
);

export const itemVersion = mysqlTable(
	'item_version',
	{
		id: id(),
		itemId: varchar('item_id', { length: 160 })
			.notNull()
			.references(() => item.id, { onDelete: 'cascade' }),
		/** Hash of content hash + key hash. */
		version: varchar('version', { length: 64 }).notNull(),
		contentHash: varchar('content_hash', { length: 64 }).notNull(),
		keyHash: varchar('key_hash', { length: 64 }).notNull(),
		/** The markdown source for authored items; null for generated ones. */
		source: mediumtext('source'),
		circuitText: mediumtext('circuit_text').notNull(),
		circuitRef: varchar('circuit_ref', { length: 200 }).notNull(),
		stemHtml: mediumtext('stem_html').notNull(),
		explanationHtml: mediumtext('explanation_html').notNull(),
		ask: json('ask').notNull(),
		question: json('question').notNull(),
		key: json('answer_key').notNull(),
		distractors: json('distractors').notNull(),
		cautions: json('cautions').notNull(),
		feedback: json('feedback').notNull(),
		tags: json('tags').notNull(),
		difficulty: double('difficulty').notNull().default(0),
		status: mysqlEnum('status', ITEM_STATUSES).notNull().default('draft'),
		createdBy: varchar('created_by', { length: 32 }).references(() => user.id, { onDelete: 'set null' }),
		createdAt: createdAt(),
		publishedAt: datetime('published_at', { mode: 'date' })
	},
	(t) => [uniqueIndex('item_version_item_version_uq').on(t.itemId, t.version), index('item_version_status_idx').on(t.status)]
);

/** A reviewer's decision on an item version or a family. */
export const review = mysqlTable(
	'review',
	{
		id: id(),
		itemVersionId: ref('item_version_id').references(() => itemVersion.id, { onDelete: 'cascade' }),
		familyId: varchar('family_id', { length: 64 }).references(() => itemFamily.id, { onDelete: 'cascade' }),
		reviewerId: varchar('reviewer_id', { length: 32 }).references(() => user.id, { onDelete: 'set null' }),
		decision: mysqlEnum('decision', ['approve', 'request_changes', 'retire', 'submit']).notNull(),
		comment: text('comment'),
		createdAt: createdAt()
	},
	(t) => [index('review_version_idx').on(t.itemVersionId), index('review_family_idx').on(t.familyId)]
);

/** One answer. `idempotencyKey` is unique per learner: a retried request never counts twice. */
export const response = mysqlTable(
	'response',
	{
		id: id(),
		userId: varchar('user_id', { length: 32 })
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		itemId: varchar('item_id', { length: 160 })
			.notNull()
			.references(() => item.id, { onDelete: 'cascade' }),
		itemVersionId: ref('item_version_id')
			.notNull()
			.references(() => itemVersion.id, { onDelete: 'cascade' }),
		idempotencyKey: varchar('idempotency_key', { length: 64 }).notNull(),
		context: mysqlEnum('context', ['placement', 'daily', 'mock', 'practice']).notNull(),
		contextId: ref('context_id'),
		answer: json('answer').notNull(),
		score: double('score').notNull(),
		correct: boolean('correct').notNull(),
		ms: int('ms', { unsigned: true }).notNull(),
		/** The learner's ability in the item's area just before this answer (for discrimination). */
		abilityBefore: double('ability_before').notNull().default(0),
		createdAt: createdAt()
	},
	(t) => [
		uniqueIndex('response_user_idem_uq').on(t.userId, t.idempotencyKey),
		index('response_user_time_idx').on(t.userId, t.createdAt),
		index('response_item_idx').on(t.itemId)
	]
);
