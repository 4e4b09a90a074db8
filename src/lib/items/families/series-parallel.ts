/**
 * Resistive loads in series or in parallel on one switch: the textbook circuits behind every
 * reading (Ohm's law, series drops, parallel branch currents).
 */
import { CircuitWriter } from './builder';
import { REST_VOLTS, fuseFor, num, type Family } from './family';

export const seriesParallel: Family = {
	id: 'series-parallel',
	title: 'Series and parallel loads',
	area: 'meters-basics',
	skills: { reading: 'series-parallel', status: 'series-parallel', current: 'ohms-law', drop: 'series-parallel', works: 'series-parallel', claims: 'series-parallel' },
	variant(rng) {
		const supply = rng.pick([...REST_VOLTS, 12, 13.5, 14]);
		const series = rng.next() < 0.5;
		const n = rng.pick([2, 3]);
		const ohms = Array.from({ length: n }, () => rng.pick([1, 2, 3, 4, 6, 8, 10, 12, 15]));
		const type = rng.pick(['heater', 'lamp'] as const);
		const amps = series ? supply / ohms.reduce((a, b) => a + b, 0) : ohms.reduce((a, r) => a + supply / r, 0);
		const w = new CircuitWriter('series-parallel', series ? 'Loads in series' : 'Loads in parallel', supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(amps, 1.5)}`);
		w.part('S1', 'type: switch');
		const loads = ohms.map((r, i) => w.part(`${type === 'lamp' ? 'L' : 'H'}${i + 1}`, `type: ${type}, ohms: ${num(r)}`));
		w.part('G1', 'type: ground');
		if (!series) w.part('SP1', 'type: splice');
		if (!series) w.part('SP2', 'type: splice');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.1', { color: 'RD/WH' });
		const wires: string[] = [];
		if (series) {
			let prev = 'S1.2';
			for (const l of loads) {
				wires.push(w.wire(prev, `${l}.1`, { color: 'YE' }));
				prev = `${l}.2`;
			}
			wires.push(w.wire(prev, 'G1', { color: 'BK' }));
		} else {
			w.wire('S1.2', 'SP1', { color: 'YE' });
			for (const l of loads) wires.push(w.wire('SP1', `${l}.1`, { color: 'YE/WH' }));
			for (const l of loads) w.wire(`${l}.2`, 'SP2', { color: 'BK/WH' });
			wires.push(w.wire('SP2', 'G1', { color: 'BK' }));
		}
		loads.forEach((l, i) => w.point(String.fromCharCode(65 + i), `${l}.1`));
		w.point(String.fromCharCode(65 + n), `${loads[n - 1]}.2`);
		w.state('off', 'S1: open');
		w.state('on', 'S1: closed');
		const faults = [`open:${loads[rng.int(n)]}`, `shorted:${loads[rng.int(n)]}`, `open:${wires[rng.int(wires.length)]}`, `high-resistance:G1:${rng.pick([0.5, 1, 2])}`, `short-to-ground:${wires[0]}`];
		return {
			params: { supply, series, ohms: ohms.join('/'), type },
			circuit: w.text(),
			title: `**${n} ${type}s in ${series ? 'series' : 'parallel'}** (${supply} V battery; ${loads.map((l, i) => `${l} ${ohms[i]} Ω`).join(', ')}).`,
			states: { off: 'switch S1 open', on: 'switch S1 closed' },
			work: 'on',
			rest: 'off',
			loads,
			faults,
			shared: [loads[0], loads[n - 1]],
			drop: { from: 'A', to: series ? `${loads[0]}.2` : 'GND', state: 'on', fault: null, words: series ? `across ${loads[0]}` : `across ${loads[0]}` },
			watch: loads,
			currentPart: series ? loads[0] : 'F1'
		};
	}
};
