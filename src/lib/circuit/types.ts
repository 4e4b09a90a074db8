/**
 * Public result and option types of the circuit engine.
 */
import type { Fault } from './faults';

/** Reading class of a point (spec "What the engine answers"). */
export type Reads = 'supply' | 'ground' | 'partial' | 'floating';

/**
 * What-if options: each models one learner mistake, for the item bank's distractors. Every option
 * returns the same result shape as an ordinary solve.
 * - `relays`: force relays into a state and never update them ("forgot that it released"), e.g. `{ K1: 'energized' }`.
 * - `noFuseOpens`: no fuse, link or breaker opens in settling ("forgot that it blew").
 * - `farSideOfOpen`: with an `open` fault on a wire, part or cavity, each point on one end of the
 *   opened element reads the volts and class of the element's other end ("read the far side of the open").
 * - `lampReadings`: every point is read with a 21 W test lamp from it to GND (one point at a time,
 *   the circuit settled with that lamp in place) instead of a 10 MΩ meter.
 */
export type WhatIf = {
	relays?: Record<string, 'energized' | 'released'>;
	noFuseOpens?: boolean;
	farSideOfOpen?: boolean;
	lampReadings?: boolean;
};

/** Options of one solve. */
export type SolveOptions = {
	/** A state name from the file; null/undefined = defaults (switches at `normally` or their first position). */
	state?: string | null;
	/** A fault, as an object or as `KIND:TARGET[:OHMS]`. */
	fault?: Fault | string | null;
	/** A test lamp: `A` (point A to GND) or `A:B+` (point A to B+). A point label, or a node name. */
	lamp?: string | null;
	/** Distractor options; see `WhatIf`. */
	whatIf?: WhatIf;
};

/**
 * The answer for one settled solve. Volts are to GND, rounded to 1 mV; amps are magnitudes rounded
 * to 0.1 mA (4 decimals). Keys appear in file order.
 */
export type SolveResult = {
	state: string | null;
	fault: string | null;
	/** Every file node name (B+, GND, PART.PIN, splice and ground ids) -> volts. */
	nodes: Record<string, number>;
	points: Record<string, { volts: number; reads: Reads }>;
	parts: Record<string, { status: string | null; amps: number }>;
	lamp?: 'lit' | 'dim' | 'dark';
};

/** A solve that failed because 0 Ω elements short sources; `elements` close the shortest such loop. */
export type DeadShortResult = { state: string | null; fault: string | null; error: 'dead-short'; elements: string[] };

/**
 * The linear network solved at the end of settling (ideal elements merged; every 10 MΩ meter as a
 * resistor to GND; conducting diodes and battery resistance expanded with internal nodes; open
 * elements omitted). `voltages` are unrounded volts by merged node name.
 */
export type LinearNetwork = {
	nodes: string[];
	resistors: { id: string; a: string; b: string; ohms: number }[];
	vsources: { id: string; plus: string; minus: string; volts: number }[];
	voltages: Record<string, number>;
	nodeOf: Record<string, string>;
};

/**
 * One conducting element of a settled solve. `amps` is unrounded, positive when current flows from
 * `from` to `to` (original node names; internal nodes such as `W3#mid` allowed). For a source, `from`
 * is its − node and `to` its + node, so a source delivering power has positive amps. A conducting
 * diode is one element from its a to its k pin with `ohms` its on-resistance: amps = (Va − Vk − drop) / ohms.
 */
export type ElementCurrent = {
	id: string;
	from: string;
	to: string;
	amps: number;
	/** The element's resistance in this solve in Ω; null for ideal (0 Ω) elements and sources. */
	ohms: number | null;
	kind: 'part' | 'wire' | 'meter' | 'fault' | 'lamp' | 'source';
};

/** Observations in one state: part statuses and point reading classes. */
export type Observation = { state: string; parts: Record<string, string>; points: Record<string, Reads> };

/** Candidates and the next best test (null when fewer than two candidates remain). */
export type Diagnosis = {
	candidates: string[];
	next_test: { state: string; point: string; expected_left: number; outcomes: Record<string, string[]> } | null;
};
