// The diagram command line (scripts/diagram.ts), run as a person runs it.
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';

function run(...args: string[]) {
	const r = spawnSync('npx', ['--no-install', 'tsx', 'scripts/diagram.ts', ...args], { encoding: 'utf8', timeout: 60_000 });
	return { code: r.status, out: r.stdout, err: r.stderr };
}

describe('npm run diagram', () => {
	it('writes one standalone SVG with an id on every part and wire', () => {
		const r = run('content/circuits/cooling-fan-relay.yaml', '--state', 'hot', '--highlight', 'path:M1');
		expect(r.code).toBe(0);
		expect(r.out.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
		expect(r.out.trim().endsWith('</svg>')).toBe(true);
		// No external references: no href, no url(), no @import.
		expect(r.out).not.toMatch(/href=|url\(|@import/);
		for (const id of ['F1', 'F2', 'K1', 'S1', 'M1', 'G1', 'G2', 'W1', 'W2', 'W3', 'W4', 'W5', 'W6', 'FAN_FEED', 'W8'])
			expect(r.out, id).toContain(`data-id="${id}"`);
		expect(r.out).toContain('data-overlay="path through M1"');
	});

	it('is byte-identical from one run to the next', () => {
		const a = run('content/circuits/wiper-park.yaml', '--state', 'low');
		const b = run('content/circuits/wiper-park.yaml', '--state', 'low');
		expect(a.code).toBe(0);
		expect(a.out).toBe(b.out);
	});

	it.each([
		[['content/circuits/cooling-fan-relay.yaml', '--state', 'warm'], /unknown state "warm"; the file has: cold, hot/],
		[['content/circuits/cooling-fan-relay.yaml', '--fault', 'melted:W1'], /unknown fault kind "melted"/],
		[['content/circuits/cooling-fan-relay.yaml', '--highlight', 'M1'], /--highlight takes path:ELEMENT/],
		[['content/circuits/none.yaml'], /cannot read content\/circuits\/none.yaml/],
		[[], /no circuit file given/],
		[['content/circuits/cooling-fan-relay.yaml', '--colour'], /unknown option --colour/]
	])('bad input %j: one clear line per problem, exit 1, no stack trace', (args, message) => {
		const r = run(...args);
		expect(r.code).toBe(1);
		expect(r.out).toBe('');
		expect(r.err).toMatch(message);
		expect(r.err).not.toMatch(/\n\s+at /);
		for (const line of r.err.trim().split('\n')) expect(line.startsWith('diagram: ')).toBe(true);
	});

	it('lists every problem of a bad circuit file with its line', () => {
		const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), 'diagram-cli-'));
		try {
			const file = path.join(dir, 'bad.yaml');
			writeFileSync(file, 'id: bad\nsupply: 12.6\nparts:\n  F1: { type: fuse }\n  L1: { type: lamp, watts: 5, ohms: 2 }\nwires:\n  - B+ F1.1\n');
			const r = run(file);
			expect(r.code).toBe(1);
			const lines = r.err.trim().split('\n');
			expect(lines.length).toBeGreaterThanOrEqual(3);
			for (const l of lines) expect(l).toMatch(/^diagram: line \d+: /);
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	});
});
