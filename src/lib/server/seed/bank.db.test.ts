import { afterAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { and, eq, isNotNull, sql } from 'drizzle-orm';
import { closeDb, getDb } from '../db/client';
import { item, itemFamily, itemVersion, review } from '../db/schema';
import { FAMILIES } from '../../items/families';
import { seedDemo } from './demo';
import { seedBank } from './bank';

afterAll(closeDb);

const total = async (table: typeof item | typeof itemVersion | typeof review) => {
	const [r] = await getDb().select({ n: sql<number>`count(*)` }).from(table);
	return Number(r.n);
};

describe('demo bank seed (MariaDB)', () => {
	it('stores and publishes the shipped bank, and a second run adds nothing', async () => {
		await seedDemo();
		const first = await seedBank();
		expect(first.buildErrors).toBe(0);
		const counts = { items: await total(item), versions: await total(itemVersion), reviews: await total(review) };

		const second = await seedBank();
		expect(second).toMatchObject({ familiesApproved: 0, itemsApproved: 0, demoItems: 0 });
		expect(second.store).toMatchObject({ newItems: 0, newVersions: 0, newFamilies: 0, familiesBackToReview: 0 });
		expect({ items: await total(item), versions: await total(itemVersion), reviews: await total(review) }).toEqual(counts);

		const [published] = await getDb()
			.select({ n: sql<number>`count(*)` })
			.from(item)
			.innerJoin(itemVersion, eq(itemVersion.id, item.publishedVersionId))
			.where(and(eq(item.status, 'published'), isNotNull(item.familyId)));
		expect(Number(published.n)).toBeGreaterThanOrEqual(2000);
		const fams = await getDb().select().from(itemFamily).where(eq(itemFamily.status, 'approved'));
		for (const f of FAMILIES) expect(fams.map((x) => x.id)).toContain(f.id);
		const demo = await getDb().select({ id: item.id, status: item.status }).from(item).where(sql`${item.id} like 'demo-fan-relay-%'`);
		expect(demo.map((d) => d.status).sort()).toEqual(['draft', 'in_review', 'in_review']);
	}, 180_000);

	it('npm run content:build (no --check) writes to the database given by the settings, idempotently', () => {
		const run = () =>
			spawnSync(process.execPath, ['--import', 'tsx', 'scripts/content-build.ts', '--variants', '1', '--seed', 'db-mode'], {
				encoding: 'utf8',
				env: { ...process.env },
				timeout: 150_000
			});
		const first = run();
		expect(first.stderr).not.toMatch(/\n\s+at /);
		expect(first.status).toBe(0);
		const written = /database: (\d+) new items, (\d+) new versions/.exec(first.stderr);
		expect(written, first.stderr).not.toBeNull();
		expect(Number(written![1]) + Number(written![2])).toBeGreaterThan(0);
		expect(first.stderr).toMatch(/storing \[#+\] \d+\/\d+/);
		const second = run();
		expect(second.status).toBe(0);
		expect(second.stderr).toMatch(/database: 0 new items, 0 new versions \(0 with a changed key, back in review\), \d+ unchanged/);
	}, 320_000);
});
