import { bigint, datetime, mysqlTable, varchar } from 'drizzle-orm/mysql-core';
import { sql } from 'drizzle-orm';

export const school = mysqlTable('school', {
	id: bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey(),
	name: varchar('name', { length: 200 }).notNull().unique(),
	createdAt: datetime('created_at', { mode: 'date' })
		.notNull()
		.default(sql`CURRENT_TIMESTAMP`)
});

export type School = typeof school.$inferSelect;
export type NewSchool = typeof school.$inferInsert;
