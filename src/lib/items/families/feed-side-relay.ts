/**
 * Fuel pump on a relay whose coil is switched on the feed side: F1 and the switch feed pin 86, pin 85
 * is grounded; the contact (30 to 87) feeds the pump, optionally through a connector at the tank.
 */
import { CircuitWriter } from './builder';
import { FEED_COLORS, GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const feedSideRelay: Family = {
	id: 'feed-side-relay',
	title: 'Relay load switched on the feed side',
	area: 'motors-body',
	skills: { reading: 'relay-loads', status: 'relay-loads', current: 'relay-loads', drop: 'relay-loads', works: 'relay-loads', claims: 'relay-loads' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const amps = rng.pick([3, 4, 5, 6, 7, 8, 9, 10, 12]);
		const connector = rng.next() < 0.5;
		const oneFuse = rng.next() < 0.4;
		const hr = rng.pick([0.3, 0.5, 0.8, 1, 1.5, 2, 3]);
		const load = rng.pick(['motor', 'horn'] as const);
		const name = load === 'motor' ? 'fuel pump M1' : 'horn M1';
		const w = new CircuitWriter('feed-side-relay', `${load === 'motor' ? 'Fuel pump' : 'Horn'} relay with a feed-side switch`, supply);
		const mainFuse = fuseFor(amps);
		w.part('F1', `type: fuse, amps: ${oneFuse ? fuseFor(amps + 0.2) : 10}`);
		if (!oneFuse) w.part('F2', `type: fuse, amps: ${mainFuse}`);
		w.part('S1', 'type: switch');
		w.part('K1', 'type: relay');
		if (connector) w.part('C1', 'type: connector, cavities: 2');
		w.part('M1', `type: ${load}, amps: ${num(amps)}`);
		w.part('G1', 'type: ground');
		w.part('G2', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.1', { color: rng.pick(FEED_COLORS) });
		const wCoilFeed = w.wire('S1.2', 'K1.86', { color: rng.pick(SWITCHED_COLORS) });
		const wCoilGnd = w.wire('K1.85', 'G1', { color: rng.pick(GROUND_COLORS) });
		if (!oneFuse) w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire(oneFuse ? 'F1.2' : 'F2.2', 'K1.30', { color: rng.pick(FEED_COLORS) });
		const feed = w.wire('K1.87', connector ? 'C1.1a' : 'M1.1', { color: rng.pick(SWITCHED_COLORS), gauge_mm2: rng.pick([1, 1.5, 2.5]), length_m: rng.pick([1, 2, 3, 4]) });
		if (connector) w.wire('C1.1b', 'M1.1', { color: 'GN/YE' });
		let gnd: string;
		if (connector) {
			w.wire('M1.2', 'C1.2b', { color: 'BK' });
			gnd = w.wire('C1.2a', 'G2', { color: rng.pick(GROUND_COLORS) });
		} else gnd = w.wire('M1.2', 'G2', { color: rng.pick(GROUND_COLORS) });
		w.point('A', 'K1.86');
		w.point('B', 'K1.85');
		w.point('C', 'K1.87');
		w.point('D', 'M1.1');
		w.point('E', 'M1.2');
		w.state('off', 'S1: open');
		w.state('on', 'S1: closed');
		const faults = [`open:${wCoilFeed}`, `open:${wCoilGnd}`, `open:${feed}`, `open:${gnd}`, 'open:M1', 'open:K1.coil', 'open:K1.87', `high-resistance:G2:${hr}`, `short-to-ground:${feed}`, 'stuck-closed:K1'];
		if (!oneFuse) faults.push('open:F2');
		if (connector) faults.push('open:C1.1', `high-resistance:C1.2:${hr}`);
		return {
			params: { supply, amps, connector, oneFuse, hr, load },
			circuit: w.text(),
			title: `**${load === 'motor' ? 'Fuel pump' : 'Horn'} relay, switched on the feed side** (${supply} V battery, ${name} rated ${amps} A).`,
			states: { off: 'switch S1 open', on: 'switch S1 closed' },
			work: 'on',
			rest: 'off',
			loads: ['M1'],
			faults,
			shared: oneFuse ? ['K1.coil', 'M1'] : null,
			drop: { from: 'E', to: 'GND', state: 'on', fault: `high-resistance:G2:${hr}`, words: 'across the load’s ground side' },
			tags: ['relay']
		};
	}
};
