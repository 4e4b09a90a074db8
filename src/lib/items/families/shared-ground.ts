/**
 * Two loads with their own fuses and switches returning through one shared ground: a corroded
 * shared ground dims both, and one load's current raises the other's ground side.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const sharedGround: Family = {
	id: 'shared-ground',
	title: 'Loads sharing a ground',
	area: 'power-distribution',
	skills: { reading: 'shared-protection', status: 'shared-protection', current: 'voltage-drop', drop: 'voltage-drop', works: 'shared-protection', claims: 'shared-protection' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const w1 = rng.pick([10, 21, 27, 35]);
		const w2 = rng.pick([5, 10, 21, 55]);
		const hr = rng.pick([0.5, 1, 1.5, 2, 2.5, 4]);
		const splicedGround = rng.next() < 0.5;
		const w = new CircuitWriter('shared-ground', 'Two loads on one ground', supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(w1 / supply)}`);
		w.part('F2', `type: fuse, amps: ${fuseFor(w2 / supply)}`);
		w.part('S1', 'type: switch');
		w.part('S2', 'type: switch');
		w.part('L1', `type: lamp, watts: ${num(w1)}`);
		w.part('L2', `type: lamp, watts: ${num(w2)}`);
		w.part('SP1', 'type: splice');
		w.part('G1', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		w.wire('F1.2', 'S1.1', { color: 'RD/WH' });
		const f1 = w.wire('S1.2', 'L1.1', { color: rng.pick(SWITCHED_COLORS) });
		w.wire('B+', 'F2.1', { color: 'RD' });
		w.wire('F2.2', 'S2.1', { color: 'RD/GN' });
		const f2 = w.wire('S2.2', 'L2.1', { color: rng.pick(SWITCHED_COLORS) });
		const g1 = w.wire('L1.2', 'SP1', { color: rng.pick(GROUND_COLORS) });
		const g2 = w.wire('L2.2', 'SP1', { color: rng.pick(GROUND_COLORS) });
		const gm = w.wire('SP1', 'G1', splicedGround ? { color: 'BK', gauge_mm2: 1.5, length_m: rng.pick([0.5, 1, 2]) } : { color: 'BK' });
		w.point('A', 'L1.1');
		w.point('B', 'L2.1');
		w.point('C', 'L1.2');
		w.point('D', 'SP1');
		w.state('off', 'S1: open, S2: open');
		w.state('first', 'S1: closed, S2: open');
		w.state('both', 'S1: closed, S2: closed');
		const faults = [`high-resistance:G1:${hr}`, `high-resistance:${gm}:${hr}`, `open:${gm}`, `open:${g1}`, `open:${g2}`, `open:${f1}`, `short-to-ground:${f2}`, 'open:L2', 'open:G1'];
		return {
			params: { supply, w1, w2, hr, splicedGround },
			circuit: w.text(),
			title: `**Two lamps on one ground** (${supply} V battery; L1 ${w1} W on S1, L2 ${w2} W on S2; both return through splice SP1 to ground G1).`,
			states: { off: 'both switches open', first: 'only S1 closed', both: 'S1 and S2 closed' },
			work: 'both',
			rest: 'first',
			loads: ['L1', 'L2'],
			faults,
			shared: ['L1', 'L2'],
			drop: { from: 'D', to: 'GND', state: 'both', fault: `high-resistance:G1:${hr}`, words: 'across the shared ground' },
			watch: ['L1', 'L2']
		};
	}
};
