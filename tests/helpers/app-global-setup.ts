// Global setup of the "app" vitest project: the built app, started through the same script as `npm start`
// (scripts/start.sh), pointed at the test server's app database, without rebuilding.
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';

let child: ChildProcess | undefined;

export default async function setup(): Promise<() => Promise<void>> {
	const port = process.env.TEST_APP_PORT;
	const dbName = process.env.TEST_APP_DB_NAME;
	if (!port || !dbName || !process.env.DB_PORT || !process.env.DB_DATA_DIR) {
		throw new Error('The app tests need the test database and a built app: run them through `npm test`.');
	}
	let output = '';
	child = spawn('bash', ['scripts/start.sh'], {
		env: { ...process.env, APP_PORT: port, DB_NAME: dbName, SKIP_BUILD: '1', ORIGIN: '' },
		detached: true,
		stdio: ['ignore', 'pipe', 'pipe']
	});
	child.stdout?.on('data', (d) => (output += d));
	child.stderr?.on('data', (d) => (output += d));
	const deadline = Date.now() + 90_000;
	while (!output.includes('Splicepoint is running at')) {
		if (child.exitCode !== null) throw new Error(`scripts/start.sh exited (${child.exitCode}):\n${output}`);
		if (Date.now() > deadline) throw new Error(`scripts/start.sh did not report the app running:\n${output}`);
		await new Promise((r) => setTimeout(r, 200));
	}
	process.env.TEST_START_OUTPUT = output;
	return async () => {
		if (!child?.pid || child.exitCode !== null) return;
		process.kill(-child.pid, 'SIGTERM');
		await once(child, 'exit');
	};
}
