import { eq } from 'drizzle-orm';
import { getDb } from '../db/client';
import { school } from '../db/schema';

/** The id of the school with this name, creating it when missing (idempotent). */
export async function ensureSchool(name: string): Promise<number> {
	const db = getDb();
	await db.insert(school).values({ name }).onDuplicateKeyUpdate({ set: { name } });
	const [row] = await db.select({ id: school.id }).from(school).where(eq(school.name, name));
	if (!row) throw new Error(`school "${name}" was not stored`);
	return row.id;
}

export async function schoolName(id: number | null): Promise<string | null> {
	if (id === null) return null;
	const [row] = await getDb().select({ name: school.name }).from(school).where(eq(school.id, id));
	return row?.name ?? null;
}
