/**
 * What the circuit gallery shows for each file: the drawing model and every state with its solve
 * summary, or the file's problems. Built on the server (`$lib/server/content/circuits`).
 */
import type { DiagramCircuit } from './model';

export type GalleryState = {
	/** State name; null for the file's defaults (switches at `normally` or their first position). */
	name: string | null;
	/** Relays the engine energizes in this state. */
	energized: string[];
	/** A one-line summary of the loads: "M1 on, L1 off". */
	loads: string;
	/** Set when the state is a dead short: the 0 Ω elements that close it. */
	deadShort: string[] | null;
};

export type GalleryCircuit =
	| { file: string; ok: true; diagram: DiagramCircuit; states: GalleryState[] }
	| { file: string; ok: false; title: string; problems: string[] };
