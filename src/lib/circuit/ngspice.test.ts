/**
 * Cross-check of the engine's DC solutions against ngspice (eecircuit-engine 1.8.0, ngspice 45 compiled
 * to WebAssembly) — the outside reference for every node voltage here.
 *
 * (a) Seeded random resistor networks, written as circuit files in the spec's format (resistors, wires
 *     with ohms and ideal wires, grounds with and without ohms, supply parts and the battery, near-shorts
 *     of 0.001-0.01 ohm, islands that float), solved by `solveCircuit` and by ngspice from a netlist this
 *     file writes from its OWN description of the same network (its own merging of ideal connections,
 *     and a 10 Mohm meter on every merged node, as the spec's model puts them).
 * (b) The settled network of every golden case (`settledNetwork`) through ngspice.
 * Every node voltage must agree within 1 mV.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { parse } from 'yaml';
import { createNgspice, netlistFromNetwork, type NetworkLike, type Ngspice } from '../../../tests/helpers/ngspice';
import { parseCircuit, settledNetwork, solveCircuit, type SolveResult } from './index';

/** Agreement required between the engine and ngspice, in volts. */
const AGREE_TOL_V = 0.001;
/** Meter input resistance in the spec's model (a typical DMM's 10 Mohm, makers' specifications). */
const METER_OHMS = 10e6;
const NETWORK_COUNT = 200;

let ng: Ngspice;
beforeAll(async () => {
	ng = await createNgspice();
});

/** mulberry32: a small seeded PRNG, so every run builds the same networks. */
function makeRng(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

class UnionFind {
	private parent = new Map<string, string>();
	find(x: string): string {
		let p = this.parent.get(x) ?? x;
		if (p === x) return x;
		p = this.find(p);
		this.parent.set(x, p);
		return p;
	}
	union(a: string, b: string): boolean {
		const ra = this.find(a);
		const rb = this.find(b);
		if (ra === rb) return false;
		// keep GND as the root of its class so the reference stays named GND
		if (rb === 'GND') this.parent.set(ra, rb);
		else this.parent.set(rb, ra);
		return true;
	}
}

/** Shortest decimal that survives YAML and SPICE unchanged. */
function num(x: number): string {
	return String(Number(x.toPrecision(6)));
}

type RandomNet = {
	yaml: string;
	netlist: string;
	names: string[];
	nodeCount: number;
	islandSize: number;
	islandPowered: boolean;
};

/**
 * Builds one random network: the circuit file text, and (independently of the engine) the netlist of
 * the network that file describes, with a meter on every electrical node.
 */
function randomNetwork(seed: number): RandomNet {
	const rnd = makeRng(seed);
	const int = (lo: number, hi: number) => lo + Math.floor(rnd() * (hi - lo + 1));
	const pick = <T>(xs: T[]): T => xs[Math.floor(rnd() * xs.length)];
	const logUniform = (lo: number, hi: number) => lo * Math.pow(hi / lo, rnd());

	const nodeCount = int(5, 60); // electrical nodes before merging: splices + B+ + GND
	const spliceCount = nodeCount - 2;
	const splices = Array.from({ length: spliceCount }, (_, i) => `N${i + 1}`);
	const islandSize = spliceCount >= 6 && rnd() < 0.5 ? int(2, Math.min(6, spliceCount - 3)) : 0;
	const island = splices.slice(spliceCount - islandSize);
	const main = ['B+', 'GND', ...splices.slice(0, spliceCount - islandSize)];
	const group = (): string[] => (island.length > 0 && rnd() < island.length / (main.length + island.length) ? island : main);

	const parts: string[] = splices.map((s) => `  ${s}: { type: splice }`);
	const wires: string[] = [];
	const ideal = new UnionFind();
	const resistors: { a: string; b: string; ohms: number }[] = [];
	const sources: { plus: string; minus: string; volts: number }[] = [];
	const names = new Set<string>(['B+', 'GND', ...splices]);

	// Every splice gets a resistive tie to another node of its group, so no splice is left unwired.
	const tie = (s: string, g: string[]) => {
		let other = pick(g);
		if (other === s) other = g[(g.indexOf(s) + 1) % g.length];
		const ohms = Number(num(logUniform(0.05, 5000)));
		wires.push(`  - { from: ${s}, to: ${other}, ohms: ${ohms} }`);
		resistors.push({ a: s, b: other, ohms });
	};
	for (const s of splices) tie(s, island.includes(s) ? island : main);

	let rCount = 0;
	const addResistor = (a: string, b: string, ohms: number) => {
		const id = `R${++rCount}`;
		parts.push(`  ${id}: { type: resistor, ohms: ${num(ohms)} }`);
		// pins wired by ideal wires (leaves: they cannot close a loop), now and then by a resistive lead
		for (const [pin, node] of [
			[`${id}.1`, a],
			[`${id}.2`, b]
		] as const) {
			names.add(pin);
			if (rnd() < 0.2) {
				const lead = Number(num(logUniform(0.001, 0.5)));
				wires.push(`  - { from: ${pin}, to: ${node}, ohms: ${lead} }`);
				resistors.push({ a: pin, b: node, ohms: lead });
			} else {
				wires.push(`  - ${pin} ${node}`);
				ideal.union(pin, node);
			}
		}
		resistors.push({ a: `${id}.1`, b: `${id}.2`, ohms: Number(num(ohms)) });
	};
	const resistorTotal = int(Math.ceil(nodeCount / 2), nodeCount * 2);
	for (let i = 0; i < resistorTotal; i++) {
		const g = group();
		const a = pick(g);
		const b = pick(g);
		const near = rnd() < 0.1;
		addResistor(a, b, near ? logUniform(0.001, 0.01) : logUniform(0.1, 100_000));
	}
	// Wires with ohms between nodes, some of them near-shorts.
	const wireTotal = int(2, nodeCount);
	for (let i = 0; i < wireTotal; i++) {
		const g = group();
		const a = pick(g);
		const b = pick(g);
		if (a === b) continue;
		const ohms = Number(num(rnd() < 0.2 ? logUniform(0.001, 0.01) : logUniform(0.01, 50)));
		wires.push(`  - { from: ${a}, to: ${b}, ohms: ${ohms} }`);
		resistors.push({ a, b, ohms });
	}
	// Ideal joins must never put B+ and GND on one node (a dead short across the battery).
	const joinsRails = (a: string, b: string) => {
		const ra = ideal.find(a);
		const rb = ideal.find(b);
		const bp = ideal.find('B+');
		const gnd = ideal.find('GND');
		return (ra === bp && rb === gnd) || (ra === gnd && rb === bp);
	};
	// Ideal wires: a forest, never a loop among themselves.
	const idealTotal = int(0, Math.ceil(nodeCount / 4));
	for (let i = 0; i < idealTotal; i++) {
		const g = group();
		const a = pick(g);
		const b = pick(g);
		if (ideal.find(a) === ideal.find(b) || joinsRails(a, b)) continue;
		wires.push(`  - ${a} ${b}`);
		ideal.union(a, b);
	}
	// Ground parts on main-group splices, some bonded through ohms, some ideal.
	const mainSplices = main.filter((n) => n !== 'B+' && n !== 'GND');
	const groundTotal = mainSplices.length > 0 ? int(0, 3) : 0;
	const groundsIdeal: string[] = [];
	for (let i = 1; i <= groundTotal; i++) {
		const id = `G${i}`;
		const at = pick(mainSplices);
		names.add(id);
		wires.push(`  - ${id} ${at}`);
		ideal.union(id, at);
		if (rnd() < 0.5) {
			const ohms = Number(num(logUniform(0.005, 2)));
			parts.push(`  ${id}: { type: ground, ohms: ${ohms} }`);
			resistors.push({ a: id, b: 'GND', ohms });
		} else {
			parts.push(`  ${id}: { type: ground }`);
			groundsIdeal.push(id);
		}
	}
	// A 0-ohm ground joins its node to GND. Keep it only if that closes no ideal loop; otherwise give
	// it ohms (a 0-ohm loop through a ground is legal but is not what this check is about).
	for (const id of groundsIdeal) {
		if (joinsRails(id, 'GND') || !ideal.union(id, 'GND')) {
			const idx = parts.findIndex((p) => p.startsWith(`  ${id}:`));
			parts[idx] = `  ${id}: { type: ground, ohms: 0.05 }`;
			resistors.push({ a: id, b: 'GND', ohms: 0.05 });
		}
	}

	// Sources: the battery, then supply parts. Over the ideal classes the source edges must form a
	// forest, or 0-ohm elements and sources alone would close a loop (a dead short by the spec).
	const srcUf = new UnionFind();
	const cls = (n: string) => ideal.find(n);
	const volts = Number(num(11 + rnd() * 3.5));
	let supplyLine: string;
	const batteryOhms = rnd() < 0.5 ? Number(num(logUniform(0.005, 0.1))) : 0;
	if (batteryOhms > 0) {
		supplyLine = `supply: { volts: ${volts}, ohms: ${batteryOhms} }`;
		sources.push({ plus: 'battery#emf', minus: 'GND', volts });
		resistors.push({ a: 'battery#emf', b: 'B+', ohms: batteryOhms });
	} else {
		supplyLine = `supply: ${volts}`;
		if (cls('B+') === cls('GND')) throw new Error('generator: B+ joined to GND by ideal elements');
		sources.push({ plus: 'B+', minus: 'GND', volts });
		srcUf.union(cls('B+'), cls('GND'));
	}
	let islandPowered = false;
	const supplyTotal = int(1, 3);
	for (let i = 1; i <= supplyTotal; i++) {
		const g = group();
		const plus = pick(g);
		const minus = pick(g);
		if (srcUf.find(cls(plus)) === srcUf.find(cls(minus))) continue;
		if (g === island) islandPowered = true;
		srcUf.union(cls(plus), cls(minus));
		const id = `U${i}`;
		const v = Number(num(1 + rnd() * 23));
		parts.push(`  ${id}: { type: supply, volts: ${v} }`);
		wires.push(`  - ${id}.+ ${plus}`, `  - ${id}.- ${minus}`);
		// pin second: the existing class keeps its root, which srcUf has recorded
		ideal.union(plus, `${id}.+`);
		ideal.union(minus, `${id}.-`);
		names.add(`${id}.+`);
		names.add(`${id}.-`);
		sources.push({ plus: `${id}.+`, minus: `${id}.-`, volts: v });
	}

	// Labelled points on the island: with no supply part inside it they have no conducting path to
	// B+, GND or a supply terminal, so by the spec they read floating (and the meters hold them at 0 V).
	const islandPoints = island.slice(0, 3);
	const points = islandPoints.length > 0 ? ['points:', ...islandPoints.map((n, i) => `  P${i + 1}: ${n}`)] : [];
	const yaml = [`id: random-${seed}`, supplyLine, 'parts:', ...parts, 'wires:', ...wires, ...points, ''].join('\n');

	// The network this file describes, merged by this file's own union-find.
	const merged = (n: string) => (n === 'battery#emf' ? n : ideal.find(n));
	const classes = new Set<string>([...names].map(merged));
	const net: NetworkLike = {
		nodes: [...classes],
		resistors: [
			...resistors.map((r, i) => ({ id: `r${i}`, a: merged(r.a), b: merged(r.b), ohms: r.ohms })),
			...[...classes].filter((c) => c !== 'GND').map((c) => ({ id: `meter:${c}`, a: c, b: 'GND', ohms: METER_OHMS }))
		],
		vsources: sources.map((s, i) => ({ id: `v${i}`, plus: merged(s.plus), minus: merged(s.minus), volts: s.volts }))
	};
	if (batteryOhms > 0) net.nodes.push('battery#emf');
	// Map every original name to its merged node's voltage after the run.
	const netlist = netlistFromNetwork(net, `random network ${seed}`);
	return { yaml, netlist, names: [...names].map((n) => `${n}=${merged(n)}`), nodeCount, islandSize, islandPowered };
}

describe('the ngspice harness itself', () => {
	it('reproduces OpenStax College Physics Example 21.1 (12.0 V; 1.00, 6.00, 13.0 ohm in series)', async () => {
		const v = await ng.op(
			netlistFromNetwork({
				nodes: ['GND', 'B+', 'a', 'b'],
				resistors: [
					{ id: 'r1', a: 'B+', b: 'a', ohms: 1 },
					{ id: 'r2', a: 'a', b: 'b', ohms: 6 },
					{ id: 'r3', a: 'b', b: 'GND', ohms: 13 }
				],
				vsources: [{ id: 'bat', plus: 'B+', minus: 'GND', volts: 12 }]
			})
		);
		// OpenStax Ex. 21.1: 0.600 A; drops 0.600, 3.60, 7.80 V -> a = 11.4 V, b = 7.80 V
		expect(v['B+']).toBeCloseTo(12, 9);
		expect(v.a).toBeCloseTo(11.4, 9);
		expect(v.b).toBeCloseTo(7.8, 9);
		expect(v.GND).toBe(0);
	});
	it('floats an island on its meter alone, and rejects a zero-ohm resistor', async () => {
		const v = await ng.op(
			netlistFromNetwork({
				nodes: ['GND', 'B+', 'x'],
				resistors: [{ id: 'meter:x', a: 'x', b: 'GND', ohms: METER_OHMS }],
				vsources: [{ id: 'bat', plus: 'B+', minus: 'GND', volts: 12 }]
			})
		);
		expect(v.x).toBe(0);
		expect(() => netlistFromNetwork({ nodes: ['GND', 'a'], resistors: [{ id: 'r', a: 'a', b: 'GND', ohms: 0 }], vsources: [] })).toThrow(/ohms/);
	});
});

describe('engine against ngspice: seeded random networks', () => {
	it(`solves ${NETWORK_COUNT} random networks of 5-60 nodes to within 1 mV of ngspice at every node`, async () => {
		let compared = 0;
		let islands = 0;
		let floatingSeen = 0;
		const sizes: number[] = [];
		for (let seed = 1; seed <= NETWORK_COUNT; seed++) {
			const rn = randomNetwork(seed * 7919);
			const circuit = parseCircuit(rn.yaml);
			const res = solveCircuit(circuit);
			expect('error' in res, `seed ${seed}: engine reported ${JSON.stringify(res).slice(0, 200)}`).toBe(false);
			const nodes = (res as SolveResult).nodes;
			const spice = await ng.op(rn.netlist);
			for (const pair of rn.names) {
				const [name, cls] = pair.split('=');
				const ref = spice[cls];
				expect(ref, `seed ${seed}: ngspice has no node for ${name}`).toBeTypeOf('number');
				expect(nodes[name], `seed ${seed}: engine has no node ${name}`).toBeTypeOf('number');
				const diff = Math.abs(nodes[name] - ref);
				expect(diff, `seed ${seed}: ${name} engine ${nodes[name]} V, ngspice ${ref} V`).toBeLessThanOrEqual(AGREE_TOL_V);
				compared++;
			}
			if (rn.islandSize > 0) islands++;
			// an island holding a supply part may or may not reach its terminals: only unpowered ones are judged
			if (rn.islandSize > 0 && !rn.islandPowered) {
				for (const [label, p] of Object.entries((res as SolveResult).points)) {
					expect(p.reads, `seed ${seed}: point ${label} on an island with no source`).toBe('floating');
					floatingSeen++;
				}
			}
			sizes.push(rn.nodeCount);
		}
		expect(compared).toBeGreaterThan(NETWORK_COUNT * 5);
		// the generator really covered what it claims
		expect(islands).toBeGreaterThan(NETWORK_COUNT / 5);
		expect(floatingSeen, 'island points that must read floating').toBeGreaterThan(20);
		expect(Math.min(...sizes)).toBeLessThanOrEqual(8);
		expect(Math.max(...sizes)).toBeGreaterThanOrEqual(55);
	});
});

// ---- (b) golden cases' settled networks ----

type GoldenCase = { name: string; state?: string; fault?: string; lamp?: string; expect?: { dead_short?: unknown } };
const GOLDEN_DIR = fileURLToPath(new URL('./golden/', import.meta.url));
const golden = readdirSync(GOLDEN_DIR)
	.filter((f) => f.endsWith('.yaml'))
	.sort()
	.map((file) => ({ file, data: parse(readFileSync(join(GOLDEN_DIR, file), 'utf8')) as { circuit: string; cases: GoldenCase[] } }));

describe('engine against ngspice: settled networks of the golden cases', () => {
	for (const { file, data } of golden) {
		it(`${file}: every case's settled network agrees with ngspice within 1 mV`, async () => {
			const circuit = parseCircuit(data.circuit);
			let solved = 0;
			for (const c of data.cases) {
				if (!c.expect || c.expect.dead_short) continue;
				const opts = { state: c.state ?? null, fault: c.fault ?? null, lamp: c.lamp ?? null };
				const where = `${file} / ${c.name}`;
				const net = settledNetwork(circuit, opts);
				const spice = await ng.op(netlistFromNetwork(net, where));
				for (const n of net.nodes) {
					expect(spice[n], `${where}: ngspice lacks ${n}`).toBeTypeOf('number');
					const diff = Math.abs(net.voltages[n] - spice[n]);
					expect(diff, `${where}: merged node ${n} engine ${net.voltages[n]} V, ngspice ${spice[n]} V`).toBeLessThanOrEqual(AGREE_TOL_V);
				}
				// The reported (rounded) node volts are those of the settled network ngspice solved.
				const res = solveCircuit(circuit, opts) as SolveResult;
				for (const [orig, m] of Object.entries(net.nodeOf)) {
					if (!(orig in res.nodes)) continue; // internal nodes (fault midpoints, battery EMF) are not reported
					const diff = Math.abs(res.nodes[orig] - spice[m]);
					expect(diff, `${where}: node ${orig} reported ${res.nodes[orig]} V, ngspice ${spice[m]} V`).toBeLessThanOrEqual(AGREE_TOL_V);
				}
				// every reported node must belong to the settled network
				for (const orig of Object.keys(res.nodes)) expect(net.nodeOf[orig], `${where}: ${orig} not in nodeOf`).toBeTypeOf('string');
				solved++;
			}
			expect(solved).toBeGreaterThan(0);
		});
	}
});
