import { datetime, int, mysqlEnum, mysqlTable, primaryKey, varchar } from 'drizzle-orm/mysql-core';

// Failed sign-ins counted per account (e-mail) and per client address, in a fixed window.
export const signInThrottle = mysqlTable(
	'sign_in_throttle',
	{
		scope: mysqlEnum('scope', ['account', 'client']).notNull(),
		subject: varchar('subject', { length: 254 }).notNull(),
		failures: int('failures', { unsigned: true }).notNull().default(0),
		windowStartedAt: datetime('window_started_at', { mode: 'date' }).notNull(),
		lockedUntil: datetime('locked_until', { mode: 'date' })
	},
	(t) => [primaryKey({ columns: [t.scope, t.subject] })]
);

export type SignInThrottle = typeof signInThrottle.$inferSelect;
