import { bigint, date, datetime, double, int, json, mysqlEnum, mysqlTable, primaryKey, uniqueIndex, varchar } from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';
import { user } from './user';

// What the scheduler keeps per learner. The shapes mirror the pure module src/lib/learning.

const userRef = () =>
	varchar('user_id', { length: 32 })
		.notNull()
		.references(() => user.id, { onDelete: 'cascade' });

/** Per-learner settings: the exam date and the size of the daily set. */
export const learnerProfile = mysqlTable('learner_profile', {
	userId: userRef().primaryKey(),
	examDate: date('exam_date', { mode: 'string' }),
	dailyItems: int('daily_items', { unsigned: true }).notNull().default(15),
	dailyMinutes: int('daily_minutes', { unsigned: true }).notNull().default(10),
	placementDoneAt: datetime('placement_done_at', { mode: 'date' }),
	updatedAt: datetime('updated_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`)
});

/** One FSRS card per learner per skill (ts-fsrs Card fields, serialised), and the variant seen last. */
export const skillCard = mysqlTable(
	'skill_card',
	{
		userId: userRef(),
		skill: varchar('skill', { length: 64 }).notNull(),
		card: json('card').notNull(),
		due: datetime('due', { mode: 'date' }).notNull(),
		lastItemId: varchar('last_item_id', { length: 160 }),
		updatedAt: datetime('updated_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`)
	},
	(t) => [primaryKey({ columns: [t.userId, t.skill] })]
);

/** A learner's ability estimate per content area (logits), with the number of answers behind it. */
export const areaAbility = mysqlTable(
	'area_ability',
	{
		userId: userRef(),
		area: varchar('area', { length: 48 }).notNull(),
		theta: double('theta').notNull().default(0),
		n: int('n', { unsigned: true }).notNull().default(0),
		updatedAt: datetime('updated_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`)
	},
	(t) => [primaryKey({ columns: [t.userId, t.area] })]
);

/** History of ability estimates, for the progress chart. */
export const abilitySnapshot = mysqlTable(
	'ability_snapshot',
	{
		userId: userRef(),
		area: varchar('area', { length: 48 }).notNull(),
		day: date('day', { mode: 'string' }).notNull(),
		theta: double('theta').notNull()
	},
	(t) => [primaryKey({ columns: [t.userId, t.area, t.day] })]
);

/** A skill's difficulty shared by its variants (logits), calibrated from the generator's prior. */
export const skillDifficulty = mysqlTable('skill_difficulty', {
	skill: varchar('skill', { length: 64 }).primaryKey(),
	beta: double('beta').notNull(),
	n: int('n', { unsigned: true }).notNull().default(0)
});

/** Running sums per item for its statistics (proportion correct, point-biserial, times). */
export const itemStat = mysqlTable('item_stat', {
	itemId: varchar('item_id', { length: 160 }).primaryKey(),
	n: int('n', { unsigned: true }).notNull().default(0),
	sumScore: double('sum_score').notNull().default(0),
	sumCorrect: int('sum_correct', { unsigned: true }).notNull().default(0),
	sumTheta: double('sum_theta').notNull().default(0),
	sumTheta2: double('sum_theta2').notNull().default(0),
	sumThetaCorrect: double('sum_theta_correct').notNull().default(0),
	sumMs: double('sum_ms').notNull().default(0)
});

/** A composed set (placement or daily) so that a closed tab resumes where it stopped. */
export const practiceSet = mysqlTable(
	'practice_set',
	{
		id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
		userId: userRef(),
		kind: mysqlEnum('kind', ['placement', 'daily']).notNull(),
		/** The learner's local learning day (YYYY-MM-DD); placement uses the day it started. */
		day: date('day', { mode: 'string' }).notNull(),
		entries: json('entries').notNull(),
		position: int('position', { unsigned: true }).notNull().default(0),
		createdAt: datetime('created_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`),
		finishedAt: datetime('finished_at', { mode: 'date' })
	},
	(t) => [uniqueIndex('practice_set_user_kind_day_uq').on(t.userId, t.kind, t.day)]
);

export const mockExam = mysqlTable('mock_exam', {
	id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
	userId: userRef(),
	itemIds: json('item_ids').notNull(),
	minutes: int('minutes', { unsigned: true }).notNull(),
	startedAt: datetime('started_at', { mode: 'date' }).notNull(),
	endsAt: datetime('ends_at', { mode: 'date' }).notNull(),
	finishedAt: datetime('finished_at', { mode: 'date' }),
	report: json('report')
});

/** A hidden fault on the bench, set by an author or instructor and shared by a link. */
export const benchChallenge = mysqlTable('bench_challenge', {
	id: varchar('id', { length: 24 }).primaryKey(),
	circuitRef: varchar('circuit_ref', { length: 200 }).notNull(),
	fault: varchar('fault', { length: 120 }).notNull(),
	createdBy: varchar('created_by', { length: 32 }).references(() => user.id, { onDelete: 'set null' }),
	createdAt: datetime('created_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`)
});

/**
 * One person's attempt at a bench challenge: the readings they took (each solved on the server
 * with the hidden fault) and, once they name a fault, the verdict. The score counts these readings.
 */
export const benchAttempt = mysqlTable(
	'bench_attempt',
	{
		challengeId: varchar('challenge_id', { length: 24 })
			.notNull()
			.references(() => benchChallenge.id, { onDelete: 'cascade' }),
		userId: userRef(),
		/** `{ state, red, black }` per reading, in the order taken. */
		readings: json('readings').notNull(),
		/** The verdict of the first fault named; later guesses return it unchanged. */
		result: json('result'),
		createdAt: datetime('created_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`),
		finishedAt: datetime('finished_at', { mode: 'date' })
	},
	(t) => [primaryKey({ columns: [t.challengeId, t.userId] })]
);
