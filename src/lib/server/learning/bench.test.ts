// The bench's scoring helpers against the engine on a demo circuit (content/circuits/horn-relay.yaml).
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { readDiagramCircuit } from '$lib/diagram';
import { solveCircuit } from '$lib/circuit';
import { benchCautions, complaintOf, engineTests, noticeableFaults, sameSymptoms } from './bench';

const { circuit } = readDiagramCircuit(readFileSync('content/circuits/horn-relay.yaml', 'utf8'));

describe('the bench', () => {
	it('offers only faults that change what the customer notices', () => {
		const normal = JSON.stringify(complaintOf(circuit, null));
		const faults = noticeableFaults(circuit);
		expect(faults.length).toBeGreaterThan(0);
		for (const f of faults) expect(JSON.stringify(complaintOf(circuit, f))).not.toBe(normal);
	});

	it('reads the complaint from the engine: an open horn is off when the button is pressed (common practice: an open load does not work)', () => {
		const horn = circuit.parts.find((p) => p.type === 'horn')!;
		const pressed = circuit.states.find((s) => /press/.test(s.name))!.name;
		const c = complaintOf(circuit, `open:${horn.id}`).find((o) => o.state === pressed)!;
		expect(c.parts[horn.id]).toBe('off');
		const r = solveCircuit(circuit, { state: pressed });
		if ('error' in r) throw new Error('the demo circuit should not short');
		expect(r.parts[horn.id].status).toBe('on');
	});

	it('counts a finite number of engine readings, and treats a fault as the same as itself', () => {
		for (const f of noticeableFaults(circuit).slice(0, 5)) {
			const n = engineTests(circuit, f);
			expect(n).toBeGreaterThanOrEqual(0);
			expect(n).toBeLessThan(12);
			expect(sameSymptoms(circuit, f, f)).toBe(true);
		}
	});

	// reference-values.md, "Safety cautions": batteries give off hydrogen (CCOHS); airbag circuits are never
	// probed with a test lamp or an ordinary meter; the maker's service information comes first.
	it('shows the safety cautions of what a workshop circuit is: battery and starting, airbag; none for a horn', () => {
		const starter = readDiagramCircuit(readFileSync('content/circuits/starter-solenoid.yaml', 'utf8'));
		const ids = benchCautions(starter.circuit, starter.diagram.title, 'starter-solenoid').map((c) => c.id);
		expect(ids).toEqual(expect.arrayContaining(['hydrogen', 'ground-first', 'service-info']));
		expect(benchCautions(circuit, 'Horn relay with a feed-side horn button', 'horn-relay')).toEqual([]);
		expect(benchCautions(circuit, 'Airbag squib loop monitor current', 'i.12').map((c) => c.id)).toContain('airbag');
	});
});
