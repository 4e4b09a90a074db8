/**
 * Cranking: the ignition switch's start position feeds a starter relay through a park/neutral
 * switch; the relay energizes the solenoid (a second relay whose contact carries the starter
 * current through the battery cables). The battery has internal resistance, so it sags under load.
 */
import { CircuitWriter } from './builder';
import { num, type Family } from './family';

export const cranking: Family = {
	id: 'cranking',
	title: 'Starter control and cranking voltage',
	area: 'battery-starting',
	skills: { reading: 'cranking-circuit', status: 'cranking-circuit', current: 'cranking-drop', drop: 'cranking-drop', works: 'cranking-circuit', claims: 'battery-voltage' },
	weight: 2,
	variant(rng) {
		const emf = rng.pick([12.4, 12.5, 12.6, 12.65, 12.7]);
		const rb = rng.pick([0.004, 0.005, 0.006, 0.008]);
		const rm = rng.pick([0.06, 0.07, 0.08, 0.1, 0.12]);
		const cable = rng.pick([0.0005, 0.001, 0.0015]);
		const corrosion = rng.pick([0.01, 0.02, 0.03, 0.05, 0.09]);
		const w = new CircuitWriter('cranking', 'Starter relay, solenoid and cables', { volts: emf, ohms: rb });
		w.part('F1', 'type: fuse, amps: 10');
		w.part('S1', 'type: switch, positions: { off: [], run: [], start: ["B-ST"] }');
		w.part('S2', 'type: switch');
		w.part('K1', 'type: relay');
		w.part('K2', 'type: relay, coil_ohms: 0.8');
		w.part('M1', `type: motor, ohms: ${num(rm)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.B', { color: 'RD/BK' });
		const st = w.wire('S1.ST', 'K1.86', { color: 'VT/YE' });
		const pn = w.wire('K1.85', 'S2.1', { color: 'VT/BK' });
		w.wire('S2.2', 'G1', { color: 'BK' });
		w.wire('B+', 'K1.30', { color: 'RD' });
		const t50 = w.wire('K1.87', 'K2.86', { id: 'TERM_50', color: 'VT', gauge_mm2: 2.5, length_m: 1.5 });
		w.wire('K2.85', 'G2', { color: 'BK' });
		const pos = w.wire('B+', 'K2.30', { id: 'BATT_POS', ohms: cable });
		w.wire('K2.87', 'M1.1', { color: 'RD' });
		const neg = w.wire('M1.2', 'GND', { id: 'BATT_NEG', ohms: cable });
		w.point('A', 'B+');
		w.point('B', 'K2.30');
		w.point('C', 'M1.1');
		w.point('D', 'M1.2');
		w.point('E', 'K1.87');
		w.state('off', 'S1: off, S2: closed');
		w.state('crank', 'S1: start, S2: closed');
		w.state('in-drive', 'S1: start, S2: open');
		const faults = [`high-resistance:${pos}:${corrosion}`, `high-resistance:${neg}:${corrosion}`, `open:${st}`, `open:${pn}`, `open:${t50}`, 'open:K1.coil', 'open:K2.87', 'stuck-closed:S2', 'open:M1', 'open:F1'];
		return {
			params: { emf, rb, rm, cable, corrosion },
			circuit: w.text(),
			title: `**Cranking circuit** (battery ${emf} V with ${num(rb * 1000)} mΩ inside; starter M1 ${num(rm * 1000)} mΩ; starter relay K1, solenoid K2; park/neutral switch S2).`,
			states: { off: 'the key off', crank: 'the key at start in park', 'in-drive': 'the key at start in drive (S2 open)' },
			work: 'crank',
			rest: 'in-drive',
			loads: ['M1'],
			faults,
			shared: null,
			drop: { from: 'A', to: 'C', state: 'crank', fault: `high-resistance:${pos}:${corrosion}`, words: 'along the positive cable and solenoid contact' },
			watch: ['M1', 'K1'],
			tags: ['battery']
		};
	}
};
