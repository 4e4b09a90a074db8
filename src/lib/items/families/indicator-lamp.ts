/**
 * A relay-switched load with an indicator lamp wired beside the relay coil: the indicator shows
 * that the switch fed the coil, not that the relay or the load works.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const indicatorLamp: Family = {
	id: 'indicator-lamp',
	title: 'Indicator lamp beside a relay coil',
	area: 'lighting-signalling',
	skills: { reading: 'indicator-lamps', status: 'indicator-lamps', current: 'lamp-circuits', drop: 'lamp-circuits', works: 'indicator-lamps', claims: 'indicator-lamps' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const lampW = rng.pick([35, 55, 60, 65]);
		const indW = rng.pick([1.2, 2, 3, 5]);
		const hr = rng.pick([0.5, 1, 2, 3]);
		const pair = rng.next() < 0.5;
		const w = new CircuitWriter('indicator-lamp', 'Work lamps with a dash indicator beside the relay coil', supply);
		w.part('F1', 'type: fuse, amps: 5');
		w.part('S1', 'type: switch');
		w.part('SP1', 'type: splice');
		w.part('K1', 'type: relay');
		w.part('L3', `type: lamp, watts: ${num(indW)}`);
		w.part('F2', `type: fuse, amps: ${fuseFor(((pair ? 2 : 1) * lampW) / supply)}`);
		w.part('L1', `type: lamp, watts: ${num(lampW)}`);
		if (pair) w.part('L2', `type: lamp, watts: ${num(lampW)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		if (pair) w.part('G3', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		const swFeed = w.wire('F1.2', 'S1.1', { color: 'RD/YE' });
		const swOut = w.wire('S1.2', 'SP1', { color: rng.pick(SWITCHED_COLORS) });
		const coilFeed = w.wire('SP1', 'K1.86', { color: 'GN' });
		const indFeed = w.wire('SP1', 'L3.1', { color: 'GN/WH' });
		const coilGnd = w.wire('K1.85', 'G1', { color: rng.pick(GROUND_COLORS) });
		w.wire('L3.2', 'G1', { color: 'BK' });
		w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire('F2.2', 'K1.30', { color: 'RD/BK' });
		const lampFeed = w.wire('K1.87', 'L1.1', { color: 'YE', gauge_mm2: 1.5, length_m: rng.pick([2, 3, 4]) });
		const lampGnd = w.wire('L1.2', 'G2', { color: 'BK' });
		if (pair) {
			w.wire('K1.87', 'L2.1', { color: 'YE/GN', gauge_mm2: 1.5, length_m: rng.pick([2, 3, 4]) });
			w.wire('L2.2', 'G3', { color: 'BK' });
		}
		w.point('A', 'SP1');
		w.point('B', 'K1.85');
		w.point('C', 'K1.87');
		w.point('D', 'L1.2');
		w.state('off', 'S1: open');
		w.state('on', 'S1: closed');
		const loads = pair ? ['L1', 'L2', 'L3'] : ['L1', 'L3'];
		const faults = ['open:K1.coil', `open:${coilFeed}`, `open:${coilGnd}`, `open:${indFeed}`, 'open:L3', `open:${lampFeed}`, `open:${lampGnd}`, 'open:F2', `open:${swOut}`, `high-resistance:G2:${hr}`, `short-to-ground:${lampFeed}`, `open:${swFeed}`];
		return {
			params: { supply, lampW, indW, hr, pair },
			circuit: w.text(),
			title: `**Work lamp relay with a dash indicator** (${supply} V battery; indicator L3 ${indW} W beside the coil of K1; ${pair ? 'lamps L1 and L2' : 'lamp L1'} ${lampW} W on the contact).`,
			states: { off: 'switch S1 open', on: 'switch S1 closed' },
			work: 'on',
			rest: 'off',
			loads,
			faults,
			shared: ['K1.coil', 'L3'],
			drop: { from: 'D', to: 'GND', state: 'on', fault: `high-resistance:G2:${hr}`, words: 'across the lamp’s ground side' },
			watch: ['L1', 'L3', 'K1'],
			tags: ['relay']
		};
	}
};
