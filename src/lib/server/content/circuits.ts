/**
 * The demo and item-bank circuits under content/circuits/: read from disk, checked by the engine, and
 * prepared for drawing (each state with the relays its solve energizes). A file with problems is listed
 * with its problems as text a person can act on, never a stack trace.
 */
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { solveCircuit } from '$lib/circuit';
import { readDiagramCircuit, type GalleryCircuit, type GalleryState } from '$lib/diagram';

export const CIRCUITS_DIR = path.resolve('content/circuits');

export type { GalleryCircuit, GalleryState };

const LOAD_TYPES = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);

/** Reads every `*.yaml` in `dir` (file name order) and prepares it for the gallery. */
export async function loadCircuits(dir = CIRCUITS_DIR): Promise<GalleryCircuit[]> {
	let names: string[];
	try {
		names = (await readdir(dir)).filter((n) => n.endsWith('.yaml')).sort();
	} catch {
		return [];
	}
	const out: GalleryCircuit[] = [];
	for (const file of names) out.push(prepareCircuit(file, await readFile(path.join(dir, file), 'utf8')));
	return out;
}

/** Checks one circuit file's text and lists its states, or its problems. */
export function prepareCircuit(file: string, text: string): GalleryCircuit {
	try {
		const { circuit, diagram } = readDiagramCircuit(text);
		const states: GalleryState[] = [null, ...circuit.states.map((s) => s.name)].map((name) => {
			const r = solveCircuit(circuit, { state: name });
			if ('error' in r) return { name, energized: [], loads: '', deadShort: r.elements };
			const energized = Object.entries(r.parts)
				.filter(([, p]) => p.status === 'energized')
				.map(([id]) => id);
			const loads = circuit.parts
				.filter((p) => LOAD_TYPES.has(p.type))
				.map((p) => `${p.id} ${r.parts[p.id]?.status ?? 'off'}`)
				.join(', ');
			return { name, energized, loads, deadShort: null };
		});
		return { file, ok: true, diagram, states };
	} catch (e) {
		const message = e instanceof Error ? e.message : 'the file could not be read';
		return { file, ok: false, title: file, problems: message.split('\n') };
	}
}
