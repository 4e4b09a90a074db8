import { afterAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { sql } from 'drizzle-orm';
import { closeDb, getDb } from './client';
import { migrateDatabase } from './migrate';

afterAll(closeDb);

describe('migrations (MariaDB)', () => {
	it('records every committed migration once, and a second run changes nothing', async () => {
		const journal = JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as { entries: unknown[] };
		await migrateDatabase();
		const [rows] = (await getDb().execute(sql`SELECT COUNT(*) AS n FROM __drizzle_migrations`)) as unknown as [
			{ n: number }[]
		];
		expect(Number(rows[0]!.n)).toBe(journal.entries.length);
	});

	it('creates the tables the app needs', async () => {
		const [rows] = (await getDb().execute(
			sql`SELECT table_name AS t FROM information_schema.tables WHERE table_schema = DATABASE()`
		)) as unknown as [{ t: string }[]];
		expect(rows.map((r) => r.t)).toEqual(
			expect.arrayContaining(['school', 'user', 'user_role', 'session', 'sign_in_throttle'])
		);
	});
});
