/**
 * The engine's in-memory model of one circuit file: the parts and wires as written, plus the
 * electrical elements they stand for (built once at parse time, changed only by faults).
 */

/** Every part type of the circuit format, in the spec's order. */
export const PART_TYPES = [
	'fuse',
	'fusible-link',
	'breaker',
	'relay',
	'switch',
	'lamp',
	'motor',
	'horn',
	'heater',
	'solenoid',
	'resistor',
	'diode',
	'supply',
	'connector',
	'splice',
	'ground'
] as const;

export type PartType = (typeof PART_TYPES)[number];

/** Part types that are loads (status on/weak/off). */
export const LOAD_TYPES: ReadonlySet<PartType> = new Set(['lamp', 'motor', 'horn', 'heater', 'solenoid']);
/** Part types that protect a circuit and open on overcurrent. */
export const FUSE_TYPES: ReadonlySet<PartType> = new Set(['fuse', 'fusible-link', 'breaker']);

/** One switch position: its name and the pin pairs it joins. */
export type SwitchPosition = { name: string; pairs: [string, string][] };

/**
 * One part as written in the file, with defaults filled in. Values are in SI units: `ohms` Ω,
 * `amps` A (a fuse's rating or a load's rated current), `volts` V.
 */
export type Part = {
	id: string;
	type: PartType;
	/** 1-based line of the part in the file. */
	line: number;
	/** Pin names; a splice or ground has none (its node is its own id). */
	pins: string[];
	/** Fuse/breaker rating in A. */
	rating?: number;
	/** Resistance in Ω: a load's (from ohms, watts or amps at the file's supply volts), a resistor's, a ground's bond, a diode's on-resistance, a relay coil's. */
	ohms?: number;
	/** Relay pull-in and drop-out coil volts. */
	pullIn?: number;
	dropOut?: number;
	/** Single-throw switch resting state. */
	normally?: 'open' | 'closed';
	/** Positioned switch positions in file order. */
	positions?: SwitchPosition[];
	/** Diode forward drop in V. */
	drop?: number;
	/** Supply part volts. */
	volts?: number;
	/** Connector cavity count. */
	cavities?: number;
};

/** One wire: its id, end nodes and resistance in Ω (0 = ideal). */
export type Wire = {
	id: string;
	from: string;
	to: string;
	ohms: number;
	line: number;
	color?: string;
};

/** A named operating condition: switch positions, resistor ohms and battery volts in force. */
export type CircuitState = {
	name: string;
	line: number;
	/** Battery EMF in V in this state, when the state sets `supply`. */
	supply?: number;
	/** Switch settings by part id: `open`, `closed` or a position name. */
	switches: Record<string, string>;
	/** Resistor values in Ω by part id. */
	resistors: Record<string, number>;
};

/**
 * What an electrical element does in the network:
 * - `resistor`: a fixed resistance, always in place (wires with ohms, loads, resistors, ground bonds, coils, faults, lamp, battery resistance)
 * - `ideal`: a fixed 0 Ω join, always in place (ideal wires, connector cavities, ground bonds of 0 Ω)
 * - `fuse`: 1 mΩ while intact, open once blown
 * - `switch`: a single-throw contact, 0 Ω when closed
 * - `position`: a positioned switch's pin pair, 0 Ω when its position is selected
 * - `no` / `nc`: a relay's 30–87 / 30–87a contact, 0 Ω when energized / released
 * - `coil`: a relay coil (a resistance)
 * - `diode`: `drop` V plus `ohms` from a to k when conducting, open when blocking
 * - `source`: an ideal voltage source, `a` is its + node, `b` its − node
 */
export type ElementRole = 'resistor' | 'ideal' | 'fuse' | 'switch' | 'position' | 'no' | 'nc' | 'coil' | 'diode' | 'source';

/** One electrical element between two node indices of `Circuit.nodeNames`. */
export type NetElement = {
	/** Element id as reported: part id, `K1.coil`, `K1.contact`, cavity `C1.3`, wire id or wire half `W3#1`, `fault`, `battery`. */
	id: string;
	/** The element named in paths (`W3` for both halves); null for elements never listed (faults, lamp, battery). */
	pathId: string | null;
	kind: 'part' | 'wire' | 'fault' | 'lamp' | 'source';
	role: ElementRole;
	a: number;
	b: number;
	/** Resistance in Ω (resistors, coils, diode on-resistance); 0 for ideal elements and sources. */
	ohms: number;
	/** Source or diode volts. */
	volts: number;
	/** Index of the owning part in `Circuit.parts`, or -1. */
	part: number;
	/** For `position`: the position's name. */
	position?: string;
	/** For `switch` and `no`: stuck closed (a fault). */
	stuck?: boolean;
	/** For `coil`: shorted by a fault, so the relay stays released. */
	dead?: boolean;
	/** For `diode`: index of its internal node (between the drop and the on-resistance). */
	mid?: number;
	/** For a source: it is the battery (its volts follow the state's `supply`). */
	battery?: boolean;
};

/** A parsed, validated circuit. Treat as read-only; faults return a new circuit. */
export type Circuit = {
	id: string | null;
	title: string | null;
	/** Battery EMF in V and internal resistance in Ω as written in the file. */
	supply: { volts: number; ohms: number };
	parts: Part[];
	wires: Wire[];
	points: { label: string; node: string }[];
	states: CircuitState[];
	/** Node names: the file's nodes first (B+, GND, then each part's pins in file order), then internal nodes. */
	nodeNames: string[];
	/** How many of `nodeNames` are the file's own nodes (reported in results). */
	fileNodeCount: number;
	/** Electrical elements in file order: battery, parts, wires, then any fault elements. */
	elements: NetElement[];
	/** The fault applied to this circuit, as written (`open:W3`), or null. */
	fault: string | null;
	/** Parts whose relay coil is open (from a fault): the relay stays released. */
	deadCoils: string[];
	/** Parts opened by a fault (fuses read blown, switches never close). */
	openedParts: string[];
};

/** Index of a node name in a circuit, or -1. */
export function nodeIndex(c: Circuit, name: string): number {
	return c.nodeNames.indexOf(name);
}

/**
 * One electrical element with every field present, in one order: every element then has one
 * object shape, so the engine's loops over elements read their fields at one shape's offsets.
 */
export function makeElement(
	id: string,
	pathId: string | null,
	kind: NetElement['kind'],
	role: NetElement['role'],
	a: number,
	b: number,
	ohms: number,
	volts: number,
	part: number,
	position?: string,
	stuck?: boolean,
	dead?: boolean,
	mid?: number,
	battery?: boolean
): NetElement {
	return { id, pathId, kind, role, a, b, ohms, volts, part, position, stuck, dead, mid, battery };
}

/** A copy of element `e` with the fields of `x` changed (same shape as `makeElement`); `e` is unchanged. */
export function elementWith(e: NetElement, x: Partial<Omit<NetElement, 'pathId'>>): NetElement {
	return makeElement(
		x.id ?? e.id,
		e.pathId,
		x.kind ?? e.kind,
		x.role ?? e.role,
		x.a ?? e.a,
		x.b ?? e.b,
		x.ohms ?? e.ohms,
		x.volts ?? e.volts,
		x.part ?? e.part,
		x.position ?? e.position,
		x.stuck ?? e.stuck,
		x.dead ?? e.dead,
		x.mid ?? e.mid,
		x.battery ?? e.battery
	);
}
