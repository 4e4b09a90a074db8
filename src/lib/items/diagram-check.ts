/**
 * The diagram check the build runs on samples of every family: lay the circuit out and draw it with
 * the diagram module, run its geometry rules (`checkDrawing`: overlapping symbols, wires through
 * symbols, labels on symbols or each other, segments of two nodes on top of each other, wires not
 * ending on their pins), and add the build's own: every part, wire and test point drawn, everything
 * inside the drawing, and an SVG without NaN.
 */
import { checkDrawing, layoutCircuit, readDiagramCircuit, renderSvg } from '../diagram';

/** Problems with the drawing of circuit text; empty when it draws cleanly. Never throws. */
export function checkDiagram(circuitText: string): string[] {
	try {
		const { circuit, diagram } = readDiagramCircuit(circuitText);
		const d = layoutCircuit(diagram, { state: circuit.states[0]?.name ?? null });
		const out: string[] = checkDrawing(d, circuit.wires);
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
