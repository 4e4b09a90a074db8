// Applies migrations and seeds the demo school; run by scripts/start.sh before the app starts.
import { closeDb } from '../src/lib/server/db/client';
import { migrateDatabase } from '../src/lib/server/db/migrate';
import { seedDemo } from '../src/lib/server/seed/demo';

try {
	await migrateDatabase();
	const { created, existing } = await seedDemo();
	console.log(`[db] migrations applied; demo accounts: ${created.length} created, ${existing.length} already there`);
} catch (err) {
	console.error(`[db] could not prepare the database: ${err instanceof Error ? err.message : String(err)}`);
	process.exitCode = 1;
} finally {
	await closeDb();
}
