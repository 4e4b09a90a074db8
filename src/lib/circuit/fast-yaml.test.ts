/**
 * The fast reader of plain circuit YAML must give exactly what the full `yaml` package (the YAML 1.2
 * reference reader the engine falls back to) gives, or give up. Checked on hand-picked snippets, the
 * golden circuit files, and seeded random mutations of them.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';
import { readSimpleYaml } from './fast-yaml';
import { readFullYaml } from './parse';
import { FAN, LAMP_RELAY } from './test-fixtures';

function agrees(text: string): 'fast' | 'fallback' {
	const fast = readSimpleYaml(text);
	if (fast === null) return 'fallback';
	const full = readFullYaml(text);
	expect(full.problems, text).toEqual([]);
	expect(fast, text).toEqual(full.root);
	return 'fast';
}

const goldenTexts = readdirSync('src/lib/circuit/golden')
	.filter((f) => f.endsWith('.yaml'))
	.map((f) => (parse(readFileSync(`src/lib/circuit/golden/${f}`, 'utf8')) as { circuit: string }).circuit);

describe('fast circuit YAML reader', () => {
	it('reads the spec example, the test circuits and every golden circuit itself, as the yaml package does', () => {
		for (const t of [FAN, LAMP_RELAY, ...goldenTexts]) expect(agrees(t)).toBe('fast');
	});
	const fast: string[] = [
		'supply: 12.6\nparts: {}\n',
		'a: on\nb: off\nc: yes\nd: no\ne: ~\nf: null\ng: true\nh: False\n',
		'n: [1, -2, +3, .5, 1.50, 1e3, 2E-2, 007, "7", \'8\']\n',
		'title: Driver\'s door   # comment\nx: W3#1\n',
		'wires:\n- B+ F1.1\n- "F1.2 K1.86"\n',
		'wires:\n  - { from: K1.87, to: M1.1, id: FAN_FEED, gauge_mm2: 2.5, length_m: 1.5, color: GN/WH }\n',
		'p:\n  S1: { type: switch, positions: { off: [], low: ["B-L"], high: [ "B-H" , "B-L" ] } }\n',
		'fault: { f: open:W3, g: high-resistance:G2:2.5 }\n',
		'a:\n  b:\n    c: 1\n  d: 2\ne: 3\r\n',
		'k: -x\nm: -5x\n'
	];
	for (const t of fast) it(`reads ${JSON.stringify(t)} itself`, () => expect(agrees(t)).toBe('fast'));
	const fallback: string[] = [
		'a: 0x1F\n',
		'a: .inf\n',
		'a: &x 1\nb: *x\n',
		'a: |\n  text\n',
		'a: { b: 1,\n  c: 2 }\n',
		'a:\n',
		'a: 1\na: 2\n',
		'a:\n  - b: 1\n',
		'title: Fan: relay\n',
		'a:\t1\n',
		'---\na: 1\n',
		'a: "x\\ty"\n',
		"a: 'it''s'\n",
		'1: one\n',
		'a: [b: 1]\n',
		'a: { b: 1, }\n',
		'plain\n'
	];
	for (const t of fallback) it(`leaves ${JSON.stringify(t)} to the full reader`, () => expect(agrees(t)).toBe('fallback'));

	it('agrees with the yaml package on 4000 seeded random mutations of the golden circuits', () => {
		let seed = 20261201;
		const rnd = (n: number) => {
			seed = (seed * 1103515245 + 12345) % 2147483648;
			return seed % n;
		};
		const alphabet = ' :-,#[]{}"\'\n.0123456789abcKW';
		let fastCount = 0;
		for (let t = 0; t < 4000; t++) {
			let s = goldenTexts[t % goldenTexts.length];
			for (let m = 0; m < 1 + rnd(3); m++) {
				const at = rnd(s.length);
				const op = rnd(5);
				if (op === 0) s = s.slice(0, at) + s.slice(at + 1);
				else if (op === 1) s = s.slice(0, at) + alphabet[rnd(alphabet.length)] + s.slice(at);
				else if (op === 2) s = s.slice(0, at) + alphabet[rnd(alphabet.length)] + s.slice(at + 1);
				else {
					// indent a line by two, or repeat a line
					const ls = s.split('\n');
					const li = rnd(ls.length);
					if (op === 3) ls[li] = '  ' + ls[li];
					else ls.splice(li, 0, ls[li]);
					s = ls.join('\n');
				}
			}
			const fast = readSimpleYaml(s);
			if (fast === null) continue;
			fastCount++;
			const full = readFullYaml(s);
			expect(full.problems, s).toEqual([]);
			expect(fast, s).toEqual(full.root);
		}
		// most mutations keep the text in the plain subset, so the comparison is not empty
		expect(fastCount).toBeGreaterThan(1000);
	});
});
