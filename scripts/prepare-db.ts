// Applies migrations and seeds the demo school; run by scripts/start.sh before the app starts.
// Progress goes to stderr; stdout is the demo sign-in list.
import { closeDb } from '../src/lib/server/db/client';
import { migrateDatabase } from '../src/lib/server/db/migrate';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SCHOOL, seedDemo } from '../src/lib/server/seed/demo';
import { seedBank } from '../src/lib/server/seed/bank';

try {
	await migrateDatabase();
	const { created, existing } = await seedDemo();
	console.error(`[db] migrations applied; demo accounts: ${created.length} created, ${existing.length} already there`);
	const bank = await seedBank();
	console.error(
		`[db] item bank: ${bank.store.newItems} new items, ${bank.store.newVersions} new versions, ${bank.store.unchanged} unchanged; ${bank.familiesApproved} families and ${bank.itemsApproved} items approved for the demo`
	);
	// stdout carries only the sign-in list, which scripts/start.sh prints beside the address.
	const width = Math.max(...DEMO_ACCOUNTS.map((a) => a.email.length)) + 3;
	console.log(`  Demo sign-ins at ${DEMO_SCHOOL} (password for all: ${DEMO_PASSWORD}):`);
	for (const a of DEMO_ACCOUNTS) console.log(`    ${a.email.padEnd(width)}${a.role.replace('_', ' ')}`);
} catch (err) {
	console.error(`[db] could not prepare the database: ${err instanceof Error ? err.message : String(err)}`);
	process.exitCode = 1;
} finally {
	await closeDb();
}
