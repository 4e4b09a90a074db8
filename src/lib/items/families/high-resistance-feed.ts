/**
 * A lamp fed through a connector whose feed cavity may be corroded: with no current a meter still
 * reads battery volts past the corrosion, yet the lamp (or a test lamp) gets almost nothing.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const highResistanceFeed: Family = {
	id: 'high-resistance-feed',
	title: 'Lamp fed through a high resistance',
	area: 'lighting-signalling',
	skills: { reading: 'high-resistance-feeds', status: 'high-resistance-feeds', current: 'high-resistance-feeds', drop: 'high-resistance-feeds', works: 'high-resistance-feeds', claims: 'high-resistance-feeds' },
	weight: 1.2,
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const watts = rng.pick([5, 10, 21, 27, 55, 60]);
		const hr = rng.pick([0.5, 1, 2, 3, 5, 8, 15, 40]);
		const what = rng.pick(['reversing lamp', 'fog lamp', 'stop lamp', 'number-plate lamp']);
		const w = new CircuitWriter('high-resistance-feed', `The ${what} fed through a connector`, supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(watts / supply)}`);
		w.part('S1', 'type: switch');
		w.part('C1', 'type: connector, cavities: 2');
		w.part('L1', `type: lamp, watts: ${num(watts)}`);
		w.part('G1', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		const sw = w.wire('F1.2', 'S1.1', { color: 'RD/GN' });
		const feed = w.wire('S1.2', 'C1.1a', { color: rng.pick(SWITCHED_COLORS), gauge_mm2: 0.75, length_m: rng.pick([2, 3, 4, 5]) });
		const feed2 = w.wire('C1.1b', 'L1.1', { color: 'GY' });
		w.wire('L1.2', 'C1.2b', { color: 'BK' });
		const gnd = w.wire('C1.2a', 'G1', { color: rng.pick(GROUND_COLORS) });
		w.point('A', 'S1.2');
		w.point('B', 'C1.1a');
		w.point('C', 'C1.1b');
		w.point('D', 'L1.2');
		w.state('off', 'S1: open');
		w.state('on', 'S1: closed');
		const faults = [`high-resistance:C1.1:${hr}`, `high-resistance:${feed}:${hr}`, `high-resistance:C1.2:${hr}`, `high-resistance:G1:${hr}`, 'open:C1.1', `open:${feed2}`, 'open:L1', `open:${gnd}`, `open:${sw}`, `short-to-ground:${feed}`];
		return {
			params: { supply, watts, hr, what },
			circuit: w.text(),
			title: `**The ${what} through connector C1** (${supply} V battery; lamp L1 ${watts} W; the question's fault may add resistance in the feed or the ground).`,
			states: { off: 'switch S1 open', on: 'switch S1 closed' },
			work: 'on',
			rest: 'off',
			loads: ['L1'],
			faults,
			shared: null,
			drop: { from: 'B', to: 'C', state: 'on', fault: `high-resistance:C1.1:${hr}`, words: 'across the feed cavity of C1' },
			watch: ['L1', 'C']
		};
	}
};
