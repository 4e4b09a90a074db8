/**
 * The diagram's own input model: what the layout needs to know about a circuit, and nothing more.
 * It is built from the engine's parsed circuit (see `from-circuit.ts`) so that the layout does not
 * depend on the engine's internal field names.
 */

// The part types are the circuit format's (an external interface): one list, kept by the engine.
export { PART_TYPES } from '../circuit/model';
export type { PartType } from '../circuit/model';
import type { PartType } from '../circuit/model';

/** A part's placement pinned by the file: 0-based lane (column, left to right) and row (top to bottom). */
export type PinnedCell = { column: number; row: number };

export type DiagramPart = {
	id: string;
	type: PartType;
	/** Values worth printing on the label: amps, ohms, watts, volts, drop, cavities, normally, positions. */
	amps?: number;
	ohms?: number;
	watts?: number;
	volts?: number;
	drop?: number;
	cavities?: number;
	normally?: 'open' | 'closed';
	/** Positioned switch: position name -> pin pairs it joins, e.g. { low: [['B', 'L']] }. */
	positions?: Record<string, [string, string][]>;
	layout?: PinnedCell;
};

export type DiagramWire = {
	id: string;
	/** Node names as the file writes them: 'B+', 'GND', 'PART.PIN', or a splice or ground id. */
	from: string;
	to: string;
	color?: string;
};

export type DiagramCircuit = {
	id: string;
	title: string;
	supplyVolts: number;
	parts: DiagramPart[];
	wires: DiagramWire[];
	/** Test point label -> node name. */
	points: Record<string, string>;
	/** State name -> part id -> setting (switch 'open' / 'closed', a position name, or { ohms }). */
	states: Record<string, Record<string, unknown>>;
};

/** The pins of a part, in the spec's order. A splice or ground has one pin named by its id. */
export function listPins(part: DiagramPart): string[] {
	switch (part.type) {
		case 'relay':
			return ['30', '85', '86', '87', '87a'];
		case 'diode':
			return ['a', 'k'];
		case 'supply':
			return ['+', '-'];
		case 'connector': {
			const pins: string[] = [];
			for (let n = 1; n <= (part.cavities ?? 1); n++) pins.push(`${n}a`, `${n}b`);
			return pins;
		}
		case 'splice':
		case 'ground':
			return [part.id];
		case 'switch':
			if (part.positions) return positionPins(part.positions);
			return ['1', '2'];
		default:
			return ['1', '2'];
	}
}

/** Every pin a positioned switch names, in order of first appearance. */
export function positionPins(positions: Record<string, [string, string][]>): string[] {
	const seen: string[] = [];
	for (const pairs of Object.values(positions))
		for (const pair of pairs) for (const p of pair) if (!seen.includes(p)) seen.push(p);
	return seen;
}

/**
 * The pin groups that the layout stacks in separate lanes: a relay's coil beside its contacts, each
 * connector cavity in its own lane. Everything else fits in one lane.
 */
export function listLanes(part: DiagramPart): string[][] {
	if (part.type === 'relay') return [['86', '85'], ['30', '87', '87a']];
	if (part.type === 'connector') {
		const lanes: string[][] = [];
		for (let n = 1; n <= (part.cavities ?? 1); n++) lanes.push([`${n}a`, `${n}b`]);
		return lanes;
	}
	return [listPins(part)];
}

/** The key that names one pin everywhere in the diagram: 'K1.85', or a splice/ground id. */
export function pinKey(part: DiagramPart, pin: string): string {
	return part.type === 'splice' || part.type === 'ground' ? part.id : `${part.id}.${pin}`;
}

export type Endpoint =
	| { kind: 'battery' }
	| { kind: 'chassis' }
	| { kind: 'pin'; part: string; pin: string };

/** Reads a node name as the file writes it. Unknown names are left to the engine's validation. */
export function readEndpoint(name: string): Endpoint {
	if (name === 'B+') return { kind: 'battery' };
	if (name === 'GND') return { kind: 'chassis' };
	const dot = name.indexOf('.');
	// A bare id names a splice or ground, whose one pin carries the part's id.
	if (dot < 0) return { kind: 'pin', part: name, pin: name };
	return { kind: 'pin', part: name.slice(0, dot), pin: name.slice(dot + 1) };
}

const TYPE_WORDS: Record<PartType, string> = {
	fuse: 'fuse',
	'fusible-link': 'fusible link',
	breaker: 'circuit breaker',
	relay: 'relay',
	switch: 'switch',
	lamp: 'lamp',
	motor: 'motor',
	horn: 'horn',
	heater: 'heater',
	solenoid: 'solenoid',
	resistor: 'resistor',
	diode: 'diode',
	supply: 'supply',
	connector: 'connector',
	splice: 'splice',
	ground: 'ground'
};

/** The trade's word for a part type, as a person reads it ("fusible link", "circuit breaker"). */
export function typeWord(part: Pick<DiagramPart, 'type' | 'drop'>): string {
	if (part.type === 'diode' && (part.drop ?? 0.7) >= 1.5) return 'LED';
	return TYPE_WORDS[part.type];
}

/** A value to print beside the part id: "10 A", "2.2 Ω", "55 W", "5 V", "3 cavities". */
export function valueText(part: DiagramPart): string | null {
	const n = (v: number) => String(Number(v.toPrecision(4)));
	switch (part.type) {
		case 'fuse':
		case 'fusible-link':
		case 'breaker':
			return part.amps != null ? `${n(part.amps)} A` : null;
		case 'supply':
			return part.volts != null ? `${n(part.volts)} V` : null;
		case 'connector':
			return null;
		case 'diode':
			return (part.drop ?? 0.7) >= 1.5 ? 'LED' : null;
		case 'relay':
			return null;
		default:
			if (part.ohms != null) return `${n(part.ohms)} Ω`;
			if (part.watts != null) return `${n(part.watts)} W`;
			if (part.amps != null) return `${n(part.amps)} A`;
			return null;
	}
}

/** How a person reads one end of a wire: "relay K1 pin 85", "battery positive (B+)", "ground G1". */
export function endpointName(name: string, parts: Map<string, DiagramPart>): string {
	const e = readEndpoint(name);
	if (e.kind === 'battery') return 'battery positive (B+)';
	if (e.kind === 'chassis') return 'chassis ground (GND)';
	const part = parts.get(e.part);
	if (!part) return name;
	if (part.type === 'splice' || part.type === 'ground') return `${typeWord(part)} ${part.id}`;
	if (part.type === 'connector') {
		const m = /^(\d+)([ab])$/.exec(e.pin);
		if (m) return `connector ${part.id} cavity ${m[1]} side ${m[2]}`;
	}
	return `${typeWord(part)} ${part.id} pin ${e.pin}`;
}

/** Accessible name of a wire: "wire W3, relay K1 pin 85 to switch S1 pin 1". */
export function wireName(wire: DiagramWire, parts: Map<string, DiagramPart>): string {
	const colour = wire.color ? `, colour ${wire.color}` : '';
	return `wire ${wire.id}, ${endpointName(wire.from, parts)} to ${endpointName(wire.to, parts)}${colour}`;
}

/** Accessible name of a part: "fuse F1, 10 A", "relay K1". */
export function partName(part: DiagramPart, setting?: string | null): string {
	const value = valueText(part);
	const base = `${typeWord(part)} ${part.id}${value && value !== 'LED' ? `, ${value}` : ''}`;
	return setting ? `${base}, ${setting}` : base;
}
