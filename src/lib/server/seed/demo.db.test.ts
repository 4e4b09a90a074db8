import { afterAll, describe, expect, it } from 'vitest';
import { count, eq, like } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { school, user, userRole } from '../db/schema';
import { ROLES } from '../auth/roles';
import { verifyPassword } from '../auth/password';
import { DEMO_PASSWORD, DEMO_SCHOOL, seedDemo } from './demo';

afterAll(closeDb);

describe('demo seed (MariaDB)', () => {
	it('creates one account per role at the demo school, and a second run adds nothing', async () => {
		const first = await seedDemo();
		const second = await seedDemo();
		expect(second.created).toEqual([]);
		expect(second.existing).toHaveLength(ROLES.length);
		expect(first.created.length + first.existing.length).toBe(ROLES.length);

		const db = getDb();
		const schools = await db.select().from(school).where(eq(school.name, DEMO_SCHOOL));
		expect(schools).toHaveLength(1);
		const people = await db.select().from(user).where(like(user.email, '%@harrowcreek.example'));
		const demo = people.filter((p) => p.schoolId === schools[0]!.id);
		expect(demo).toHaveLength(ROLES.length);
		// RFC 2606 §3: example. is reserved, so demo e-mails can never reach a real person.
		expect(demo.every((p) => p.email.endsWith('.example'))).toBe(true);
		for (const p of demo) expect(await verifyPassword(p.passwordHash, DEMO_PASSWORD)).toBe(true);

		const perRole = await db
			.select({ role: userRole.role, n: count() })
			.from(userRole)
			.innerJoin(user, eq(user.id, userRole.userId))
			.where(eq(user.schoolId, schools[0]!.id))
			.groupBy(userRole.role);
		expect(Object.fromEntries(perRole.map((r) => [r.role, r.n]))).toEqual(Object.fromEntries(ROLES.map((r) => [r, 1])));
	});
});
