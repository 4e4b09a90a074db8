/**
 * From circuit file text (or the engine's parsed Circuit) to the diagram's input model.
 *
 * The optional drawing hints live in a top-level `layout:` map, `{ PARTID: { column, row } }`. The
 * engine's parser rejects keys it does not know, so `readLayoutHints` reads that map from the raw YAML
 * and returns the text with the map blanked out (same line count, so the engine's line numbers in
 * error messages stay right).
 */
import { parseDocument, isMap, isScalar, parse as parseYaml } from 'yaml';
import { parseCircuit, type Circuit } from '../circuit';
import type { DiagramCircuit, DiagramPart, PartType, PinnedCell } from './model';

export class LayoutHintError extends Error {
	constructor(
		readonly line: number,
		message: string
	) {
		super(`line ${line}: layout: ${message}`);
		this.name = 'LayoutHintError';
	}
}

/** Reads and removes the top-level `layout:` map. Throws LayoutHintError naming the line when it is malformed. */
export function readLayoutHints(text: string): { text: string; layout: Record<string, PinnedCell> } {
	const doc = parseDocument(text, { version: '1.2' });
	if (doc.errors.length || !isMap(doc.contents)) return { text, layout: {} };
	const pair = doc.contents.items.find((p) => isScalar(p.key) && p.key.value === 'layout');
	if (!pair) return { text, layout: {} };
	const lineOf = (offset: number) => text.slice(0, offset).split('\n').length;
	const keyNode = pair.key as { range?: [number, number, number] };
	const valueNode = pair.value as { range?: [number, number, number] } | null;
	const start = keyNode.range?.[0] ?? 0;
	const end = valueNode?.range?.[2] ?? keyNode.range?.[2] ?? start;
	const layout: Record<string, PinnedCell> = {};
	const raw = (pair.value as { toJSON?: () => unknown } | null)?.toJSON?.() ?? null;
	const line = lineOf(start);
	if (raw !== null && (typeof raw !== 'object' || Array.isArray(raw)))
		throw new LayoutHintError(line, 'write it as a map of part ids, e.g. layout: { K1: { column: 1, row: 1 } }');
	for (const [id, cell] of Object.entries((raw ?? {}) as Record<string, unknown>)) {
		const c = cell as { column?: unknown; row?: unknown } | null;
		const ok =
			c && typeof c === 'object' && Number.isInteger(c.column) && Number.isInteger(c.row) && (c.column as number) >= 0 && (c.row as number) >= 0;
		const extra = c && typeof c === 'object' ? Object.keys(c).filter((k) => k !== 'column' && k !== 'row') : [];
		if (!ok || extra.length)
			throw new LayoutHintError(line, `${id} needs whole numbers 0 or more for column and row, and nothing else, e.g. { column: 1, row: 2 }`);
		layout[id] = { column: c!.column as number, row: c!.row as number };
	}
	// Blank the pair, keeping newlines so every other line keeps its number.
	const blanked = text.slice(0, start) + text.slice(start, end).replace(/[^\n]/g, ' ') + text.slice(end);
	return { text: blanked, layout };
}

type RawPart = { amps?: unknown; watts?: unknown; ohms?: unknown };

/** Builds the diagram model from the engine's circuit, with label values and hints from the raw text. */
export function toDiagramCircuit(c: Circuit, layout: Record<string, PinnedCell> = {}, rawParts: Record<string, RawPart> = {}): DiagramCircuit {
	const parts: DiagramPart[] = c.parts.map((p) => {
		const raw = rawParts[p.id] ?? {};
		const d: DiagramPart = { id: p.id, type: p.type as PartType };
		const num = (v: unknown) => (typeof v === 'number' ? v : undefined);
		switch (p.type) {
			case 'fuse':
			case 'fusible-link':
			case 'breaker':
				d.amps = p.rating;
				break;
			case 'resistor':
				d.ohms = p.ohms;
				break;
			case 'supply':
				d.volts = p.volts;
				break;
			case 'diode':
				d.drop = p.drop;
				break;
			case 'connector':
				d.cavities = p.cavities;
				break;
			case 'switch':
				if (p.positions && p.positions.length) {
					d.positions = {};
					for (const pos of p.positions) d.positions[pos.name] = pos.pairs.map((pr) => [pr[0], pr[1]] as [string, string]);
				} else d.normally = p.normally ?? 'open';
				break;
			case 'lamp':
			case 'motor':
			case 'horn':
			case 'heater':
			case 'solenoid':
				// Label with what the author wrote (watts, amps or ohms), not the derived resistance.
				d.watts = num(raw.watts);
				d.amps = num(raw.amps);
				d.ohms = num(raw.ohms) ?? (d.watts == null && d.amps == null ? p.ohms : undefined);
				break;
		}
		if (layout[p.id]) d.layout = layout[p.id];
		return d;
	});
	const states: DiagramCircuit['states'] = {};
	for (const s of c.states) {
		const m: Record<string, unknown> = {};
		for (const [k, v] of Object.entries(s.switches)) m[k] = v;
		for (const [k, v] of Object.entries(s.resistors)) m[k] = { ohms: v };
		states[s.name] = m;
	}
	const points: Record<string, string> = {};
	for (const pt of c.points) points[pt.label] = pt.node;
	return {
		id: c.id ?? 'circuit',
		title: c.title ?? c.id ?? 'Circuit',
		supplyVolts: c.supply.volts,
		parts,
		wires: c.wires.map((w) => ({ id: w.id, from: w.from, to: w.to, color: w.color })),
		points,
		states
	};
}

/**
 * Parses circuit file text for drawing: the engine validates it (throws the engine's CircuitFileError
 * listing every problem), the layout hints are read here.
 */
export function readDiagramCircuit(text: string): { circuit: Circuit; diagram: DiagramCircuit } {
	const { text: clean, layout } = readLayoutHints(text);
	const circuit = parseCircuit(clean);
	let rawParts: Record<string, RawPart> = {};
	try {
		const raw = parseYaml(clean, { version: '1.2' }) as { parts?: Record<string, RawPart> } | null;
		rawParts = raw?.parts ?? {};
	} catch {
		rawParts = {};
	}
	const diagram = toDiagramCircuit(circuit, layout, rawParts);
	for (const id of Object.keys(layout))
		if (!diagram.parts.some((p) => p.id === id)) throw new LayoutHintError(lineOfKey(text, id), `${id} is not a part of this circuit; use a part id from parts:`);
	return { circuit, diagram };
}

function lineOfKey(text: string, id: string): number {
	const lines = text.split('\n');
	let inLayout = false;
	for (let i = 0; i < lines.length; i++) {
		if (/^layout\s*:/.test(lines[i])) inLayout = true;
		else if (/^\S/.test(lines[i])) inLayout = false;
		if (inLayout && lines[i].includes(id)) return i + 1;
	}
	return 1;
}
