import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	server: { host: '127.0.0.1' },
	test: {
		projects: [
			{
				// Pure modules and anything else that needs neither a database nor a running app.
				// The circuit engine's ngspice cross-check runs here, hence the long timeout.
				extends: true,
				test: {
					name: 'unit',
					environment: 'node',
					include: ['src/**/*.test.ts', 'tests/unit/**/*.test.ts'],
					exclude: ['src/**/*.db.test.ts'],
					testTimeout: 120_000
				}
			},
			{
				// Server modules against the real MariaDB that scripts/test.sh starts (DATABASE_URL).
				extends: true,
				test: {
					name: 'db',
					environment: 'node',
					include: ['src/**/*.db.test.ts'],
					globalSetup: ['tests/helpers/db-global-setup.ts'],
					fileParallelism: false,
					testTimeout: 30_000
				}
			},
			{
				// HTTP and browser tests against the built app, started through scripts/start.sh.
				extends: true,
				test: {
					name: 'app',
					environment: 'node',
					include: ['tests/app/**/*.test.ts', 'tests/e2e/**/*.test.ts'],
					globalSetup: ['tests/helpers/app-global-setup.ts'],
					fileParallelism: false,
					testTimeout: 60_000,
					hookTimeout: 120_000
				}
			}
		]
	}
});
