// The circuit loader over the real content/circuits/ folder and over a bad file.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { loadCircuits, prepareCircuit } from './circuits';

describe('loadCircuits', () => {
	it('reads every demo circuit, each with no problem and at least two named states', async () => {
		const all = await loadCircuits();
		expect(all.length).toBeGreaterThanOrEqual(8);
		for (const c of all) {
			expect(c.ok ? [] : c.problems, c.file).toEqual([]);
			if (c.ok) {
				expect(c.states.filter((s) => s.name !== null).length, c.file).toBeGreaterThanOrEqual(2);
				expect(Object.keys(c.diagram.points).length, `${c.file} test points`).toBeGreaterThanOrEqual(3);
			}
		}
	});

	it('energizes the fan relay only when the ground-side switch closes (common practice)', async () => {
		const fan = (await loadCircuits()).find((c) => c.file === 'cooling-fan-relay.yaml');
		if (!fan?.ok) throw new Error('cooling-fan-relay.yaml missing or broken');
		const byName = Object.fromEntries(fan.states.map((s) => [s.name ?? '(defaults)', s]));
		expect(byName.cold.energized).toEqual([]);
		expect(byName.hot.energized).toEqual(['K1']);
		expect(byName.hot.loads).toBe('M1 on');
		expect(byName.cold.loads).toBe('M1 off');
	});

	it('lists a bad file with its problems, one line each, naming the line', () => {
		const c = prepareCircuit('bad.yaml', 'id: bad\nsupply: 12.6\nparts:\n  F1: { type: fuse }\nwires:\n  - B+ F1.1\n');
		expect(c.ok).toBe(false);
		if (c.ok) return;
		expect(c.problems.length).toBeGreaterThanOrEqual(2);
		for (const p of c.problems) expect(p).toMatch(/^line \d+: /);
		expect(c.problems.join('\n')).not.toMatch(/\bat .+:\d+:\d+/); // no stack frames
	});

	it('reads only .yaml files from the folder it is given', async () => {
		const dir = mkdtempSync(path.join(process.env.TMPDIR ?? tmpdir(), 'circuits-'));
		try {
			writeFileSync(path.join(dir, 'notes.txt'), 'not a circuit');
			writeFileSync(path.join(dir, 'one.yaml'), 'id: one\ntitle: One lamp\nsupply: 12\nparts:\n  L1: { type: lamp, watts: 5 }\nwires:\n  - B+ L1.1\n  - L1.2 GND\n');
			const all = await loadCircuits(dir);
			expect(all.map((c) => c.file)).toEqual(['one.yaml']);
			expect(all[0].ok).toBe(true);
		} finally {
			rmSync(dir, { recursive: true, force: true });
		}
	});
});
