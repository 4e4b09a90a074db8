/**
 * The diagram check the build runs on samples of every family: lay the circuit out and draw it with
 * the diagram module, then check the drawing's geometry. The diagram module exports no geometry check
 * of its own (its checks live in its tests), so these are the build's: every part, wire and test
 * point drawn, wires with at least two points, no two part symbols overlapping, everything inside
 * the drawing, and an SVG without NaN.
 */
import { layoutCircuit, readDiagramCircuit, renderSvg, type Box } from '../diagram';

const overlap = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** Problems with the drawing of circuit text; empty when it draws cleanly. Never throws. */
export function checkDiagram(circuitText: string): string[] {
	try {
		const { circuit, diagram } = readDiagramCircuit(circuitText);
		const d = layoutCircuit(diagram, { state: circuit.states[0]?.name ?? null });
		const out: string[] = [];
		const drawn = new Set(d.parts.filter((p) => !p.synthetic).map((p) => p.id));
		for (const p of circuit.parts) if (!drawn.has(p.id)) out.push(`part ${p.id} is not drawn`);
		const wires = new Map(d.wires.map((w) => [w.id, w]));
		for (const w of circuit.wires) {
			const dw = wires.get(w.id);
			if (!dw) out.push(`wire ${w.id} is not drawn`);
			else if (dw.points.length < 2) out.push(`wire ${w.id} has fewer than two points`);
		}
		const flags = new Set(d.flags.map((f) => f.label));
		for (const pt of circuit.points) if (!flags.has(pt.label)) out.push(`test point ${pt.label} has no flag`);
		const parts = d.parts.filter((p) => !p.synthetic);
		for (let i = 0; i < parts.length; i++)
			for (let j = i + 1; j < parts.length; j++) if (overlap(parts[i], parts[j])) out.push(`parts ${parts[i].id} and ${parts[j].id} overlap`);
		const inside = (x: number, y: number) => x >= 0 && y >= 0 && x <= d.width && y <= d.height;
		for (const p of parts) if (!inside(p.x, p.y) || !inside(p.x + p.w, p.y + p.h)) out.push(`part ${p.id} lies outside the drawing`);
		for (const w of d.wires) if (!w.points.every(([x, y]) => inside(x, y))) out.push(`wire ${w.id} runs outside the drawing`);
		const svg = renderSvg(d);
		if (svg.includes('NaN')) out.push('the SVG holds NaN coordinates');
		return out;
	} catch (e) {
		return [`the diagram cannot be drawn: ${(e as Error).message}`];
	}
}
