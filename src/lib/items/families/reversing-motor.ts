/**
 * A window or seat motor with a reversing switch: at rest both motor leads are grounded through the
 * switch; each direction feeds one lead and grounds the other.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, fuseFor, num, type Family } from './family';

export const reversingMotor: Family = {
	id: 'reversing-motor',
	title: 'Reversing motor on a multi-position switch',
	area: 'motors-body',
	skills: { reading: 'body-switches', status: 'body-switches', current: 'body-switches', drop: 'body-switches', works: 'body-switches', claims: 'body-switches' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const amps = rng.pick([4, 5, 6, 8, 10, 12]);
		const hr = rng.pick([0.3, 0.5, 1, 1.5]);
		const connector = rng.next() < 0.6;
		const what = rng.pick(['window', 'seat', 'mirror-fold']);
		const w = new CircuitWriter('reversing-motor', `Power ${what} motor with a reversing switch`, supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(amps)}`);
		w.part('S1', 'type: switch, positions: { rest: ["X-G", "Y-G"], up: ["B-X", "Y-G"], down: ["B-Y", "X-G"] }');
		if (connector) w.part('C1', 'type: connector, cavities: 2');
		w.part('M1', `type: motor, amps: ${num(amps)}`);
		w.part('G1', 'type: ground');
		w.wire('B+', 'F1.1', { color: 'RD' });
		const feed = w.wire('F1.2', 'S1.B', { color: 'RD/WH' });
		let lx: string, ly: string;
		if (connector) {
			lx = w.wire('S1.X', 'C1.1a', { color: 'GN' });
			w.wire('C1.1b', 'M1.1', { color: 'GN' });
			ly = w.wire('S1.Y', 'C1.2a', { color: 'BU' });
			w.wire('C1.2b', 'M1.2', { color: 'BU' });
		} else {
			lx = w.wire('S1.X', 'M1.1', { color: 'GN', gauge_mm2: 1, length_m: 3 });
			ly = w.wire('S1.Y', 'M1.2', { color: 'BU', gauge_mm2: 1, length_m: 3 });
		}
		const gnd = w.wire('S1.G', 'G1', { color: rng.pick(GROUND_COLORS) });
		w.point('A', 'S1.B');
		w.point('B', 'M1.1');
		w.point('C', 'M1.2');
		w.point('D', 'S1.G');
		w.state('rest', 'S1: rest');
		w.state('up', 'S1: up');
		w.state('down', 'S1: down');
		const faults = [`open:${lx}`, `open:${ly}`, `open:${gnd}`, `open:${feed}`, 'open:M1', `high-resistance:G1:${hr}`, `short-to-ground:${lx}`, `high-resistance:${feed}:${hr}`];
		if (connector) faults.push('open:C1.1', `high-resistance:C1.2:${hr}`);
		return {
			params: { supply, amps, hr, connector, what },
			circuit: w.text(),
			title: `**Power ${what} motor with a reversing switch** (${supply} V battery; motor M1 rated ${amps} A; at rest the switch grounds both motor leads).`,
			states: { rest: 'the switch at rest', up: 'the switch held up', down: 'the switch held down' },
			work: 'up',
			rest: 'down',
			loads: ['M1'],
			faults,
			shared: null,
			drop: { from: 'D', to: 'GND', state: 'up', fault: `high-resistance:G1:${hr}`, words: 'across the switch’s ground' },
			watch: ['M1']
		};
	}
};
