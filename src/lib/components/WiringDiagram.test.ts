// Server-side render of the diagram component (what the first page load sends): accessible names
// from the circuit file's netlist, one tab stop, the overlay legend.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { render } from 'svelte/server';
import WiringDiagram from './WiringDiagram.svelte';
import CircuitGallery from './CircuitGallery.svelte';
import { readDiagramCircuit } from '$lib/diagram';
import { loadCircuits } from '$lib/server/content/circuits';

const text = readFileSync('content/circuits/cooling-fan-relay.yaml', 'utf8');

describe('WiringDiagram (server render)', () => {
	it('names every part and wire, with one tab stop', () => {
		const { circuit, diagram } = readDiagramCircuit(text);
		const { body } = render(WiringDiagram, { props: { circuit: diagram, mode: 'select', state: 'cold' } });
		for (const w of circuit.wires) expect(body).toMatch(new RegExp(`data-item="${w.id}"[^>]*aria-label="wire ${w.id}, `));
		for (const p of circuit.parts) expect(body, p.id).toContain(`data-item="${p.id}"`);
		// cooling-fan-relay.yaml: { from: K1.85, to: S1.1, color: GN/BK }
		expect(body).toContain('aria-label="wire W3, relay K1 pin 85 to switch S1 pin 1, colour GN/BK"');
		expect(body).toContain('aria-label="switch S1, open"'); // state cold: { S1: open }
		expect(body.match(/tabindex="0"/g)?.length).toBe(1);
		expect(body).toContain('aria-live="polite"');
	});

	it('lists each overlay set in a legend', () => {
		const { diagram } = readDiagramCircuit(text);
		const overlays = [
			{ name: 'control path', elements: ['F1', 'K1.coil', 'S1', 'W1', 'W2', 'W3', 'W4'] },
			{ name: 'load path', elements: ['F2', 'K1.contact', 'M1', 'W5', 'W6', 'FAN_FEED', 'W8'] }
		];
		const { body } = render(WiringDiagram, { props: { circuit: diagram, mode: 'overlay', state: 'hot', overlays } });
		expect(body).toContain('control path');
		expect(body).toContain('load path');
		expect(body.match(/class="sp-halo"/g)?.length).toBe(8); // one halo per wire in the two sets
	});
});

describe('CircuitGallery (server render)', () => {
	it('draws every circuit file in each of its states', async () => {
		const circuits = await loadCircuits();
		const { body } = render(CircuitGallery, { props: { circuits } });
		const expected = circuits.reduce((n, c) => n + (c.ok ? c.states.length : 0), 0);
		expect(body.match(/<svg[^>]*data-circuit=/g)?.length).toBe(expected);
	});
});
