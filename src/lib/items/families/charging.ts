/**
 * Charging: the generator (a source in this model) feeds the battery through a switch that stands
 * for "engine running", a fusible link and the charge wire; the generator case grounds through its
 * own bond. A lamp load sits on the battery.
 */
import { CircuitWriter } from './builder';
import { num, type Family } from './family';

export const charging: Family = {
	id: 'charging',
	title: 'Charging voltage and charge wire',
	area: 'charging',
	skills: { reading: 'charging-voltage', status: 'charging-faults', current: 'charging-voltage', drop: 'charging-faults', works: 'charging-faults', claims: 'charging-voltage' },
	weight: 2,
	variant(rng) {
		const emf = rng.pick([12.2, 12.3, 12.4, 12.5, 12.6]);
		const rb = rng.pick([0.04, 0.05, 0.06, 0.08, 0.1]);
		const set = rng.pick([13.8, 14, 14.2, 14.4, 14.6]);
		const lampW = rng.pick([55, 110, 120]);
		const hr = rng.pick([0.02, 0.05, 0.1, 0.2]);
		const w = new CircuitWriter('charging', 'Generator charging the battery', { volts: emf, ohms: rb });
		w.part('U1', `type: supply, volts: ${num(set)}`);
		w.part('S1', 'type: switch');
		w.part('FL1', 'type: fusible-link, amps: 80');
		w.part('F2', `type: fuse, amps: ${lampW > 60 ? 15 : 10}`);
		w.part('S2', 'type: switch');
		w.part('L1', `type: lamp, watts: ${num(lampW)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('U1.-', 'G1', { id: 'GEN_CASE', color: 'BK' });
		const out = w.wire('U1.+', 'S1.1', { color: 'RD' });
		w.wire('S1.2', 'FL1.1', { color: 'RD' });
		const charge = w.wire('FL1.2', 'B+', { id: 'CHARGE', gauge_mm2: 6, length_m: rng.pick([1, 1.5, 2, 3]) });
		w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire('F2.2', 'S2.1', { color: 'RD/YE' });
		w.wire('S2.2', 'L1.1', { color: 'YE' });
		w.wire('L1.2', 'G2', { color: 'BK' });
		w.point('A', 'B+');
		w.point('B', 'FL1.2');
		w.point('C', 'U1.+');
		w.point('D', 'L1.1');
		w.state('parked', 'S1: open, S2: closed');
		w.state('running', 'S1: closed, S2: closed');
		const faults = ['open:FL1', `open:${charge}`, `high-resistance:${charge}:${hr}`, `high-resistance:G1:${hr}`, 'open:G1', `open:${out}`, 'open:L1'];
		return {
			params: { emf, rb, set, lampW, hr },
			circuit: w.text(),
			title: `**Charging circuit** (battery ${emf} V with ${num(rb * 1000)} mΩ inside; the generator holds ${set} V at its output while the engine runs; lamp load L1 ${lampW} W).`,
			states: { parked: 'the engine off and the lamps on', running: 'the engine running and the lamps on' },
			work: 'running',
			rest: 'parked',
			loads: ['L1'],
			faults,
			shared: null,
			drop: { from: 'C', to: 'A', state: 'running', fault: `high-resistance:${charge}:${hr}`, words: 'along the charge wire' },
			watch: ['A'],
			currentPart: 'FL1',
			tags: ['battery']
		};
	}
};
