import { asc, count, eq, like, or } from 'drizzle-orm';
import { getDb } from '../db/client';
import { school, user } from '../db/schema';
import type { Role } from '../auth/roles';
import { rolesOfMany } from './roles';

export const PAGE_SIZE = 20;

export type DirectoryEntry = {
	id: string;
	email: string;
	name: string;
	school: string | null;
	roles: Role[];
	createdAt: Date;
};

function escapeLike(text: string): string {
	return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** People whose e-mail or name contains `query`, ordered by e-mail, one page at a time (pages count from 1). */
export async function searchPeople(query: string, page: number, pageSize = PAGE_SIZE) {
	const db = getDb();
	const q = query.trim();
	const where = q ? or(like(user.email, `%${escapeLike(q)}%`), like(user.name, `%${escapeLike(q)}%`)) : undefined;
	const [{ total } = { total: 0 }] = await db.select({ total: count() }).from(user).where(where);
	const pages = Math.max(1, Math.ceil(total / pageSize));
	const current = Math.min(Math.max(1, page), pages);
	const rows = await db
		.select({
			id: user.id,
			email: user.email,
			name: user.name,
			school: school.name,
			createdAt: user.createdAt
		})
		.from(user)
		.leftJoin(school, eq(user.schoolId, school.id))
		.where(where)
		.orderBy(asc(user.email))
		.limit(pageSize)
		.offset((current - 1) * pageSize);
	const roles = await rolesOfMany(rows.map((r) => r.id));
	const people: DirectoryEntry[] = rows.map((r) => ({ ...r, roles: roles.get(r.id) ?? [] }));
	return { people, total, page: current, pages };
}
