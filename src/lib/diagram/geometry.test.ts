// checkDrawing: silent on clean drawings, and it catches each kind of fault when one is made on purpose.
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { checkDrawing, layoutCircuit, readDiagramCircuit } from './index';

const files = readdirSync('content/circuits').filter((f) => f.endsWith('.yaml'));
const fan = readDiagramCircuit(readFileSync('content/circuits/cooling-fan-relay.yaml', 'utf8'));

describe('checkDrawing', () => {
	it('finds nothing wrong with the demo circuits', () => {
		for (const f of files) {
			const { circuit, diagram } = readDiagramCircuit(readFileSync(`content/circuits/${f}`, 'utf8'));
			expect(checkDrawing(layoutCircuit(diagram), circuit.wires), f).toEqual([]);
		}
	});

	it('reports a symbol moved onto another, a wire moved off its pin, and overlapping segments', () => {
		const d = layoutCircuit(fan.diagram);
		const f1 = d.parts.find((p) => p.id === 'F1')!;
		const moved = { ...d, parts: d.parts.map((p) => (p.id === 'F2' ? { ...p, x: f1.x, y: f1.y } : p)) };
		expect(checkDrawing(moved)).toContain('symbols F1 and F2 overlap');
		const w3 = d.wires.find((w) => w.id === 'W3')!;
		const offPin = { ...d, wires: d.wires.map((w) => (w.id === 'W3' ? { ...w, points: [[w3.points[0][0] + 10, w3.points[0][1]] as [number, number], ...w3.points.slice(1)] } : w)) };
		expect(checkDrawing(offPin, fan.circuit.wires)).toContain('wire W3 does not end on K1.85');
		const w1 = d.wires.find((w) => w.id === 'W1')!;
		const onTop = { ...d, wires: [...d.wires, { ...w1, id: 'EXTRA', node: 'elsewhere' }] };
		expect(checkDrawing(onTop)).toContain('W1 runs on top of EXTRA');
	});
});
