import { datetime, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { user } from './user';

// The shape lucia's DrizzleMySQLAdapter expects: id, user_id, expires_at.
export const session = mysqlTable('session', {
	id: varchar('id', { length: 255 }).primaryKey(),
	userId: varchar('user_id', { length: 32 })
		.notNull()
		.references(() => user.id, { onDelete: 'cascade' }),
	expiresAt: datetime('expires_at', { mode: 'date' }).notNull()
});

export type Session = typeof session.$inferSelect;
