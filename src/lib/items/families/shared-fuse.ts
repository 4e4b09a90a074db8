/**
 * Two or three lamps on one fuse and one switch, fed through a splice, each with its own ground:
 * a short to ground on one branch blows the shared fuse and takes out every lamp on it.
 */
import { CircuitWriter } from './builder';
import { GROUND_COLORS, REST_VOLTS, SWITCHED_COLORS, fuseFor, num, type Family } from './family';

export const sharedFuse: Family = {
	id: 'shared-fuse',
	title: 'Loads sharing a fuse',
	area: 'power-distribution',
	skills: { reading: 'shared-protection', status: 'fuse-faults', current: 'shared-protection', drop: 'voltage-drop', works: 'fuse-faults', claims: 'shared-protection' },
	variant(rng) {
		const supply = rng.pick(REST_VOLTS);
		const n = rng.pick([2, 2, 3]);
		const watts = Array.from({ length: n }, () => rng.pick([5, 10, 21, 27, 35, 55]));
		const total = watts.reduce((a, b) => a + b, 0) / supply;
		const hr = rng.pick([0.5, 1, 1.5, 2, 3]);
		const w = new CircuitWriter('shared-fuse', 'Lamps sharing one fuse', supply);
		w.part('F1', `type: fuse, amps: ${fuseFor(total)}`);
		w.part('S1', 'type: switch');
		w.part('SP1', 'type: splice');
		const lamps = watts.map((x, i) => w.part(`L${i + 1}`, `type: lamp, watts: ${num(x)}`));
		lamps.forEach((_, i) => w.part(`G${i + 1}`, 'type: ground'));
		w.wire('B+', 'F1.1', { color: 'RD' });
		const sw = w.wire('F1.2', 'S1.1', { color: 'RD/WH' });
		const trunk = w.wire('S1.2', 'SP1', { color: rng.pick(SWITCHED_COLORS) });
		const branches = lamps.map((l) => w.wire('SP1', `${l}.1`, { color: rng.pick(SWITCHED_COLORS), gauge_mm2: rng.pick([0.75, 1, 1.5]), length_m: rng.pick([1, 2, 3, 4]) }));
		const grounds = lamps.map((l, i) => w.wire(`${l}.2`, `G${i + 1}`, { color: rng.pick(GROUND_COLORS) }));
		w.point('A', 'S1.2');
		w.point('B', 'SP1');
		lamps.forEach((l, i) => w.point(String.fromCharCode(67 + i), `${l}.1`));
		w.point(String.fromCharCode(67 + n), 'L1.2');
		w.state('off', 'S1: open');
		w.state('on', 'S1: closed');
		const k = rng.int(n);
		const faults = [`short-to-ground:${branches[k]}`, `short-to-ground:${trunk}`, `open:${branches[k]}`, `open:${grounds[k]}`, `open:${trunk}`, `open:${lamps[k]}`, `high-resistance:${trunk}:${hr}`, `high-resistance:G1:${hr}`, `open:${sw}`];
		return {
			params: { supply, n, watts: watts.join('/'), hr, k },
			circuit: w.text(),
			title: `**${n} lamps on one fuse** (${supply} V battery; ${lamps.map((l, i) => `${l} ${watts[i]} W`).join(', ')}; fuse F1 ${fuseFor(total)} A).`,
			states: { off: 'switch S1 open', on: 'switch S1 closed' },
			work: 'on',
			rest: 'off',
			loads: lamps,
			faults,
			shared: [lamps[0], lamps[1]],
			drop: { from: 'A', to: `${lamps[0]}.1`, state: 'on', fault: `high-resistance:${trunk}:${hr}`, words: 'along the shared feed' },
			watch: [...lamps, 'F1'],
			currentPart: 'F1'
		};
	}
};
