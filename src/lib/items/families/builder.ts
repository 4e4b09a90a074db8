/**
 * A small writer of circuit text in the spec's format, for the families: parts, wires (returning each
 * wire's id as the engine names it), points and states, written out as YAML.
 */
import { num } from './family';

type WireOpts = { id?: string; color?: string; gauge_mm2?: number; length_m?: number; ohms?: number };

export class CircuitWriter {
	private parts: string[] = [];
	private wires: string[] = [];
	private points: string[] = [];
	private states: string[] = [];
	private count = 0;
	constructor(
		private id: string,
		private title: string,
		private supply: number | { volts: number; ohms: number }
	) {}

	/** Adds a part: `fields` is its flow-map body, e.g. `type: fuse, amps: 10`. */
	part(id: string, fields: string): string {
		this.parts.push(`  ${id}: { ${fields} }`);
		return id;
	}

	/** Adds a wire; returns its id (`W` and its position, unless given). */
	wire(from: string, to: string, o: WireOpts = {}): string {
		this.count++;
		const id = o.id ?? `W${this.count}`;
		const f = [`from: ${from}`, `to: ${to}`];
		if (o.id) f.push(`id: ${o.id}`);
		if (o.color) f.push(`color: ${o.color}`);
		if (o.gauge_mm2 !== undefined) f.push(`gauge_mm2: ${num(o.gauge_mm2)}`, `length_m: ${num(o.length_m ?? 1)}`);
		if (o.ohms !== undefined) f.push(`ohms: ${num(o.ohms)}`);
		this.wires.push(`  - { ${f.join(', ')} }`);
		return id;
	}

	point(label: string, node: string): void {
		this.points.push(`  ${label}: ${node}`);
	}

	/** Adds a state: `fields` is its flow-map body, e.g. `S1: closed`. */
	state(name: string, fields: string): void {
		this.states.push(`  ${name}: { ${fields} }`);
	}

	text(): string {
		const supply = typeof this.supply === 'number' ? num(this.supply) : `{ volts: ${num(this.supply.volts)}, ohms: ${num(this.supply.ohms)} }`;
		return [
			`id: ${this.id}`,
			`title: ${this.title}`,
			`supply: ${supply}`,
			'parts:',
			...this.parts,
			'wires:',
			...this.wires,
			...(this.points.length ? ['points:', ...this.points] : []),
			...(this.states.length ? ['states:', ...this.states] : []),
			''
		].join('\n');
	}
}
