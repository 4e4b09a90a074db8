/**
 * Cooling fan on a relay whose coil is switched on the ground side by a temperature switch; the
 * contact feeds the fan through its own fuse, optionally through a connector at the fan.
 */
import { CircuitWriter } from './builder';
import { FEED_COLORS, GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const groundSideRelay: Family = {
	id: 'ground-side-relay',
	title: 'Relay load switched on the ground side',
	area: 'power-distribution',
	skills: { reading: 'relay-operation', status: 'relay-operation', current: 'relay-operation', drop: 'voltage-drop', works: 'relay-operation', claims: 'relay-operation' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const amps = rng.pick([8, 10, 12, 14, 16, 18, 20]);
		const connector = rng.next() < 0.5;
		const hr = rng.pick([0.2, 0.4, 0.6, 1, 1.5, 2.5]);
		const gauge = rng.pick([1.5, 2.5, 4]);
		const length = rng.pick([1, 1.5, 2, 3]);
		const w = new CircuitWriter('ground-side-relay', 'Cooling fan relay with a ground-side switch', supply);
		w.part('F1', 'type: fuse, amps: 10');
		w.part('F2', `type: fuse, amps: ${fuseFor(amps)}`);
		w.part('K1', 'type: relay');
		w.part('S1', 'type: switch');
		if (connector) w.part('C1', 'type: connector, cavities: 2');
		w.part('M1', `type: motor, amps: ${num(amps)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		const coilFeed = w.wire('F1.2', 'K1.86', { color: rng.pick(FEED_COLORS) });
		const coilToSw = w.wire('K1.85', 'S1.1', { color: rng.pick(SWITCHED_COLORS) });
		const swGnd = w.wire('S1.2', 'G1', { color: rng.pick(GROUND_COLORS) });
		w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire('F2.2', 'K1.30', { color: rng.pick(FEED_COLORS) });
		const feed = w.wire('K1.87', connector ? 'C1.1a' : 'M1.1', { id: 'FAN_FEED', color: rng.pick(SWITCHED_COLORS), gauge_mm2: gauge, length_m: length });
		if (connector) w.wire('C1.1b', 'M1.1', { color: 'GN/WH' });
		let gnd: string;
		if (connector) {
			w.wire('M1.2', 'C1.2b', { color: 'BK' });
			gnd = w.wire('C1.2a', 'G2', { color: rng.pick(GROUND_COLORS) });
		} else gnd = w.wire('M1.2', 'G2', { color: rng.pick(GROUND_COLORS) });
		w.point('A', 'K1.86');
		w.point('B', 'K1.85');
		w.point('C', 'K1.87');
		w.point('D', 'M1.2');
		w.state('cold', 'S1: open');
		w.state('hot', 'S1: closed');
		const faults = [`open:${coilFeed}`, `open:${coilToSw}`, `open:${swGnd}`, `open:${feed}`, `open:${gnd}`, 'open:F2', 'open:M1', 'open:K1.coil', 'stuck-closed:S1', `high-resistance:G2:${hr}`, `short-to-ground:${coilToSw}`, `short-to-ground:${feed}`];
		if (connector) faults.push('open:C1.2', `high-resistance:C1.1:${hr}`);
		return {
			params: { supply, amps, connector, hr, gauge, length },
			circuit: w.text(),
			title: `**Cooling fan relay, coil switched to ground** (${supply} V battery, fan M1 rated ${amps} A, temperature switch S1).`,
			states: { cold: 'the engine cold (S1 open)', hot: 'the engine hot (S1 closed)' },
			work: 'hot',
			rest: 'cold',
			loads: ['M1'],
			faults,
			shared: null,
			drop: { from: 'D', to: 'GND', state: 'hot', fault: `high-resistance:G2:${hr}`, words: 'across the fan’s ground side' },
			tags: ['relay']
		};
	}
};
