/**
 * The content build's command line: good content ends with the JSON counts line and exit 0; a bad
 * item file gives one stderr line naming file, line, what is wrong and what to do, and exit 1; no
 * stack trace either way. Runs in a scratch project folder under .tmp/ with one family variant.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const ROOT = resolve('.');
mkdirSync(join(ROOT, '.tmp'), { recursive: true });
const dir = mkdtempSync(join(ROOT, '.tmp', 'content-build-'));
cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });

function run(...args: string[]) {
	const r = spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'scripts/content-build.ts'), ...args], {
		cwd: dir,
		encoding: 'utf8',
		env: { ...process.env, TMPDIR: join(ROOT, '.tmp') },
		timeout: 120_000
	});
	return { code: r.status, out: r.stdout, err: r.stderr };
}

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('npm run content:build -- --check', () => {
	it('passes on the project content and ends with one JSON line of counts', () => {
		const r = run('--check', '--variants', '1');
		expect(r.err).not.toMatch(/\n\s+at /);
		expect(r.code).toBe(0);
		const last = JSON.parse(r.out.trim().split('\n').pop()!);
		expect(Object.keys(last)).toEqual(['items', 'families', 'kinds', 'areas', 'errors']);
		expect(last.errors).toBe(0);
		expect(last.families).toBeGreaterThanOrEqual(10);
		expect(Object.keys(last.kinds)).toHaveLength(7);
	}, 120_000);

	it('refuses a bad item with file, line, what is wrong and what to do, and exits 1', () => {
		writeFileSync(
			join(dir, 'content/items/bad.md'),
			['---', 'id: bad-item', 'area: meters-basics', 'skill: reading-classes', 'kind: choose-one', 'circuit: content/circuits/cooling-fan-relay.yaml', 'ask: { reads: Z, state: hot }', '---', 'Stem.'].join('\n')
		);
		const r = run('--check', '--variants', '1');
		expect(r.code).toBe(1);
		expect(r.err).toContain('content/items/bad.md:7: point "Z" is not a labelled point of the circuit; use one of A, B, C, D');
		expect(r.err).not.toMatch(/\n\s+at /);
		expect(JSON.parse(r.out.trim().split('\n').pop()!).errors).toBe(1);
	}, 120_000);

	it('refuses an unknown option with a message', () => {
		const r = run('--fast');
		expect(r.code).toBe(1);
		expect(r.err).toMatch(/unknown option "--fast"; use --check/);
	});
});
