/**
 * ngspice (eecircuit-engine 1.8.0, ngspice compiled to WebAssembly) as an outside reference for DC
 * operating points.
 *
 * - `netlistFromNetwork(net)` writes a SPICE netlist (resistors, DC voltage sources, `.op`) from a
 *   linear network description. Node names are replaced by safe SPICE names (`n0`, `n1`, …; `GND` is
 *   SPICE node `0`); the mapping travels inside the netlist as `*@node` comment lines, which ngspice
 *   ignores, so `op()` can report voltages under the original names.
 * - `createNgspice()` starts one ngspice instance (about 0.5 s); reuse it for every netlist of a test file.
 *   `op(netlist)` runs the operating point and returns volts to GND for every named node of the netlist
 *   (GND itself is 0). Throws if ngspice reports an error or a node is missing from its output.
 *
 * The network shape matches the engine's `LinearNetwork` structurally, so this file does not depend on
 * the engine: tests also feed it networks they build themselves.
 */
import { Simulation } from 'eecircuit-engine';

/** A linear DC network: resistors in ohms, sources in volts (plus minus `minus` = volts). */
export type NetworkLike = {
	nodes: string[];
	resistors: { id: string; a: string; b: string; ohms: number }[];
	vsources: { id: string; plus: string; minus: string; volts: number }[];
};

/** The reference node's name in every network the harness reads. */
export const GROUND_NODE = 'GND';

const NODE_TAG = '*@node ';

/** Formats a number for SPICE without losing precision (no unit suffixes, which SPICE would misread). */
function spiceNumber(x: number): string {
	if (!Number.isFinite(x)) throw new Error(`netlist: value ${x} is not a finite number`);
	return x.toPrecision(17).replace(/\.?0+(e|$)/, '$1');
}

/**
 * Writes a SPICE `.op` netlist for `net`. Every node of `net.nodes` gets a safe name; resistors and
 * sources may also name nodes missing from `net.nodes` (they are added). Throws on a resistor of
 * zero or negative ohms (write ideal connections as 0 V sources or merge the nodes first).
 */
export function netlistFromNetwork(net: NetworkLike, title = 'splicepoint cross-check'): string {
	const safe = new Map<string, string>();
	const nameOf = (node: string): string => {
		if (node === GROUND_NODE) return '0';
		let s = safe.get(node);
		if (!s) {
			s = `n${safe.size}`;
			safe.set(node, s);
		}
		return s;
	};
	for (const n of net.nodes) nameOf(n);
	const lines: string[] = [];
	net.resistors.forEach((r, i) => {
		if (!(r.ohms > 0)) throw new Error(`netlist: resistor ${r.id} has ${r.ohms} ohms; it must be above 0`);
		lines.push(`R${i} ${nameOf(r.a)} ${nameOf(r.b)} ${spiceNumber(r.ohms)}`);
	});
	net.vsources.forEach((v, i) => {
		lines.push(`V${i} ${nameOf(v.plus)} ${nameOf(v.minus)} DC ${spiceNumber(v.volts)}`);
	});
	const header = [`* ${title.replace(/[\r\n]/g, ' ')}`];
	for (const [node, s] of safe) header.push(`${NODE_TAG}${s} ${node}`);
	// Tight tolerances: the network is linear, so this costs nothing and keeps ngspice's answer exact
	// to far better than the 1 mV the tests compare at.
	return [
		...header,
		...lines,
		'.options reltol=1e-9 abstol=1e-15 vntol=1e-12',
		'.op',
		'.end',
		''
	].join('\n');
}

/** One running ngspice instance. */
export type Ngspice = {
	/** Runs `.op` on a netlist written by `netlistFromNetwork`; volts by original node name (GND = 0). */
	op(netlist: string): Promise<Record<string, number>>;
};

/** Starts ngspice (WebAssembly) once; share the result across a test file. */
export async function createNgspice(): Promise<Ngspice> {
	const sim = new Simulation();
	await sim.start();
	// ngspice keeps a single queue; run netlists one at a time.
	let queue: Promise<unknown> = Promise.resolve();
	async function runOne(netlist: string): Promise<Record<string, number>> {
		const map = new Map<string, string>();
		for (const line of netlist.split('\n')) {
			if (line.startsWith(NODE_TAG)) {
				const rest = line.slice(NODE_TAG.length);
				const sp = rest.indexOf(' ');
				map.set(rest.slice(0, sp), rest.slice(sp + 1));
			}
		}
		sim.setNetList(netlist);
		const res = await sim.runSim();
		const errors = sim.getError();
		if (errors.length > 0) throw new Error(`ngspice: ${errors.join('; ')}`);
		if (res.dataType !== 'real') throw new Error('ngspice: expected a real operating point');
		const byName = new Map<string, number>();
		for (const d of res.data) byName.set(d.name.toLowerCase(), d.values[0] as number);
		const out: Record<string, number> = { [GROUND_NODE]: 0 };
		for (const [s, node] of map) {
			const v = byName.get(`v(${s})`);
			if (v === undefined) throw new Error(`ngspice: no voltage for node ${node} (${s}) in the output`);
			out[node] = v;
		}
		return out;
	}
	return {
		op(netlist: string) {
			const p = queue.then(() => runOne(netlist));
			queue = p.catch(() => undefined);
			return p;
		}
	};
}
