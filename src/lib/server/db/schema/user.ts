import { bigint, datetime, mysqlEnum, mysqlTable, primaryKey, varchar } from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';
import { school } from './school';
import { ROLES } from '../../auth/roles';

export const user = mysqlTable('user', {
	// lucia's user ids are strings; ours are random base32 ids from generateIdFromEntropySize.
	id: varchar('id', { length: 32 }).primaryKey(),
	email: varchar('email', { length: 254 }).notNull().unique(),
	name: varchar('name', { length: 120 }).notNull(),
	passwordHash: varchar('password_hash', { length: 255 }).notNull(),
	// IANA zone name; the daily set and reminders count days in it.
	timeZone: varchar('time_zone', { length: 64 }).notNull().default('UTC'),
	schoolId: bigint('school_id', { mode: 'number', unsigned: true }).references(() => school.id, {
		onDelete: 'set null'
	}),
	// Set by the e-mail verification flow (not built yet); null = not verified.
	emailVerifiedAt: datetime('email_verified_at', { mode: 'date' }),
	createdAt: datetime('created_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`)
});

export const userRole = mysqlTable(
	'user_role',
	{
		userId: varchar('user_id', { length: 32 })
			.notNull()
			.references(() => user.id, { onDelete: 'cascade' }),
		role: mysqlEnum('role', ROLES).notNull(),
		grantedAt: datetime('granted_at', { mode: 'date' })
			.notNull()
			.default(sql`CURRENT_TIMESTAMP`)
	},
	(t) => [primaryKey({ columns: [t.userId, t.role] })]
);

export type User = typeof user.$inferSelect;
export type NewUser = typeof user.$inferInsert;
export type UserRole = typeof userRole.$inferSelect;
