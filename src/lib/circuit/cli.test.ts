/**
 * The command line, spawned as `npx tsx scripts/circuit.ts` on temporary files (spec "The command
 * line": four commands, JSON on stdout, bad input exits 1 with `line N: key: message` lines on stderr).
 */
import { execFile } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { FAN } from './test-fixtures';

type Run = { code: number; stdout: string; stderr: string };

function cli(args: string[]): Promise<Run> {
	return new Promise((resolve) => {
		execFile('npx', ['tsx', 'scripts/circuit.ts', ...args], { cwd: process.cwd(), env: { ...process.env, TMPDIR: tmpRoot } }, (err, stdout, stderr) => {
			resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr });
		});
	});
}

const tmpRoot = join(process.cwd(), '.tmp');
let dir = '';
let fan = '';
let bad = '';
let short = '';
const runs: Record<string, Promise<Run>> = {};

beforeAll(() => {
	mkdirSync(tmpRoot, { recursive: true });
	dir = mkdtempSync(join(tmpRoot, 'cli-test-'));
	fan = join(dir, 'fan.yaml');
	bad = join(dir, 'bad.yaml');
	short = join(dir, 'short.yaml');
	writeFileSync(fan, FAN);
	writeFileSync(bad, FAN.replace('  F1: { type: fuse, amps: 10 }', '  F1: { type: fuse, amps: 10, colour: red }').replace('M1.2 G2', 'M1.2 G9'));
	writeFileSync(short, 'supply: 12.6\nparts:\n  S1: { type: switch, normally: closed }\nwires:\n  - B+ S1.1\n  - S1.2 GND\n');
	// start every run at once: each spawn pays tsx's start-up
	runs.solve = cli(['solve', fan, '--state', 'on', '--fault', 'open:W4']);
	runs.lamp = cli(['solve', fan, '--state', 'off', '--lamp', 'A']);
	runs.check = cli(['check', fan]);
	runs.bad = cli(['check', bad]);
	runs.missing = cli(['solve', join(dir, 'nope.yaml')]);
	runs.flag = cli(['solve', fan, '--colour', 'red']);
	runs.fault = cli(['solve', fan, '--fault', 'open:W42']);
	runs.short = cli(['solve', short]);
	runs.paths = cli(['paths', fan, '--state', 'on', '--through', 'M1']);
	runs.diagnose = cli(['diagnose', fan, '--observe', 'on: M1=off, K1=energized; off: A=supply']);
});

describe('circuit command line', () => {
	it('solve prints the result object with the spec key order', async () => {
		const r = await runs.solve;
		expect(r.code).toBe(0);
		const out = JSON.parse(r.stdout);
		expect(Object.keys(out)).toEqual(['state', 'fault', 'nodes', 'points', 'parts']);
		expect(out.fault).toBe('open:W4');
		// common practice: with an open on the ground side, every point up to the open reads source volts
		expect(out.points.A).toEqual({ volts: 12.6, reads: 'supply' });
		expect(Object.keys(out.nodes).slice(0, 4)).toEqual(['B+', 'GND', 'F1.1', 'F1.2']);
	});
	it('solve --lamp adds the lamp status', async () => {
		const out = JSON.parse((await runs.lamp).stdout);
		expect(Object.keys(out).at(-1)).toBe('lamp');
		// A (K1.85) is fed through the 80 Ω coil: 12.6 V over 80 + 7.56 Ω is 0.144 A against the lamp's own 1.667 A, so dark
		expect(out.lamp).toBe('dark');
	});
	it('check prints nothing and exits 0 for a good file', async () => {
		const r = await runs.check;
		expect(r).toEqual({ code: 0, stdout: '', stderr: '' });
	});
	it('check lists every error of a bad file, one per line, and exits 1', async () => {
		const r = await runs.bad;
		expect(r.code).toBe(1);
		expect(r.stdout).toBe('');
		expect(r.stderr.trim().split('\n')).toEqual([
			'line 4: parts.F1.colour: unknown key "colour" on F1 (a fuse); allowed: type, amps',
			'line 10: parts.G2: ground G2 is not wired; wire it or remove it',
			'line 19: wires.W8: unknown node "G9"; use B+, GND, PART.PIN or a splice or ground id'
		]);
	});
	it('a missing file, an unknown flag and a bad fault each exit 1 with one line and no stack trace', async () => {
		for (const [name, key] of [
			['missing', 'FILE'],
			['flag', '--colour'],
			['fault', 'fault']
		] as const) {
			const r = await runs[name];
			expect(r.code, name).toBe(1);
			const lines = r.stderr.trim().split('\n');
			expect(lines, name).toHaveLength(1);
			expect(lines[0], name).toMatch(new RegExp(`^line 0: ${key.replace(/[-]/g, '\\-')}: `));
			expect(r.stderr, name).not.toMatch(/\n\s+at /);
		}
	});
	it('a dead short prints the dead-short object and exits 1', async () => {
		const r = await runs.short;
		expect(r.code).toBe(1);
		expect(JSON.parse(r.stdout)).toEqual({ state: null, fault: null, error: 'dead-short', elements: ['S1', 'W1', 'W2'] });
	});
	it('paths prints the elements of the motor circuit', async () => {
		const r = await runs.paths;
		expect(r.code).toBe(0);
		expect(JSON.parse(r.stdout)).toEqual({ elements: ['F2', 'K1.contact', 'M1', 'G2', 'W5', 'W6', 'FAN_FEED', 'W8'] });
	});
	it('diagnose prints candidates and the next test', async () => {
		const r = await runs.diagnose;
		expect(r.code).toBe(0);
		const d = JSON.parse(r.stdout);
		expect(Object.keys(d)).toEqual(['candidates', 'next_test']);
		expect(d.candidates).toContain('open:FAN_FEED');
		expect(d.candidates).not.toContain('none');
		expect(Object.keys(d.next_test)).toEqual(['state', 'point', 'expected_left', 'outcomes']);
	});
});
