import { defineConfig } from 'drizzle-kit';

// Only `drizzle-kit generate` is used: push/pull do not work against MariaDB 10.11.
// Migrations are applied from code (src/lib/server/db/migrate.ts).
export default defineConfig({
	dialect: 'mysql',
	schema: './src/lib/server/db/schema/index.ts',
	out: './drizzle'
});
