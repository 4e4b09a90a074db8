/**
 * A battery with internal resistance under switched loads: the terminal voltage sags by the current
 * times the internal resistance, a little for a good battery and a lot for a worn one.
 */
import { CircuitWriter } from './builder';
import { fuseFor, num, type Family } from './family';

export const batteryLoad: Family = {
	id: 'battery-load',
	title: 'Battery voltage under load',
	area: 'battery-starting',
	skills: { reading: 'battery-voltage', status: 'battery-voltage', current: 'battery-voltage', drop: 'battery-voltage', works: 'battery-voltage', claims: 'battery-voltage' },
	weight: 1.5,
	variant(rng) {
		const emf = rng.pick([12.0, 12.2, 12.4, 12.5, 12.6, 12.7]);
		const rb = rng.pick([0.01, 0.02, 0.05, 0.1, 0.2, 0.5]);
		const h = rng.pick([1.5, 2, 3, 4]);
		const lw = rng.pick([21, 55, 60, 110]);
		const w = new CircuitWriter('battery-load', 'Battery under switched loads', { volts: emf, ohms: rb });
		w.part('F1', `type: fuse, amps: ${fuseFor(emf / h)}`);
		w.part('S1', 'type: switch');
		w.part('H1', `type: heater, ohms: ${num(h)}`);
		w.part('F2', `type: fuse, amps: ${fuseFor(lw / emf)}`);
		w.part('S2', 'type: switch');
		w.part('L1', `type: lamp, watts: ${num(lw)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.1', { color: 'RD/WH' });
		const hf = w.wire('S1.2', 'H1.1', { color: 'GN', gauge_mm2: 2.5, length_m: 2 });
		w.wire('H1.2', 'G1', { color: 'BK' });
		w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire('F2.2', 'S2.1', { color: 'RD/YE' });
		w.wire('S2.2', 'L1.1', { color: 'YE' });
		const lg = w.wire('L1.2', 'G2', { color: 'BK' });
		w.point('A', 'B+');
		w.point('B', 'H1.1');
		w.point('C', 'L1.1');
		w.state('rest', 'S1: open, S2: open');
		w.state('lamps', 'S1: open, S2: closed');
		w.state('all', 'S1: closed, S2: closed');
		const faults = [`short-to-ground:${hf}`, 'open:H1', `open:${lg}`, 'shorted:H1', 'open:G1', `high-resistance:G2:${rng.pick([0.5, 1, 2])}`];
		return {
			params: { emf, rb, h, lw },
			circuit: w.text(),
			title: `**Battery under load** (battery ${emf} V open-circuit with ${num(rb * 1000)} mΩ inside; heater H1 ${h} Ω; lamp L1 ${lw} W).`,
			states: { rest: 'both switches open', lamps: 'only the lamp switch S2 closed', all: 'both switches closed' },
			work: 'all',
			rest: 'lamps',
			loads: ['H1', 'L1'],
			faults,
			shared: ['H1', 'L1'],
			drop: { from: 'A', to: 'GND', state: 'all', fault: null, words: 'across the battery terminals' },
			watch: ['H1', 'L1', 'A'],
			tags: ['battery']
		};
	}
};
