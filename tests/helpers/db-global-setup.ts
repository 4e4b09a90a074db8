// Global setup of the "db" vitest project: the database that scripts/test.sh started, migrated once.
import { closeDb } from '../../src/lib/server/db/client';
import { migrateDatabase } from '../../src/lib/server/db/migrate';

export default async function setup(): Promise<void> {
	if (!process.env.DATABASE_URL) {
		throw new Error('The db tests need the test database: run them through `npm test` (scripts/test.sh), which starts it.');
	}
	await migrateDatabase();
	await closeDb();
}
